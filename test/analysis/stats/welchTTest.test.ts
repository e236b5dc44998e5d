import { describe, expect, it } from "vitest";
import { welchTTest } from "../../../server/analysis/stats/welchTTest.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython, relativeDifference } from "../../helpers/python.ts";

const random = createRandom(41);
const draw = (n: number, mu: number, sd: number) => Array.from({ length: n }, () => mu + sd * random.normal());
const cases: [number[], number[]][] = [
  [draw(8, 40, 4), draw(13, 46, 9)],
  [draw(25, 60, 6), draw(6, 58, 2)],
  [draw(3, 10, 1), draw(30, 10.2, 3)],
  [[1, 2, 3, 4, 5], [2, 4, 6, 8, 10, 12]],
  [draw(40, 100, 10), draw(40, 130, 10)],
];

// Source: scipy.stats.ttest_ind(a, b, equal_var=False) as reference on identical arrays.
const reference = await runPython<{ t: number; df: number; p: number }[]>(
  `
from scipy import stats
result = []
for a, b in data:
    r = stats.ttest_ind(a, b, equal_var=False)
    result.append({"t": float(r.statistic), "df": float(r.df), "p": float(r.pvalue)})
`,
  cases,
);

describe("welchTTest", () => {
  it("welchTTest matches scipy.stats.ttest_ind(equal_var=False) in t, df and p to 1e-10", () => {
    cases.forEach(([a, b], i) => {
      const r = welchTTest(a, b);
      expect(relativeDifference(r.t, reference[i].t)).toBeLessThan(1e-10);
      expect(relativeDifference(r.df, reference[i].df)).toBeLessThan(1e-10);
      expect(relativeDifference(r.p, reference[i].p)).toBeLessThan(1e-10);
    });
  });

  it("welchTTest reports a zero-variance pair without NaN", () => {
    // common practice, no source: constant groups with different means are separated with certainty.
    const r = welchTTest([2, 2, 2], [3, 3, 3, 3]);
    expect(r.t).toBe(-Infinity);
    expect(r.p).toBe(0);
    expect(welchTTest([5, 5], [5, 5, 5]).p).toBe(1);
  });

  it("welchTTest rejects samples with fewer than 2 values, naming the counts", () => {
    expect(() => welchTTest([1], [1, 2, 3])).toThrow(/at least 2 values, got 1 and 3/);
  });
});
