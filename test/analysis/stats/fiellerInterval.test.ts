import { describe, expect, it } from "vitest";
import { fiellerInterval } from "../../../server/analysis/stats/fiellerInterval.ts";
import { welchTTest } from "../../../server/analysis/stats/welchTTest.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython, relativeDifference } from "../../helpers/python.ts";

describe("fiellerInterval", () => {
  it("fiellerInterval's endpoints are the ratios ρ at which scipy's Welch test of a against ρ·b gives p = 0.05", async () => {
    const a = [88.1, 92.4, 79.5, 101.2, 95.0, 84.7, 90.3];
    const b = [101.5, 110.2, 97.8, 105.0, 99.1, 112.6];
    // Source: Fieller 1954, J R Stat Soc B — the interval is the set of ρ where μa − ρμb = 0 is not
    // rejected; scipy.stats.ttest_ind(a, ρ·b, equal_var=False) is that test with Welch's df, and
    // scipy.optimize.brentq finds where its p crosses 1 − level.
    const ref = await runPython<{ ci95: [number, number]; ci80: [number, number] }>(
      `
from scipy import stats, optimize
a, b = np.array(data["a"]), np.array(data["b"])
r = a.mean() / b.mean()
def ends(level):
    f = lambda rho: stats.ttest_ind(a, rho * b, equal_var=False).pvalue - (1 - level)
    return [optimize.brentq(f, r * 0.3, r, xtol=1e-14), optimize.brentq(f, r, r * 3, xtol=1e-14)]
result = {"ci95": ends(0.95), "ci80": ends(0.80)}
`,
      { a, b },
    );
    const f95 = fiellerInterval(a, b, 0.95);
    const f80 = fiellerInterval(a, b, 0.8);
    expect(f95.value).toBeCloseTo(a.reduce((s, v) => s + v) / 7 / (b.reduce((s, v) => s + v) / 6), 12);
    for (let i = 0; i < 2; i++) {
      expect(relativeDifference(f95.interval![i], ref.ci95[i])).toBeLessThan(1e-9);
      expect(relativeDifference(f80.interval![i], ref.ci80[i])).toBeLessThan(1e-9);
    }
  });

  it("fiellerInterval excludes 1 exactly when Welch's p is below 0.05, over 400 seeded experiments", () => {
    // Source: Fieller 1954 with Welch 1947 — at ρ = 1 the pivot is Welch's t with Welch's df.
    const rng = createRandom(91);
    let disagreements = 0;
    for (let r = 0; r < 400; r++) {
      const a = Array.from({ length: 6 + (r % 5) }, () => 100 + 14 * rng.normal());
      const b = Array.from({ length: 6 + (r % 3) }, () => 90 + 9 * rng.normal());
      const ci = fiellerInterval(a, b, 0.95).interval!;
      const p = welchTTest(a, b).p;
      if ((ci[0] > 1 || ci[1] < 1) !== p < 0.05) disagreements++;
    }
    expect(disagreements).toBe(0);
  });

  it("fiellerInterval gives no interval when the second mean is not clearly different from 0", () => {
    // Source: Fieller 1954 — the confidence set is unbounded when the denominator's t is below the quantile.
    const f = fiellerInterval([5, 6, 7, 5.5], [0.5, -1.2, 1.4, 0.3], 0.95);
    expect(f.interval).toBeNull();
    expect(f.reason).toMatch(/not clearly different from 0/);
  });
});
