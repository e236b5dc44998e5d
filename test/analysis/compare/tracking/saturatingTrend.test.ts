import { describe, expect, it } from "vitest";
import { fitSaturatingTrend } from "../../../../server/analysis/compare/tracking/saturatingTrend.ts";
import { createRandom } from "../../../../server/analysis/random/seededRandom.ts";
import { runPython, relativeDifference } from "../../../helpers/python.ts";

/** y = y∞ − (y∞ − y0)·e^(−t/τ) sampled at n times over [t0, t1] with Gaussian noise. */
function simulate(seed: number, n: number, t0: number, t1: number, yInf: number, y0: number, tau: number, sd: number) {
  const r = createRandom(seed);
  const t = Array.from({ length: n }, (_, i) => t0 + ((t1 - t0) * i) / (n - 1));
  const y = t.map((v) => yInf - (yInf - y0) * Math.exp(-v / tau) + sd * r.normal());
  return { t, y };
}

const data = simulate(1, 40, 0, 7200, 110, 45, 1500, 4);
// Source: scipy.optimize.curve_fit (covariance s²(JᵀJ)⁻¹, absolute_sigma=False) as reference,
// with tolerances tightened so that its optimum is resolved beyond the checked digits.
const ref = await runPython<{ p: number[]; se: number[] }>(
  `
from scipy.optimize import curve_fit
f = lambda t, yinf, y0, tau: yinf - (yinf - y0) * np.exp(-t / tau)
p, cov = curve_fit(f, np.array(data["t"]), np.array(data["y"]), p0=[100, 50, 1000], ftol=1e-15, xtol=1e-15, gtol=1e-15, maxfev=20000)
result = {"p": p, "se": np.sqrt(np.diag(cov))}
`,
  data,
);

describe("fitSaturatingTrend", () => {
  it("fitSaturatingTrend matches scipy.optimize.curve_fit in parameters and standard errors", () => {
    const f = fitSaturatingTrend(data.t, data.y);
    expect(f.converged).toBe(true);
    const ours = [f.yInf!, f.y0!, f.tau!];
    ours.forEach((e, i) => {
      expect(relativeDifference(e.value, ref.p[i])).toBeLessThan(1e-6);
      expect(relativeDifference(e.se!, ref.se[i])).toBeLessThan(1e-4);
    });
  });

  it("fitSaturatingTrend recovers known (y∞, y0, τ) within their 95% CIs in ≥ 90% of 200 noisy replicates", () => {
    // Source: Seber & Wild 1989, Nonlinear Regression — Wald CIs from s²(JᵀJ)⁻¹ are close to nominal
    // when curvature is small (40 points, noise 4% of the rise). Binomial SE of 200 replicates ≈ 1.5%.
    const truth = [110, 45, 1500];
    const hits = [0, 0, 0];
    for (let s = 0; s < 200; s++) {
      const d = simulate(100 + s, 40, 0, 7200, truth[0], truth[1], truth[2], 4);
      const f = fitSaturatingTrend(d.t, d.y);
      [f.yInf!, f.y0!, f.tau!].forEach((e, i) => {
        if (e.ci95![0] <= truth[i] && truth[i] <= e.ci95![1]) hits[i]++;
      });
    }
    for (const h of hits) expect(h / 200).toBeGreaterThanOrEqual(0.9);
  });

  it("fitSaturatingTrend reports y0 at a chosen time origin, invariant in y∞ and τ", () => {
    // Source: the model family is closed under time shifts: y0(t0) = y∞ − (y∞ − y0)·e^(−t0/τ).
    const shifted = { t: data.t.map((v) => v + 3000), y: data.y };
    const f = fitSaturatingTrend(shifted.t, shifted.y, { timeOrigin: 3000 });
    expect(relativeDifference(f.tau!.value, ref.p[2])).toBeLessThan(1e-6);
    expect(relativeDifference(f.y0!.value, ref.p[1])).toBeLessThan(1e-6);
    expect(relativeDifference(f.y0!.se!, ref.se[1])).toBeLessThan(1e-4);
  });

  it("fitSaturatingTrend says so when data show no saturation or too few points", () => {
    // common practice, no source: a straight line has its best τ at the upper search limit.
    const line = Array.from({ length: 20 }, (_, i) => i * 100);
    const f = fitSaturatingTrend(line, line.map((v) => 10 + 0.01 * v));
    expect(f.converged).toBe(false);
    expect(f.reason).toMatch(/no saturation is visible/);
    expect(fitSaturatingTrend([0, 1, 2], [1, 2, 3]).reason).toMatch(/at least 4 points, got 3/);
  });
});
