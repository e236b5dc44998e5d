import { describe, expect, it } from "vitest";
import { sizeScaling } from "../../../../server/analysis/compare/tracking/sizeScaling.ts";
import type { EmbryoRecord } from "../../../../server/analysis/compare/embryoRecord.ts";
import { createRandom } from "../../../../server/analysis/random/seededRandom.ts";
import { runPython, relativeDifference } from "../../../helpers/python.ts";

const rng = createRandom(31);
const records: EmbryoRecord[] = [];
for (let i = 0; i < 40; i++) {
  // Lengths spread ±25% around 500 µm; "scaling" lines have λ = 0.18·L, "fixed" lines λ = 90 µm.
  const L = 500 * (0.75 + 0.5 * rng.uniform());
  records.push({ embryo: `s${i}`, group: "scaling", lengthUm: L, lambdaUm: 0.18 * L * Math.exp(0.06 * rng.normal()), boundaryUm: 0.45 * L * Math.exp(0.03 * rng.normal()), converged: true });
  records.push({ embryo: `f${i}`, group: "fixed", lengthUm: L, lambdaUm: 90 * Math.exp(0.06 * rng.normal()), converged: true });
}
records.push({ embryo: "nolength", group: "fixed", lambdaUm: 90, converged: true });
const pick = (g: string) => records.filter((r) => r.group === g && r.lengthUm !== undefined);

// Source: scipy.stats.linregress on ln λ against ln L.
const ref = await runPython<Record<string, { slope: number; se: number }>>(
  `
from scipy import stats
result = {}
for k, v in data.items():
    r = stats.linregress(np.log(v["L"]), np.log(v["y"]))
    result[k] = {"slope": r.slope, "se": r.stderr}
`,
  Object.fromEntries(["scaling", "fixed"].map((g) => [g, { L: pick(g).map((r) => r.lengthUm), y: pick(g).map((r) => r.lambdaUm) }])),
);

describe("sizeScaling", () => {
  const result = sizeScaling(records);
  it("sizeScaling's log–log slope of λ on length matches scipy.stats.linregress", () => {
    for (const g of result.groups) {
      expect(relativeDifference(g.lambda!.slope.value, ref[g.group].slope)).toBeLessThan(1e-10);
      expect(relativeDifference(g.lambda!.slope.se!, ref[g.group].se)).toBeLessThan(1e-10);
    }
  });

  it("sizeScaling tells a scaling gradient (slope 1) from a fixed one (slope 0)", () => {
    // Source: λ ∝ L^β; β = 1 is perfect scaling, β = 0 none (definition).
    const scaling = result.groups.find((g) => g.group === "scaling")!;
    const fixed = result.groups.find((g) => g.group === "fixed")!;
    expect(scaling.lambda!.consistent_with_scaling).toBe(true);
    expect(scaling.lambda!.consistent_with_no_scaling).toBe(false);
    expect(scaling.boundary!.consistent_with_scaling).toBe(true);
    expect(fixed.lambda!.consistent_with_no_scaling).toBe(true);
    expect(fixed.lambda!.consistent_with_scaling).toBe(false);
    expect(fixed.boundary).toBeNull();
    expect(result.excluded).toEqual([{ embryo: "nolength", reason: "no positive length" }]);
  });
});
