import { describe, expect, it } from "vitest";
import { normalIntervalProbability, normalSurvival } from "../../../server/analysis/stats/normalTail.ts";
import { relativeDifference, runPython } from "../../helpers/python.ts";

const z = [-9, -3.3, -1, -0.01, 0, 0.0071, 0.5, 1.96, 4.2, 7.77, 11.9, 12.5, 20, 37];
const pairs: [number, number][] = [[-1, 1], [4, 4.001], [-6.2, -6.1], [8, 30], [-0.3, 0.2]];
// Source: scipy.stats.norm.sf and norm.cdf differences (computed with the complementary tail) as reference.
const reference = await runPython<{ sf: number[]; interval: number[] }>(
  `
from scipy import stats
result = {
  "sf": [float(stats.norm.sf(x)) for x in data["z"]],
  "interval": [float(stats.norm.sf(a) - stats.norm.sf(b)) if a >= 0 else float(stats.norm.cdf(b) - stats.norm.cdf(a)) for (a, b) in data["pairs"]],
}
`,
  { z, pairs },
);

describe("fast normal tail against scipy.stats.norm", () => {
  it("normalSurvival matches norm.sf to 1e-9 relative from −9 to 37", () => {
    z.forEach((v, i) => expect(relativeDifference(normalSurvival(v), reference.sf[i])).toBeLessThan(1e-9));
  });
  it("normalIntervalProbability keeps relative precision for tiny intervals far in the tails", () => {
    pairs.forEach(([a, b], i) => expect(relativeDifference(normalIntervalProbability(a, b), reference.interval[i])).toBeLessThan(1e-6));
  });
});
