import { describe, expect, it } from "vitest";
import { simulateMeanPower, simulateSpreadPower } from "../../../../server/analysis/compare/planning/simulatePower.ts";
import { createRandom } from "../../../../server/analysis/random/seededRandom.ts";

describe("simulatePower", () => {
  it("simulateMeanPower and simulateSpreadPower reject at rate α when there is no effect", () => {
    // Source: definition of a test's size; Welch's t, the permutation test and the F-test (normal data)
    // all hold α. Binomial SE: 2000 runs ≈ 0.49%, 400 runs ≈ 1.1%.
    const welch = simulateMeanPower({ nPerGroup: 8, standardizedEffect: 0, alpha: 0.05, repetitions: 2000, test: "welch", random: createRandom(1) });
    const perm = simulateMeanPower({ nPerGroup: 8, standardizedEffect: 0, alpha: 0.05, repetitions: 400, test: "permutation", permutations: 199, random: createRandom(2) });
    const f = simulateSpreadPower({ nPerGroup: 10, sdRatio: 1, alpha: 0.05, repetitions: 2000, random: createRandom(3) });
    expect(Math.abs(welch - 0.05)).toBeLessThan(3 * 0.0049);
    expect(Math.abs(perm - 0.05)).toBeLessThan(3 * 0.011);
    expect(Math.abs(f - 0.05)).toBeLessThan(3 * 0.0049);
  });
});
