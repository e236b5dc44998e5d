import { levenbergMarquardt } from "ml-levenberg-marquardt";
import { describe, expect, it } from "vitest";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";
import { fitProfile, type FitResult, type ProfileFit } from "../../../server/analysis/fit/fitProfile.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { relativeDifference, runPython } from "../../helpers/python.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

function expectFitted(result: FitResult): ProfileFit {
  if (!result.ok) throw new Error(`expected a fit, got ${result.status}: ${result.message}`);
  return result;
}

interface Case {
  name: "exponential" | "finite" | "power";
  x: number[];
  y: number[];
  lengthUm?: number;
  p0: number[];
  sigma?: number[];
}

const random = createRandom(424242);
const x = positions(0, 350, 175);
const cases: Case[] = [
  { name: "exponential", x, y: simulateProfile("exponential", x, [62], 140, 18, { noiseSd: 3, random }), p0: [120, 50, 20] },
  { name: "finite", x, y: simulateProfile("finite", x, [160], 90, 12, { lengthUm: 350, noiseSd: 2, random }), lengthUm: 350, p0: [80, 120, 10] },
  { name: "power", x, y: simulateProfile("power", x, [30], 200, 9, { noiseSd: 2.5, random }), p0: [150, 25, 10] },
];
const weightedY = simulateProfile("exponential", x, [62], 140, 18).map((v, i) => v + Math.sqrt(1 + 0.05 * v) * random.normal());
const weightedVariance = weightedY.map((v) => 1 + 0.05 * Math.max(v, 0));
cases.push({ name: "exponential", x, y: weightedY, p0: [120, 50, 20], sigma: weightedVariance.map(Math.sqrt) });

// Source: scipy.optimize.curve_fit (Levenberg–Marquardt, MINPACK) as reference on identical data,
// analytic Jacobian, tolerances at their tightest; parameters [A, λ or x0, B], covariance scaled by s².
const reference = await runPython<{ popt: number[]; perr: number[] }[]>(
  `
from scipy.optimize import curve_fit
def shapes(name, L):
    if name == "exponential":
        g = lambda x, l: np.exp(-x / l)
        dg = lambda x, l: x / l**2 * np.exp(-x / l)
    elif name == "finite":
        g = lambda x, l: np.cosh((L - x) / l) / np.cosh(L / l)
        dg = lambda x, l: ((x - L) * np.sinh((L - x) / l) / np.cosh(L / l) + L * np.cosh((L - x) / l) * np.sinh(L / l) / np.cosh(L / l)**2) / l**2
    else:
        g = lambda x, x0: (1 + x / x0) ** -2
        dg = lambda x, x0: 2 * x / x0**2 * (1 + x / x0) ** -3
    return g, dg
result = []
for c in data:
    x = np.array(c["x"]); y = np.array(c["y"])
    g, dg = shapes(c["name"], c.get("lengthUm"))
    f = lambda x, A, l, B: A * g(x, l) + B
    jac = lambda x, A, l, B: np.stack([g(x, l), A * dg(x, l), np.ones_like(x)], axis=1)
    sigma = np.array(c["sigma"]) if c.get("sigma") else None
    popt, pcov = curve_fit(f, x, y, p0=c["p0"], jac=jac, sigma=sigma, method="lm", xtol=1e-15, ftol=1e-15, gtol=1e-15, maxfev=100000)
    result.append({"popt": popt, "perr": np.sqrt(np.diag(pcov))})
`,
  cases,
);

describe("fitProfile against scipy.optimize.curve_fit on the same data", () => {
  cases.forEach((c, k) => {
    it(`${c.name}${c.sigma ? " with inverse-variance weights" : ""}: λ to 1e-6 and every SE to 1e-3 relative`, () => {
      const options = FitOptions.parse({ model: c.name, weights: c.sigma ? "inverse-variance" : "none", errorModel: "classic" });
      const fit = expectFitted(fitProfile(c.x, c.y, options, { lengthUm: c.lengthUm, variance: c.sigma?.map((s) => s * s) }));
      expect(fit.status).toBe("converged");
      const scale = c.name === "power" ? "x0Um" : "lambdaUm";
      const ref = reference[k];
      expect(relativeDifference(fit.parameters[scale].value, ref.popt[1])).toBeLessThan(1e-6);
      expect(relativeDifference(fit.parameters.amplitude.value, ref.popt[0])).toBeLessThan(1e-6);
      expect(relativeDifference(fit.parameters.background.value, ref.popt[2])).toBeLessThan(1e-6);
      expect(relativeDifference(fit.parameters.amplitude.se!, ref.perr[0])).toBeLessThan(1e-3);
      expect(relativeDifference(fit.parameters[scale].se!, ref.perr[1])).toBeLessThan(1e-3);
      expect(relativeDifference(fit.parameters.background.se!, ref.perr[2])).toBeLessThan(1e-3);
    });
  });
});

