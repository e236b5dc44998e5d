import { describe, expect, it } from "vitest";
import { fCdf, fQuantile } from "../../../server/analysis/stats/fDistribution.ts";
import { runPython, relativeDifference } from "../../helpers/python.ts";

const cdfCases: [number, number, number][] = [[0.5, 4, 9], [1, 10, 10], [2.7, 19, 19], [0.2, 3.5, 40], [6, 2, 7]];
const quantileCases: [number, number, number][] = [[0.025, 9, 9], [0.975, 9, 9], [0.5, 5, 12], [0.995, 29, 29], [0.01, 3, 50]];
// Source: scipy.stats.f.cdf and scipy.stats.f.ppf as reference.
const reference = await runPython<{ cdf: number[]; ppf: number[] }>(
  `
from scipy import stats
result = {"cdf": [float(stats.f.cdf(x, a, b)) for x, a, b in data["c"]],
          "ppf": [float(stats.f.ppf(p, a, b)) for p, a, b in data["q"]]}
`,
  { c: cdfCases, q: quantileCases },
);

describe("fDistribution", () => {
  it("fCdf matches scipy.stats.f.cdf to 1e-12", () => {
    cdfCases.forEach(([x, a, b], i) => expect(Math.abs(fCdf(x, a, b) - reference.cdf[i])).toBeLessThan(1e-12));
  });
  it("fQuantile matches scipy.stats.f.ppf to 1e-10 relative", () => {
    quantileCases.forEach(([p, a, b], i) => expect(relativeDifference(fQuantile(p, a, b), reference.ppf[i])).toBeLessThan(1e-10));
  });
});
