import { describe, expect, it } from "vitest";
import { welchInterval } from "../../../server/analysis/stats/welchInterval.ts";
import { welchTTest } from "../../../server/analysis/stats/welchTTest.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython, relativeDifference } from "../../helpers/python.ts";

describe("welchInterval", () => {
  it("welchInterval equals scipy's Welch confidence interval at 95% and 90%, for unequal group sizes", async () => {
    const a = [88.1, 92.4, 79.5, 101.2, 95.0, 84.7, 90.3];
    const b = [101.5, 110.2, 97.8, 105.0, 99.1, 112.6];
    // Source: scipy.stats.ttest_ind(a, b, equal_var=False).confidence_interval(level), and the same
    // from scipy.stats.t.ppf with the Welch–Satterthwaite df, as outside references.
    const ref = await runPython<{ ci95: [number, number]; ci90: [number, number]; manual: [number, number] }>(
      `
from scipy import stats
a, b = np.array(data["a"]), np.array(data["b"])
r = stats.ttest_ind(a, b, equal_var=False)
va, vb = a.var(ddof=1) / len(a), b.var(ddof=1) / len(b)
df = (va + vb) ** 2 / (va ** 2 / (len(a) - 1) + vb ** 2 / (len(b) - 1))
q = stats.t.ppf(0.975, df)
d = a.mean() - b.mean()
result = {"ci95": list(r.confidence_interval(0.95)), "ci90": list(r.confidence_interval(0.90)), "manual": [d - q * np.sqrt(va + vb), d + q * np.sqrt(va + vb)]}
`,
      { a, b },
    );
    const c95 = welchInterval(a, b, 0.95);
    const c90 = welchInterval(a, b, 0.9);
    for (let i = 0; i < 2; i++) {
      expect(relativeDifference(c95[i], ref.ci95[i])).toBeLessThan(1e-10);
      expect(relativeDifference(c95[i], ref.manual[i])).toBeLessThan(1e-10);
      expect(relativeDifference(c90[i], ref.ci90[i])).toBeLessThan(1e-10);
    }
  });

  it("welchInterval excludes 0 exactly when Welch's p is below 0.05, over 400 seeded 7-vs-7 experiments", () => {
    // Source: Welch 1947, Biometrika — the interval is the inversion of the test, so the two must agree.
    const rng = createRandom(77);
    let disagreements = 0;
    let significant = 0;
    for (let r = 0; r < 400; r++) {
      const a = Array.from({ length: 7 }, () => 100 + 15 * rng.normal());
      const b = Array.from({ length: 7 }, () => 88 + 10 * rng.normal());
      const [lo, hi] = welchInterval(a, b, 0.95);
      const p = welchTTest(a, b).p;
      if (p < 0.05) significant++;
      if ((lo > 0 || hi < 0) !== p < 0.05) disagreements++;
    }
    expect(significant).toBeGreaterThan(40);
    expect(significant).toBeLessThan(360);
    expect(disagreements).toBe(0);
  });
});
