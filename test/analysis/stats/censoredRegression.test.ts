import { describe, expect, it } from "vitest";
import { censoredRegression, type CensoredPoint } from "../../../server/analysis/stats/censoredRegression.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython, relativeDifference } from "../../helpers/python.ts";

const rng = createRandom(58);
const truth = (t: number) => 40 + 60 * t;
const latent = Array.from({ length: 45 }, (_, i) => {
  const t = Math.log([0.5, 1, 2][i % 3]);
  return { t, y: truth(t) + 25 * rng.normal() };
});
// Left-censored below 0 µm, right-censored above 100 µm (a measured span of 0–100).
const censored: CensoredPoint[] = latent.map((p) => (p.y < 0 ? { t: p.t, y: 0, kind: "below" } : p.y > 100 ? { t: p.t, y: 100, kind: "above" } : { ...p, kind: "observed" }));

describe("censoredRegression", () => {
  it("censoredRegression maximises the censored-normal likelihood as scipy does on the same data", async () => {
    expect(censored.filter((p) => p.kind === "below").length).toBeGreaterThan(2);
    expect(censored.filter((p) => p.kind === "above").length).toBeGreaterThan(2);
    // Source: Tobin 1958, Econometrica — the censored-normal log-likelihood, written out with
    // scipy.stats.norm.logpdf/logcdf/logsf and maximised by scipy.optimize.minimize (BFGS, then Nelder–Mead polish).
    const ref = await runPython<{ a: number; b: number; sigma: number; ll: number }>(
      `
from scipy import stats, optimize
t = np.array([p["t"] for p in data]); y = np.array([p["y"] for p in data]); k = [p["kind"] for p in data]
obs = np.array([x == "observed" for x in k]); lo = np.array([x == "below" for x in k]); hi = np.array([x == "above" for x in k])
def nll(th):
    a, b, ls = th; s = np.exp(ls); mu = a + b * t
    return -(stats.norm.logpdf(y[obs], mu[obs], s).sum() + stats.norm.logcdf((y[lo] - mu[lo]) / s).sum() + stats.norm.logsf((y[hi] - mu[hi]) / s).sum())
r = optimize.minimize(nll, [50.0, 50.0, np.log(20.0)], method="BFGS", options={"gtol": 1e-10})
r = optimize.minimize(nll, r.x, method="Nelder-Mead", options={"xatol": 1e-10, "fatol": 1e-13, "maxiter": 20000})
result = {"a": float(r.x[0]), "b": float(r.x[1]), "sigma": float(np.exp(r.x[2])), "ll": float(-r.fun)}
`,
      censored,
    );
    const f = censoredRegression(censored);
    expect(f.converged).toBe(true);
    expect(relativeDifference(f.intercept, ref.a)).toBeLessThan(1e-6);
    expect(relativeDifference(f.slope, ref.b)).toBeLessThan(1e-6);
    expect(relativeDifference(f.sigma, ref.sigma)).toBeLessThan(1e-6);
    expect(f.logLikelihood).toBeGreaterThanOrEqual(ref.ll - 1e-8);
  });

  it("censoredRegression equals least squares, standard errors included, when nothing is censored", async () => {
    // Source: scipy.stats.linregress (slope, intercept and their standard errors) on the same data.
    const ref = await runPython<{ slope: number; intercept: number; se: number; ise: number }>(
      `
from scipy import stats
r = stats.linregress([p["t"] for p in data], [p["y"] for p in data])
result = {"slope": r.slope, "intercept": r.intercept, "se": r.stderr, "ise": r.intercept_stderr}
`,
      latent,
    );
    const f = censoredRegression(latent.map((p) => ({ ...p, kind: "observed" as const })));
    expect(relativeDifference(f.slope, ref.slope)).toBeLessThan(1e-9);
    expect(relativeDifference(f.intercept, ref.intercept)).toBeLessThan(1e-9);
    expect(relativeDifference(Math.sqrt(f.covariance[1][1]), ref.se)).toBeLessThan(1e-9);
    expect(relativeDifference(Math.sqrt(f.covariance[0][0]), ref.ise)).toBeLessThan(1e-9);
  });
});
