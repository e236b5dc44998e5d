import { describe, expect, it } from "vitest";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";
import { fitProfile } from "../../../server/analysis/fit/fitProfile.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

// Source: a 95% confidence interval must cover the true value in 95% of repeated
// experiments (Neyman's definition); with 500 replicates the binomial SD of the
// coverage is ≈ 1%, so 93–97% is a ±2 SD band.
function coverage(model: "exponential" | "finite", seed: number, lengthUm?: number): { covered: number; fitted: number } {
  const random = createRandom(seed);
  const x = positions(0, 300, 60);
  const lambdaUm = 60;
  const options = FitOptions.parse({ model });
  let covered = 0;
  let fitted = 0;
  for (let r = 0; r < 500; r++) {
    const y = simulateProfile(model, x, [lambdaUm], 100, 20, { lengthUm, noiseSd: 3, random });
    const fit = fitProfile(x, y, options, { lengthUm });
    if (!fit.ok || fit.parameters.lambdaUm.ci95 === null) continue;
    fitted++;
    const [lo, hi] = fit.parameters.lambdaUm.ci95;
    if (lo <= lambdaUm && lambdaUm <= hi) covered++;
  }
  return { covered, fitted };
}

describe("fitProfile confidence intervals", () => {
  it("the 95% CI of λ covers the true λ in 93–97% of 500 noisy exponential replicates", () => {
    const { covered, fitted } = coverage("exponential", 101);
    expect(fitted).toBe(500);
    expect(covered / fitted).toBeGreaterThanOrEqual(0.93);
    expect(covered / fitted).toBeLessThanOrEqual(0.97);
  });

  it("the 95% CI of λ covers the true λ in 93–97% of 500 noisy finite-domain replicates (L = 300 µm)", () => {
    const { covered, fitted } = coverage("finite", 202, 300);
    expect(fitted).toBe(500);
    expect(covered / fitted).toBeGreaterThanOrEqual(0.93);
    expect(covered / fitted).toBeLessThanOrEqual(0.97);
  });
});
