# Reference for the end-to-end benchmark: what a notebook user would write instead.
# Read a long CSV (embryo, genotype, position, intensity) with the csv module,
# then fit A*exp(-x/lambda) + B to each embryo with scipy's curve_fit.
import csv, json, sys, time
import numpy as np
from scipy.optimize import curve_fit

def model(x, a, lam, b):
    return a * np.exp(-x / lam) + b

t0 = time.perf_counter()
rows = {}
with open(sys.argv[1], newline="", encoding="utf-8") as f:
    reader = csv.reader(f)
    header = next(reader)
    for embryo, genotype, x, y in reader:
        xs, ys = rows.setdefault(embryo, ([], []))
        xs.append(float(x)); ys.append(float(y))
t_read = time.perf_counter()
lambdas = {}
for embryo, (xs, ys) in rows.items():
    x = np.array(xs); y = np.array(ys)
    b0 = y[-20:].mean(); a0 = y[:5].mean() - b0
    try:
        popt, pcov = curve_fit(model, x, y, p0=[a0, (x[-1] - x[0]) / 5, b0], maxfev=10000)
        lambdas[embryo] = [float(popt[1]), float(np.sqrt(pcov[1, 1]))]
    except RuntimeError:
        lambdas[embryo] = None
with open(sys.argv[2], "w") as out:
    json.dump(lambdas, out)
t_end = time.perf_counter()
print(json.dumps({"read_s": t_read - t0, "fit_s": t_end - t_read, "embryos": len(rows)}))