describe("fitProfile with a robust loss against scipy.optimize.least_squares", () => {
  it("soft-l1 and huber fits with outliers agree with least_squares(loss=…, f_scale=…) to 1e-6", async () => {
    // Source: scipy.optimize.least_squares as reference; iteratively reweighted least squares
    // converges to the same M-estimate (Holland & Welsch 1977).
    const outlierRandom = createRandom(99);
    const y = simulateProfile("exponential", x, [62], 140, 18, { noiseSd: 3, random: outlierRandom });
    for (const i of [7, 40, 41, 90, 150]) y[i] += 60;
    const fScale = 4;
    const ref = await runPython<Record<string, number[]>>(
      `
from scipy.optimize import least_squares
x = np.array(data["x"]); y = np.array(data["y"])
def res(p): return p[0] * np.exp(-x / p[1]) + p[2] - y
def jac(p):
    e = np.exp(-x / p[1]); return np.stack([e, p[0] * x / p[1]**2 * e, np.ones_like(x)], axis=1)
result = {}
for loss in ["soft_l1", "huber"]:
    r = least_squares(res, [120, 50, 20], jac=jac, loss=loss, f_scale=data["f"], xtol=1e-15, ftol=1e-15, gtol=1e-15, max_nfev=10000)
    result[loss] = r.x
`,
      { x, y, f: fScale },
    );
    for (const [loss, key] of [["soft-l1", "soft_l1"], ["huber", "huber"]] as const) {
      const fit = expectFitted(fitProfile(x, y, FitOptions.parse({ weights: "none", robust: { loss, scale: fScale }, maxReweightings: 500 })));
      expect(fit.status).toBe("converged");
      expect(relativeDifference(fit.parameters.lambdaUm.value, ref[key][1])).toBeLessThan(1e-6);
      expect(relativeDifference(fit.parameters.amplitude.value, ref[key][0])).toBeLessThan(1e-6);
    }
    // The outliers pull an ordinary fit further from the truth than the robust one.
    const plain = expectFitted(fitProfile(x, y, FitOptions.parse({ weights: "none" })));
    const robust = expectFitted(fitProfile(x, y, FitOptions.parse({ weights: "none", robust: { loss: "soft-l1" } })));
    expect(Math.abs(robust.parameters.lambdaUm.value - 62)).toBeLessThan(Math.abs(plain.parameters.lambdaUm.value - 62));
  });
});

describe("fitProfile against ml-levenberg-marquardt", () => {
  it("finds the same exponential fit (λ to 1e-6) as an independent finite-difference Levenberg–Marquardt", () => {
    // Source: ml-levenberg-marquardt 5.1 as an independent implementation (central differences,
    // relative step 1e-6, λ bounded below by 1 µm).
    const r = createRandom(5);
    const xs = positions(0, 300, 150);
    const y = simulateProfile("exponential", xs, [50], 100, 10, { noiseSd: 1, random: r });
    const init = [90, 40, 12];
    const other = levenbergMarquardt({ x: xs, y }, ([A, l, B]) => (t: number) => A * Math.exp(-t / l) + B, {
      initialValues: init,
      minValues: [-1e9, 1, -1e9],
      maxValues: [1e9, 1e5, 1e9],
      gradientDifference: init.map((v) => 1e-6 * Math.abs(v)),
      centralDifference: true,
      maxIterations: 10,
      errorTolerance: 1e-12,
      damping: 1e-3,
    });
    const fit = expectFitted(fitProfile(xs, y, FitOptions.parse({ weights: "none" })));
    expect(relativeDifference(fit.parameters.lambdaUm.value, other.parameterValues[1])).toBeLessThan(1e-6);
    expect(relativeDifference(fit.rss, other.parameterError)).toBeLessThan(1e-9);
  });
});
