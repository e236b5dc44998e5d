import { describe, expect, it } from "vitest";
import { fitLinearTrend } from "../../../../server/analysis/compare/tracking/linearTrend.ts";
import { createRandom } from "../../../../server/analysis/random/seededRandom.ts";
import { runPython, relativeDifference } from "../../../helpers/python.ts";

const gen = createRandom(8);
const t = Array.from({ length: 23 }, (_, i) => 1800 + 240 * i + 60 * gen.uniform());
const y = t.map((v) => 60 + 0.004 * v + 3 * gen.normal());

// Source: scipy.stats.linregress, with CIs value ± t.ppf((1+level)/2, n−2)·SE.
const ref = await runPython<{ slope: number; intercept: number; se: number; seI: number; p: number; r2: number; ci90: [number, number]; ci95: [number, number] }>(
  `
from scipy import stats
r = stats.linregress(data["t"], data["y"])
df = len(data["t"]) - 2
ci = lambda lv: [r.slope - stats.t.ppf(0.5 + lv / 2, df) * r.stderr, r.slope + stats.t.ppf(0.5 + lv / 2, df) * r.stderr]
result = {"slope": r.slope, "intercept": r.intercept, "se": r.stderr, "seI": r.intercept_stderr, "p": r.pvalue,
          "r2": r.rvalue ** 2, "ci90": ci(0.90), "ci95": ci(0.95)}
`,
  { t, y },
);

describe("fitLinearTrend", () => {
  it("fitLinearTrend matches scipy.stats.linregress: slope, intercept, SEs, p, r² and t-based CIs", () => {
    const f95 = fitLinearTrend(t, y);
    const f90 = fitLinearTrend(t, y, 0.9);
    expect(relativeDifference(f95.slope.value, ref.slope)).toBeLessThan(1e-10);
    expect(relativeDifference(f95.intercept.value, ref.intercept)).toBeLessThan(1e-10);
    expect(relativeDifference(f95.slope.se!, ref.se)).toBeLessThan(1e-10);
    expect(relativeDifference(f95.intercept.se!, ref.seI)).toBeLessThan(1e-10);
    expect(relativeDifference(f95.pSlope, ref.p)).toBeLessThan(1e-8);
    expect(relativeDifference(f95.r2, ref.r2)).toBeLessThan(1e-10);
    for (let k = 0; k < 2; k++) {
      expect(relativeDifference(f95.slope.ci95![k], ref.ci95[k])).toBeLessThan(1e-10);
      expect(relativeDifference(f90.slope.ci95![k], ref.ci90[k])).toBeLessThan(1e-10);
    }
  });
});
