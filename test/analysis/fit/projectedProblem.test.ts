import { describe, expect, it } from "vitest";
import { ProjectedProblem } from "../../../server/analysis/fit/projectedProblem.ts";
import { SeparableBlock } from "../../../server/analysis/fit/separableBlock.ts";
import { exponentialModel } from "../../../server/analysis/models/exponential.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

describe("ProjectedProblem", () => {
  it("adds the blocks' RSS, JᵀJ and Jᵀr", () => {
    // Source: block-separable least squares — the objective is a sum over profiles (definition).
    const xs = [positions(0, 100, 30), positions(0, 150, 40)];
    const blocks = xs.map((x, k) => new SeparableBlock(Float64Array.from(x), Float64Array.from(simulateProfile("exponential", x, [20 + 5 * k], 10, 1).map((v, i) => v + 0.1 * Math.sin(i))), Infinity, true, 1));
    const joint = new ProjectedProblem(exponentialModel, blocks, [22], [0]);
    joint.evaluate([22], true);
    const totals = { rss: 0, jtj: 0, jtr: 0 };
    for (const b of blocks) {
      const single = new ProjectedProblem(exponentialModel, [b], [22], [0]);
      single.evaluate([22], true);
      totals.rss += single.rss;
      totals.jtj += single.jtj[0];
      totals.jtr += single.jtr[0];
    }
    expect(joint.rss).toBeCloseTo(totals.rss, 12);
    expect(joint.jtj[0]).toBeCloseTo(totals.jtj, 9);
    expect(joint.jtr[0]).toBeCloseTo(totals.jtr, 9);
  });
});
