import { describe, expect, it } from "vitest";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";
import { ProjectedProblem } from "../../../server/analysis/fit/projectedProblem.ts";
import { SeparableBlock } from "../../../server/analysis/fit/separableBlock.ts";
import { solveSeparable } from "../../../server/analysis/fit/solveSeparable.ts";
import { exponentialModel } from "../../../server/analysis/models/exponential.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { relativeDifference, runPython } from "../../helpers/python.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

function setup(x: number[], y: number[]) {
  const block = new SeparableBlock(Float64Array.from(x), Float64Array.from(y), Infinity, true, 1);
  return { block, problem: new ProjectedProblem(exponentialModel, [block], [1], [0]) };
}

describe("solveSeparable", () => {
  it("falls back to the bracketing search from a start where the basis is degenerate", () => {
    // Source: recovery from exact synthetic data (common practice, no source).
    // At λ = 1e20 µm, e^(−x/λ) is exactly 1 and collinear with the background.
    const x = positions(0, 100, 50);
    const { problem } = setup(x, simulateProfile("exponential", x, [12], 30, 2));
    const solution = solveSeparable(problem, [1e20], [0.1], [1e20], FitOptions.parse({}), [null]);
    expect(solution.usedFallback).toBe(true);
    expect(relativeDifference(solution.values[0], 12)).toBeLessThan(1e-8);
  });

  it("with Poisson weights reaches the Poisson maximum-likelihood fit", async () => {
    // Source: scipy.optimize.minimize of the Poisson negative log-likelihood Σ(μ − y ln μ) as reference;
    // reweighting by 1/μ solves the same score equations Σ(y − μ)/μ·∂μ/∂θ = 0 (McCullagh & Nelder 1989, GLMs, §2.5).
    const random = createRandom(23);
    const x = positions(0, 200, 100);
    const mean = simulateProfile("exponential", x, [40], 400, 30);
    const y = mean.map((m) => Math.round(m + Math.sqrt(m) * random.normal()));
    const { problem, block } = setup(x, y);
    const solution = solveSeparable(problem, [35], [0.1], [2e5], FitOptions.parse({ weights: "poisson", maxReweightings: 200 }), [null]);
    expect(solution.reweightingConverged).toBe(true);
    const ref = await runPython<number[]>(
      `
from scipy.optimize import minimize
x = np.array(data["x"]); y = np.array(data["y"])
def nll(p):
    mu = p[0] * np.exp(-x / p[1]) + p[2]
    return np.sum(mu - y * np.log(mu))
r = minimize(nll, [380, 38, 28], method="Nelder-Mead", options={"xatol": 1e-10, "fatol": 1e-13, "maxiter": 40000, "maxfev": 40000})
result = list(r.x)
`,
      { x, y },
    );
    expect(relativeDifference(solution.values[0], ref[1])).toBeLessThan(1e-6);
    expect(relativeDifference(block.amplitude, ref[0])).toBeLessThan(1e-6);
    expect(relativeDifference(block.background, ref[2])).toBeLessThan(1e-5);
  });
});
