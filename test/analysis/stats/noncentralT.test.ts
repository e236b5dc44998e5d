import { describe, expect, it } from "vitest";
import { noncentralTCdf } from "../../../server/analysis/stats/noncentralT.ts";
import { studentTCdf } from "../../../server/analysis/stats/studentT.ts";
import { runPython } from "../../helpers/python.ts";

const grid: [number, number, number][] = [
  [2.0, 10, 1.5], [-1.0, 5, 0.7], [2.1, 38, 2.8], [0.5, 3.5, -1.2], [3.0, 60, 4.5], [-2.5, 20, -3.1], [1.98, 18, 0], [4.0, 100, 9],
];
// Source: scipy.stats.nct.cdf as reference on the same (t, ν, δ).
const reference = await runPython<number[]>(
  `
from scipy import stats
result = [float(stats.nct.cdf(t, df, nc)) for t, df, nc in data]
`,
  grid,
);

describe("noncentralTCdf", () => {
  it("noncentralTCdf matches scipy.stats.nct.cdf to 1e-9", () => {
    grid.forEach(([t, df, ncp], i) => expect(Math.abs(noncentralTCdf(t, df, ncp) - reference[i])).toBeLessThan(1e-9));
  });
  it("noncentralTCdf with δ = 0 equals the central t CDF", () => {
    // Source: Lenth 1989, Appl Stat — the series reduces to the central t at δ = 0.
    for (const t of [-2, -0.3, 0, 1.1, 3]) expect(noncentralTCdf(t, 7, 0)).toBeCloseTo(studentTCdf(t, 7), 12);
  });
});
