import { describe, expect, it } from "vitest";
import { contrastMeans } from "../../../server/analysis/compare/contrastMeans.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { welchInterval } from "../../../server/analysis/stats/welchInterval.ts";
import { runPython, relativeDifference } from "../../helpers/python.ts";
import { contrastCoverage } from "../../validate/contrastSimulation.ts";
import { coverageBand } from "../../validate/validateScale.ts";

describe("contrastMeans", () => {
  it("contrastMeans' headline intervals cover the true difference and ratio in the 93–97% band at 6, 10 and 30 embryos per group", () => {
    // Source: Welch 1947, Biometrika and Fieller 1954, J R Stat Soc B — both intervals hold their level
    // for normal values at any n. Bounded run: 1000 seeded experiments per n (binomial SE 0.7%), band
    // ±3 SE around 95% (coverageBand); the full run with 5000 per n is in test/validate/.
    const reps = 1000;
    const [low, high] = coverageBand(reps);
    for (const n of [6, 10, 30]) {
      const c = contrastCoverage({ n, meanA: 100, meanB: 80, cvA: 0.12, cvB: 0.25, shape: "normal" }, reps, 4000 + n);
      expect(c.difference, `difference at n = ${n}`).toBeGreaterThanOrEqual(low);
      expect(c.difference, `difference at n = ${n}`).toBeLessThanOrEqual(high);
      expect(c.ratio, `ratio at n = ${n}`).toBeGreaterThanOrEqual(low);
      expect(c.ratio, `ratio at n = ${n}`).toBeLessThanOrEqual(high);
    }
  });

  it("contrastMeans shows Welch and Fieller intervals as the headline, the bootstrap as a labelled second opinion, and they agree with Welch's p", () => {
    // Source: Welch 1947 / Fieller 1954 — both intervals invert Welch's test; a difference CI excluding 0
    // while Welch p = 0.10 must be impossible. 300 seeded 7-vs-7 experiments near the decision boundary.
    const rng = createRandom(707);
    let mismatch = 0;
    for (let r = 0; r < 300; r++) {
      const a = Array.from({ length: 7 }, () => 100 * (1 + 0.12 * rng.normal()));
      const b = Array.from({ length: 7 }, () => 90 * (1 + 0.15 * rng.normal()));
      const c = contrastMeans(a, b, { bootstrap: 200, permutations: 99, level: 0.95, interval: "bca", seeds: { difference: r, ratio: r + 1, permutation: r + 2 } });
      const excludesZero = c.difference.ci95![0] > 0 || c.difference.ci95![1] < 0;
      const excludesOne = c.ratio!.ci95![0] > 1 || c.ratio!.ci95![1] < 1;
      if (excludesZero !== c.p_welch < 0.05 || excludesOne !== c.p_welch < 0.05) mismatch++;
      if (r === 0) {
        expect(c.difference.interval_method).toMatch(/Welch t/);
        expect(c.ratio!.interval_method).toMatch(/Fieller/);
        expect(c.difference.bootstrap_method).toMatch(/BCa bootstrap.*second opinion/);
        expect(c.difference.bootstrap_ci95).not.toBeNull();
        expect(c.difference.ci95).toEqual(welchInterval(a, b, 0.95));
      }
    }
    expect(mismatch).toBe(0);
  });

  it("contrastMeans reports Welch's t and df as scipy does and Hedges' g with the sign of a − b", async () => {
    const a = [88.1, 92.4, 79.5, 101.2, 95.0, 84.7, 90.3];
    const b = [101.5, 110.2, 97.8, 105.0, 99.1, 112.6];
    // Source: scipy.stats.ttest_ind(equal_var=False) as reference.
    const ref = await runPython<{ t: number; df: number }>(
      `
from scipy import stats
r = stats.ttest_ind(data["a"], data["b"], equal_var=False)
result = {"t": float(r.statistic), "df": float(r.df)}
`,
      { a, b },
    );
    const c = contrastMeans(a, b, { bootstrap: 500, permutations: 999, level: 0.95, interval: "percentile", seeds: { difference: 1, ratio: 2, permutation: 3 } });
    expect(relativeDifference(c.t_welch, ref.t)).toBeLessThan(1e-10);
    expect(relativeDifference(c.df_welch, ref.df)).toBeLessThan(1e-10);
    expect(c.effect_size.value).toBeLessThan(0);
    expect(c.difference.ci95![1]).toBeLessThan(0);
    expect(c.ratio!.ci95![1]).toBeLessThan(1);
  });

  it("contrastMeans needs two embryos per group", () => {
    expect(() => contrastMeans([1], [2, 3], { bootstrap: 100, permutations: 99, level: 0.95, interval: "bca", seeds: { difference: 1, ratio: 2, permutation: 3 } }))
      .toThrow(/at least 2 embryos, got 1 and 2/);
  });
});
