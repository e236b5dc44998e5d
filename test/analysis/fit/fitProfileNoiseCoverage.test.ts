import { describe, expect, it } from "vitest";
import { lambdaCoverage } from "./fitCoverageSimulation.ts";

// Source: a 95% CI must cover the truth in 95% of repeated experiments (Neyman). This bounded run
// uses 300 replicates; the binomial SE of a true 95% coverage is then √(0.95·0.05/300) = 1.26%, so
// the acceptance band is 95% ± 3 SE = 91.2–98.8%. The full 93–97% check over 2000 replicates is
// test/validate/fitCoverage.test.ts (npm run validate).
const band: [number, number] = [0.95 - 3 * Math.sqrt((0.95 * 0.05) / 300), 0.95 + 3 * Math.sqrt((0.95 * 0.05) / 300)];

describe("per-embryo λ intervals under noise that grows with intensity (multiplicative + additive)", () => {
  it("the default fit's 95% CI covers the true λ of exponential profiles in 91.2–98.8% of 300 replicates", () => {
    const { coverage, fitted } = lambdaCoverage("exponential", 300, 501);
    expect(fitted).toBeGreaterThanOrEqual(297);
    expect(coverage).toBeGreaterThanOrEqual(band[0]);
    expect(coverage).toBeLessThanOrEqual(band[1]);
  });

  it("the default fit's 95% CI covers the true λ of finite-domain profiles in 91.2–98.8% of 300 replicates", () => {
    const { coverage, fitted } = lambdaCoverage("finite", 300, 502);
    expect(fitted).toBeGreaterThanOrEqual(290);
    expect(coverage).toBeGreaterThanOrEqual(band[0]);
    expect(coverage).toBeLessThanOrEqual(band[1]);
  });

  it("unweighted fits with the classic s²(JᵀJ)⁻¹ intervals under-cover on the same profiles (< 85%)", () => {
    // Source: science.md §8 — constant-noise standard errors under-cover when the noise grows with the signal.
    const { coverage } = lambdaCoverage("exponential", 300, 501, { weights: "none", errorModel: "classic" });
    expect(coverage).toBeLessThan(0.85);
  });
});
