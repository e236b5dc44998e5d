import { describe, expect, it } from "vitest";
import { brentMinimize } from "../../../server/analysis/fit/brentMinimize.ts";
import { minimizeProjected } from "../../../server/analysis/fit/minimizeProjected.ts";
import { ProjectedProblem } from "../../../server/analysis/fit/projectedProblem.ts";
import { SeparableBlock } from "../../../server/analysis/fit/separableBlock.ts";
import { exponentialModel } from "../../../server/analysis/models/exponential.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

const settings = { maxIterations: 200, stepTolerance: 1e-10, reductionTolerance: 1e-14, gradientTolerance: 1e-10 };
const random = createRandom(17);
const x = positions(0, 250, 100);
const y = simulateProfile("exponential", x, [45], 70, 9, { noiseSd: 1.5, random });
const problem = () => new ProjectedProblem(exponentialModel, [new SeparableBlock(Float64Array.from(x), Float64Array.from(y), Infinity, true, 1)], [30], [0]);

describe("minimizeProjected", () => {
  it("reaches the minimum of the projected RSS found independently by Brent's method", () => {
    // Source: Brent 1973 (derivative-free 1-D minimisation) on the same reduced function.
    const p = problem();
    const result = minimizeProjected(p, [30], [1], [1e5], settings);
    expect(result.converged).toBe(true);
    const brent = brentMinimize((l) => (p.evaluate([l], false) ? p.rss : Infinity), 20, 80, 1e-12, 1e-12);
    expect(Math.abs(result.values[0] / brent.x - 1)).toBeLessThan(1e-6);
    expect(result.rss).toBeLessThanOrEqual(brent.fx * (1 + 1e-12));
  });

  it("stops on a bound that the minimum lies beyond, and says so", () => {
    // common practice, no source
    const result = minimizeProjected(problem(), [30], [1], [40], settings);
    expect(result.values[0]).toBeCloseTo(40, 9);
    expect(result.atBound[0]).toBe(1);
    expect(result.converged).toBe(true);
  });

  it("reports max-iterations when the iteration budget runs out", () => {
    // common practice, no source
    const result = minimizeProjected(problem(), [3], [1], [1e5], { ...settings, maxIterations: 1 });
    expect(result).toMatchObject({ converged: false, reason: "max-iterations", iterations: 1 });
  });
});
