import { describe, expect, it } from "vitest";
import { twoSampleTTestPower } from "../../../server/analysis/stats/tTestPower.ts";
import { runPython } from "../../helpers/python.ts";

const cases: [number, number, number][] = [[10, 1.33, 0.05], [64, 0.5, 0.05], [26, 0.8, 0.05], [5, 2, 0.01], [393, 0.2, 0.05]];
// Source: scipy.stats.nct (sf and cdf) at the pooled-t critical value, as reference.
const ref = await runPython<number[]>(
  `
from scipy import stats
result = []
for n, d, a in data:
    df = 2 * n - 2; nc = d * np.sqrt(n / 2); tc = stats.t.ppf(1 - a / 2, df)
    result.append(float(stats.nct.sf(tc, df, nc) + stats.nct.cdf(-tc, df, nc)))
`,
  cases,
);

describe("twoSampleTTestPower", () => {
  it("twoSampleTTestPower matches the noncentral-t power from scipy.stats.nct to 1e-9", () => {
    cases.forEach(([n, d, a], i) => expect(Math.abs(twoSampleTTestPower(n, d, a) - ref[i])).toBeLessThan(1e-9));
  });
  it("twoSampleTTestPower reproduces Cohen's tabled power of 0.80 for d = 0.5 with 64 per group", () => {
    // Source: Cohen 1988, Statistical Power Analysis, Table 2.4.1 (value from memory): n = 64 for
    // d = 0.5, α = 0.05 two-sided, power 0.80; n = 26 for d = 0.8.
    expect(twoSampleTTestPower(64, 0.5, 0.05)).toBeGreaterThanOrEqual(0.8);
    expect(twoSampleTTestPower(63, 0.5, 0.05)).toBeLessThan(0.8);
    expect(twoSampleTTestPower(26, 0.8, 0.05)).toBeGreaterThanOrEqual(0.8);
    expect(twoSampleTTestPower(25, 0.8, 0.05)).toBeLessThan(0.8);
  });
  it("twoSampleTTestPower equals α when there is no effect", () => {
    // Source: definition of the test's size.
    expect(twoSampleTTestPower(12, 0, 0.05)).toBeCloseTo(0.05, 12);
  });
});
