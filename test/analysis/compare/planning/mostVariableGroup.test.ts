import { describe, expect, it } from "vitest";
import { mostVariableGroup } from "../../../../server/analysis/compare/planning/mostVariableGroup.ts";
import { planSampleSize } from "../../../../server/analysis/compare/planning/planSampleSize.ts";
import { createRandom } from "../../../../server/analysis/random/seededRandom.ts";

const rng = createRandom(12);
const draw = (n: number, m: number, cv: number) => Array.from({ length: n }, () => m * (1 + cv * rng.normal()));
// The case reported from use: the largest group is calm (CV ≈ 5.6%), a smaller one varies ≈ 19%.
const groups = new Map<string, number[]>([
  ["wt", draw(30, 95, 0.056)],
  ["tardy", draw(8, 130, 0.19)],
  ["glm-2x", draw(12, 100, 0.09)],
  ["pilot", [90, 120]],
]);
const cv = (x: number[]) => {
  const m = x.reduce((a, b) => a + b) / x.length;
  return Math.sqrt(x.reduce((a, b) => a + (b - m) ** 2, 0) / (x.length - 1)) / m;
};

describe("mostVariableGroup", () => {
  it("mostVariableGroup defaults to the group with the largest CV, not the largest group, and says which it used", () => {
    // common practice, no source: plan for the hardest group to measure (conservative).
    const c = mostVariableGroup(groups)!;
    expect(c.group).toBe("tardy");
    expect(c.rule).toBe("most_variable");
    expect(c.cv).toBeCloseTo(cv(groups.get("tardy")!), 12);
    expect(c.candidates.map((k) => k.group)).toEqual(["tardy", "glm-2x", "wt"]);
    expect(c.sentence).toContain('"tardy"');
    expect(c.sentence).toContain("most variable");
    expect(c.sentence).toContain("wt 5.");
  });

  it("mostVariableGroup keeps a chosen group and needs 3 values per candidate", () => {
    expect(mostVariableGroup(groups, "wt")!.rule).toBe("chosen");
    expect(mostVariableGroup(groups, "pilot")).toBeNull();
    expect(mostVariableGroup(new Map([["a", [1, 2]]]))).toBeNull();
  });

  it("planning on the most variable group asks for more embryos than planning on the largest", () => {
    // Source: n = 2(z_{1−α/2} + z_{1−β})²·(CV/Δ)² (Chow, Shao & Wang 2008, §3.2; value from memory) grows with CV².
    const opts = { effect: 0.15, simulations: 100, permutationSimulations: 0 } as const;
    const conservative = planSampleSize({ ...opts, cv: mostVariableGroup(groups)!.cv });
    const calm = planSampleSize({ ...opts, cv: cv(groups.get("wt")!) });
    expect(conservative.n_required).toBeGreaterThan(2 * calm.n_required);
  });
});
