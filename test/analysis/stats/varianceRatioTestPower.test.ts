import { describe, expect, it } from "vitest";
import { varianceRatioTestPower } from "../../../server/analysis/stats/varianceRatioTestPower.ts";
import { runPython } from "../../helpers/python.ts";

const cases: [number, number, number][] = [[20, 1.5, 0.05], [10, 2, 0.05], [50, 1.25, 0.01], [8, 0.6, 0.1]];
// Source: scipy.stats.f (ppf and cdf) for the two-sided F-test under the alternative, as reference.
const ref = await runPython<number[]>(
  `
from scipy import stats
result = []
for n, r, a in data:
    d = n - 1; hi = stats.f.ppf(1 - a / 2, d, d); lo = stats.f.ppf(a / 2, d, d)
    result.append(float(stats.f.sf(hi / r**2, d, d) + stats.f.cdf(lo / r**2, d, d)))
`,
  cases,
);

describe("varianceRatioTestPower", () => {
  it("varianceRatioTestPower matches scipy.stats.f to 1e-10", () => {
    cases.forEach(([n, r, a], i) => expect(Math.abs(varianceRatioTestPower(n, r, a) - ref[i])).toBeLessThan(1e-10));
  });
  it("varianceRatioTestPower equals α at equal SDs and is symmetric in ρ ↔ 1/ρ", () => {
    // Source: F(d, d) is symmetric under x ↔ 1/x, so the two-sided test is too.
    expect(varianceRatioTestPower(15, 1, 0.05)).toBeCloseTo(0.05, 10);
    expect(varianceRatioTestPower(15, 1.7, 0.05)).toBeCloseTo(varianceRatioTestPower(15, 1 / 1.7, 0.05), 10);
  });
});
