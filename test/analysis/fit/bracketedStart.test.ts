import { describe, expect, it } from "vitest";
import { bracketedStart } from "../../../server/analysis/fit/bracketedStart.ts";
import { ProjectedProblem } from "../../../server/analysis/fit/projectedProblem.ts";
import { SeparableBlock } from "../../../server/analysis/fit/separableBlock.ts";
import { exponentialModel } from "../../../server/analysis/models/exponential.ts";
import { powerFreeModel } from "../../../server/analysis/models/powerFree.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

describe("bracketedStart", () => {
  it("finds λ from a start at the far end of a bracket spanning six decades", () => {
    // Source: recovery from exact synthetic data (common practice, no source).
    const x = positions(0, 200, 80);
    const y = simulateProfile("exponential", x, [23], 40, 3);
    const problem = new ProjectedProblem(exponentialModel, [new SeparableBlock(Float64Array.from(x), Float64Array.from(y), Infinity, true, 1)], [1], [0]);
    const start = bracketedStart(problem, [2e5], [0.1], [2e5]);
    expect(Math.abs(start[0] / 23 - 1)).toBeLessThan(1e-5);
  });

  it("searches a second parameter on a few values when there is one", () => {
    // common practice, no source
    const x = positions(0, 200, 80);
    const y = simulateProfile("power-free", x, [15, 3], 40, 3);
    const problem = new ProjectedProblem(powerFreeModel, [new SeparableBlock(Float64Array.from(x), Float64Array.from(y), Infinity, true, 2)], [1, 1], [0, 1]);
    const start = bracketedStart(problem, [1e4, 0.06], [0.1, 0.05], [2e5, 40]);
    problem.evaluate(start, false);
    const atStart = problem.rss;
    problem.evaluate([1e4, 0.06], false);
    expect(atStart).toBeLessThan(0.01 * problem.rss);
  });
});
