import { describe, expect, it } from "vitest";
import { lambdaCoverage } from "../analysis/fit/fitCoverageSimulation.ts";
import { coverageBand, scaledReplicates } from "./validateScale.ts";

// Source: a 95% CI must cover the truth in 95% of repeated experiments (Neyman); 93–97% asked of the
// default fit, widened to ±3 binomial SE when MORPHOGAUGE_VALIDATE_SCALE shrinks the run.
describe("per-embryo λ CI coverage of the default fit under multiplicative + additive noise", () => {
  for (const [model, seed] of [["exponential", 7001], ["finite", 7002]] as const) {
    it(`${model}: the 95% CI of λ covers the truth in 93–97% of 2000 seeded replicates`, () => {
      const replicates = scaledReplicates(2000);
      const { coverage, fitted } = lambdaCoverage(model, replicates, seed);
      const [lo, hi] = coverageBand(fitted);
      expect(fitted).toBeGreaterThanOrEqual(0.97 * replicates);
      expect(coverage).toBeGreaterThanOrEqual(lo);
      expect(coverage).toBeLessThanOrEqual(hi);
    });
  }
});
