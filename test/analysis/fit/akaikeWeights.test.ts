import { describe, expect, it } from "vitest";
import { akaikeWeights } from "../../../server/analysis/fit/akaikeWeights.ts";

describe("akaikeWeights", () => {
  it("ranks by AICc and computes w_i = exp(−Δ_i/2)/Σ exp(−Δ_j/2)", () => {
    // Source: Burnham & Anderson 2002, §2.9. By hand: Δ = 0, 2, 6 → exp(0, −1, −3) = 1, 0.367879, 0.049787;
    // sum 1.417666 → weights 0.705385, 0.259496, 0.035119.
    const c = akaikeWeights([{ model: "power", aicc: 106 }, { model: "exponential", aicc: 100 }, { model: "finite", aicc: 102 }]);
    expect(c.ranking.map((r) => r.model)).toEqual(["exponential", "finite", "power"]);
    expect(c.ranking.map((r) => r.deltaAicc)).toEqual([0, 2, 6]);
    expect(c.ranking[0].weight).toBeCloseTo(0.705385, 6);
    expect(c.ranking[1].weight).toBeCloseTo(0.259496, 6);
    expect(c.ranking[2].weight).toBeCloseTo(0.035119, 6);
    expect(c.best).toBe("exponential");
    expect(c.indistinguishable).toBe(false);
  });

  it("flags the best two as indistinguishable when ΔAICc < 2", () => {
    // Source: Burnham & Anderson 2002, §2.6 (models within 2 of the best have substantial support).
    const c = akaikeWeights([{ model: "exponential", aicc: 10 }, { model: "power", aicc: 11.5 }]);
    expect(c.indistinguishable).toBe(true);
    expect(c.message).toMatch(/exponential and power are indistinguishable on these data \(ΔAICc = 1.5 < 2\)/);
  });

  it("handles no or one candidate", () => {
    // common practice, no source
    expect(akaikeWeights([])).toMatchObject({ best: null, ranking: [] });
    expect(akaikeWeights([{ model: "power", aicc: 3 }]).ranking[0].weight).toBe(1);
  });
});
