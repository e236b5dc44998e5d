# Reference for the import benchmark: read a long CSV (embryo, genotype, position,
# intensity) with the csv module into numpy arrays, as a notebook would.
import csv, sys
import numpy as np

labels, genotypes, xs, ys = [], [], [], []
with open(sys.argv[1], newline="", encoding="utf-8") as f:
    reader = csv.reader(f)
    next(reader)
    for embryo, genotype, x, y in reader:
        labels.append(embryo); genotypes.append(genotype); xs.append(float(x)); ys.append(float(y))
positions = np.array(xs)
intensities = np.array(ys)
embryos = np.unique(np.array(labels))
print(len(embryos), positions.size)
