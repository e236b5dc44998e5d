import { describe, expect, it } from "vitest";
import { assessSteadyState } from "../../../../server/analysis/compare/tracking/steadyState.ts";
import { fitSaturatingTrend } from "../../../../server/analysis/compare/tracking/saturatingTrend.ts";
import { createRandom } from "../../../../server/analysis/random/seededRandom.ts";

const options = { lateFraction: 1 / 3, alpha: 0.05, steadyTolerance: 0.05 };

/** λ approaching its plateau with time constant τ (s), as a gradient forms (METHODS.md §2). */
function approach(seed: number, spanOverTau: number) {
  const r = createRandom(seed);
  const tau = 1200;
  const t = Array.from({ length: 45 }, (_, i) => (spanOverTau * tau * i) / 44);
  const y = t.map((v) => 100 - 60 * Math.exp(-v / tau) + 2.5 * r.normal());
  return { t, y };
}

describe("assessSteadyState", () => {
  it("assessSteadyState flags λ still rising when the observed span is one time constant", () => {
    // Source: after one τ, 1/e ≈ 37% of the approach remains (exponential relaxation) — far from steady.
    const d = approach(3, 1);
    const a = assessSteadyState(d.t, d.y, fitSaturatingTrend(d.t, d.y), options);
    expect(a.notAtSteadyState).toBe(true);
    expect(a.lateSlopeP!).toBeLessThan(0.05);
    expect(a.remainingFraction!).toBeGreaterThan(0.05);
    expect(a.reasons.length).toBe(2);
  });

  it("assessSteadyState does not flag λ observed for eight time constants", () => {
    // Source: after 8τ, e^(−8) ≈ 0.03% of the approach remains: steady within noise.
    const d = approach(4, 8);
    const a = assessSteadyState(d.t, d.y, fitSaturatingTrend(d.t, d.y), options);
    expect(a.notAtSteadyState).toBe(false);
    expect(a.remainingFraction!).toBeLessThan(0.01);
    expect(a.rule).toMatch(/last 33.3% of the time span/);
  });

  it("assessSteadyState keeps its false-alarm rate near α for a flat metric", () => {
    // Source: under H0 (no late trend) the t-test on the OLS slope rejects with probability α;
    // binomial SE for 300 replicates ≈ 1.3%.
    let alarms = 0;
    for (let s = 0; s < 300; s++) {
      const r = createRandom(500 + s);
      const t = Array.from({ length: 30 }, (_, i) => i * 100);
      const y = t.map(() => 90 + 5 * r.normal());
      if (assessSteadyState(t, y, null, options).notAtSteadyState) alarms++;
    }
    expect(alarms / 300).toBeLessThan(0.05 + 3 * 0.0126);
  });

  it("assessSteadyState returns null when no rule can run", () => {
    expect(assessSteadyState([0, 10], [1, 2], null, options).notAtSteadyState).toBeNull();
  });
});
