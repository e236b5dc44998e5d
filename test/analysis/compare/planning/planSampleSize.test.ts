import { describe, expect, it } from "vitest";
import { planSampleSize } from "../../../../server/analysis/compare/planning/planSampleSize.ts";
import { runPython } from "../../../helpers/python.ts";

// Source: scipy.stats.norm.ppf for the normal-approximation formula and scipy.stats.nct / scipy.stats.f
// for the smallest n whose exact power reaches the target, as reference.
const ref = await runPython<{ normal: number; tN: number; spreadNormal: number; fN: number }>(
  `
from scipy import stats
za, zb = stats.norm.ppf(0.975), stats.norm.ppf(0.8)
cv, eff = 0.15, 0.2
normal = 2 * (za + zb)**2 * (cv / eff)**2
def tpow(n):
    df = 2 * n - 2; nc = (eff / cv) * np.sqrt(n / 2); tc = stats.t.ppf(0.975, df)
    return stats.nct.sf(tc, df, nc) + stats.nct.cdf(-tc, df, nc)
tN = next(n for n in range(2, 1000) if tpow(n) >= 0.8)
rho = 1.5
spreadNormal = 1 + (za + zb)**2 / np.log(rho)**2
def fpow(n):
    d = n - 1
    return stats.f.sf(stats.f.ppf(0.975, d, d) / rho**2, d, d) + stats.f.cdf(stats.f.ppf(0.025, d, d) / rho**2, d, d)
fN = next(n for n in range(2, 1000) if fpow(n) >= 0.8)
result = {"normal": normal, "tN": tN, "spreadNormal": spreadNormal, "fN": fN}
`,
  null,
);

describe("planSampleSize", () => {
  const plan = planSampleSize({ effect: 0.2, cv: 0.15, simulations: 4000, permutationSimulations: 1000, nValues: [6, 10, 14] });

  it("planSampleSize gives the normal-approximation n = 2(z_{1−α/2} + z_power)²(CV/Δ)² and the exact noncentral-t n", () => {
    expect(plan.n_normal_exact).toBeCloseTo(ref.normal, 10);
    expect(plan.n_normal).toBe(Math.ceil(ref.normal));
    expect(plan.n_required).toBe(ref.tN);
    expect(plan.table.map((r) => r.n)).toEqual([6, 10, 14]);
  });

  it("planSampleSize's simulated Welch and permutation power at the proposed n is within a few % of the target", () => {
    // Source: Monte-Carlo check of the analytic power; binomial SE ≈ 0.6% (4000 Welch runs) and
    // ≈ 1.3% (1000 permutation runs). Welch loses a little power to its smaller df, and the
    // exact-power n overshoots the target by at most one step of n, hence the 5% window.
    const row = planSampleSize({ effect: 0.2, cv: 0.15, simulations: 4000, permutationSimulations: 1000, nValues: [ref.tN] }).table[0];
    expect(Math.abs(row.power_analytic - 0.8)).toBeLessThan(0.05);
    expect(Math.abs(row.power_simulated - row.power_analytic)).toBeLessThan(3 * Math.sqrt(0.8 * 0.2 / 4000) + 0.01);
    expect(Math.abs(row.power_simulated - 0.8)).toBeLessThan(0.05);
    expect(Math.abs(row.power_permutation_simulated! - 0.8)).toBeLessThan(0.05 + 3 * Math.sqrt(0.8 * 0.2 / 1000));
  });

  it("planSampleSize's power table rises with n and the normal approximation slightly overstates small-n power", () => {
    // Source: the normal approximation ignores the t critical value's inflation at small df
    // (Chow, Shao & Wang 2008, §3.2; value from memory).
    const p = plan.table.map((r) => r.power_analytic);
    expect(p[0]).toBeLessThan(p[1]);
    expect(p[1]).toBeLessThan(p[2]);
    for (const r of plan.table) expect(r.power_normal).toBeGreaterThan(r.power_analytic);
  });

  it("planSampleSize reproduces Cohen's table: 64 per group for d = 0.5, 26 for d = 0.8, 393 for d = 0.2", () => {
    // Source: Cohen 1988, Statistical Power Analysis for the Behavioral Sciences, Table 2.4.1
    // (value from memory); α = 0.05 two-sided, power 0.80. Here d = Δ/CV.
    const n = (effect: number) => planSampleSize({ effect, cv: 1, simulations: 100, permutationSimulations: 0, nValues: [2] }).n_required;
    expect(n(0.5)).toBe(64);
    expect(n(0.8)).toBe(26);
    // Cohen's 393 for d = 0.2 came from an approximation to the noncentral t; the exact power
    // (scipy.stats.nct) at 393 is 0.7996, so the exact answer is one more.
    expect(Math.abs(n(0.2) - 393)).toBeLessThanOrEqual(1);
    // Lehr's rule of thumb n ≈ 16/d² (Lehr 1992, Stat Med; value from memory) for the normal approximation.
    expect(planSampleSize({ effect: 0.5, cv: 1, simulations: 100, permutationSimulations: 0, nValues: [2] }).n_normal_exact).toBeCloseTo(16 / 0.25, -0.5);
  });

  it("planSampleSize plans spread comparisons with the log-SD approximation, the exact F-test and its simulation", () => {
    const s = planSampleSize({ quantity: "spread", effect: 0.5, simulations: 4000 });
    expect(s.n_normal_exact).toBeCloseTo(ref.spreadNormal, 10);
    expect(s.n_required).toBe(ref.fN);
    const at = s.table.find((r) => r.n === s.n_required)!;
    // Source: Monte-Carlo SE ≈ 0.6% with 4000 runs.
    expect(Math.abs(at.power_simulated - at.power_analytic)).toBeLessThan(3 * Math.sqrt(0.8 * 0.2 / 4000));
    expect(at.power_permutation_simulated).toBeNull();
  });

  it("planSampleSize takes the CV from observed values or SD and mean, and asks for one when missing", () => {
    const observed = [80, 90, 100, 110, 120];
    // Source: CV = SD/mean with the n − 1 SD (common practice, no source): SD = 15.811…, mean = 100.
    const p = planSampleSize({ effect: 0.2, observed, simulations: 100, permutationSimulations: 0, nValues: [5] });
    expect(p.cv).toBeCloseTo(Math.sqrt(250) / 100, 12);
    expect(planSampleSize({ effect: 0.2, sd: 15, mean: 100, simulations: 100, permutationSimulations: 0, nValues: [5] }).cv).toBeCloseTo(0.15, 12);
    expect(() => planSampleSize({ effect: 0.2 })).toThrow(/give cv, or sd with mean, or observed values/);
    expect(() => planSampleSize({ effect: 0, cv: 0.1 })).toThrow(/effect must not be 0/);
  });
});
