import { describe, expect, it } from "vitest";
import { contrastMeans } from "../../../server/analysis/compare/contrastMeans.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython, relativeDifference } from "../../helpers/python.ts";

describe("contrastMeans", () => {
  it("contrastMeans' bootstrap CI of the λ ratio covers the true ratio in 93–97% of 500 simulated experiments", () => {
    // Source: Efron & Tibshirani 1993, An Introduction to the Bootstrap, ch. 14 — BCa intervals are
    // second-order accurate, so nominal 95% should hold closely for 30 embryos per group.
    // Two groups of 30 embryos, λ = 100 and 80 µm, embryo-to-embryo CV 15% (normal).
    // B = 1000 BCa resamples per experiment: the Monte-Carlo error of an endpoint is then ≈ 0.04 SE
    // (SD of a 2.5% quantile, √(α(1−α)/B)/φ(1.96)), which moves coverage by well under 1%,
    // while the binomial SE of a 500-experiment coverage estimate is ≈ 1%.
    const rng = createRandom(2718);
    const trueRatio = 100 / 80;
    const reps = 500;
    let covered = 0;
    for (let r = 0; r < reps; r++) {
      const a = Array.from({ length: 30 }, () => 100 * (1 + 0.15 * rng.normal()));
      const b = Array.from({ length: 30 }, () => 80 * (1 + 0.15 * rng.normal()));
      const c = contrastMeans(a, b, {
        bootstrap: 1000, permutations: 99, level: 0.95, interval: "bca",
        seeds: { difference: 3 * r + 1, ratio: 3 * r + 2, permutation: 3 * r + 3 },
      });
      const [lo, hi] = c.ratio!.ci95!;
      if (lo <= trueRatio && trueRatio <= hi) covered++;
    }
    const coverage = covered / reps;
    expect(coverage).toBeGreaterThanOrEqual(0.93);
    expect(coverage).toBeLessThanOrEqual(0.97);
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
