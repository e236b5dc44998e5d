import { describe, expect, it } from "vitest";
import { chiSquareCdf, chiSquareQuantile } from "../../../server/analysis/stats/chiSquare.ts";
import { relativeDifference, runPython } from "../../helpers/python.ts";

const cases: [number, number][] = [[0.025, 1], [0.975, 1], [0.025, 9], [0.975, 9], [0.5, 2.5], [1e-8, 4], [0.999999, 199], [0.025, 199]];
// Source: scipy.stats.chi2 as reference.
const reference = await runPython<{ ppf: number[]; cdf: number[] }>(
  `
from scipy import stats
result = {
  "ppf": [float(stats.chi2.ppf(p, df)) for (p, df) in data],
  "cdf": [float(stats.chi2.cdf(x, df)) for (x, df) in [(0.5, 1), (9.0, 9), (150.0, 199), (3.0, 2.5)]],
}
`,
  cases,
);

describe("chi-square distribution against scipy.stats.chi2", () => {
  it("chiSquareQuantile matches chi2.ppf to 1e-10 relative, tails included", () => {
    cases.forEach(([p, df], i) => expect(relativeDifference(chiSquareQuantile(p, df), reference.ppf[i])).toBeLessThan(1e-10));
  });
  it("chiSquareCdf matches chi2.cdf to 1e-12", () => {
    [[0.5, 1], [9, 9], [150, 199], [3, 2.5]].forEach(([x, df], i) => expect(Math.abs(chiSquareCdf(x, df) - reference.cdf[i])).toBeLessThan(1e-12));
  });
  it("chiSquareQuantile gives the textbook 95% values", () => {
    // Source: standard chi-square table, χ²_{0.95,1} = 3.841, χ²_{0.95,10} = 18.307 (value from memory).
    expect(chiSquareQuantile(0.95, 1)).toBeCloseTo(3.841, 3);
    expect(chiSquareQuantile(0.95, 10)).toBeCloseTo(18.307, 3);
  });
});
