import { describe, expect, it } from "vitest";
import { contrastCoverage, type ContrastScenario } from "./contrastSimulation.ts";
import { coverageBand, scaledReplicates } from "./validateScale.ts";

// Source: Welch 1947, Biometrika (difference) and Fieller 1954, J R Stat Soc B (ratio): intervals that
// hold their 95% level at any n for normal values, and closely for mildly skewed ones; bootstrap BCa
// under-covers with few embryos (Carpenter & Bithell 2000, Stat Med [memory]).
const scenarios: [string, Omit<ContrastScenario, "n">][] = [
  ["normal, unequal CVs 12% and 25%", { meanA: 100, meanB: 80, cvA: 0.12, cvB: 0.25, shape: "normal" }],
  ["log-normal, CVs 15% and 15%", { meanA: 95, meanB: 110, cvA: 0.15, cvB: 0.15, shape: "lognormal" }],
];

describe("contrast coverage (validate)", () => {
  for (const [label, scenario] of scenarios) {
    for (const n of [6, 10, 30]) {
      it(`Welch difference and Fieller ratio intervals cover 93–97% at n = ${n} per group (${label})`, () => {
        const reps = scaledReplicates(5000);
        const [low, high] = coverageBand(reps);
        const c = contrastCoverage({ ...scenario, n }, reps, 10_000 + n + (scenario.shape === "normal" ? 0 : 500));
        console.log(`coverage n=${n} ${label}: difference ${c.difference.toFixed(4)}, ratio ${c.ratio.toFixed(4)} over ${reps}`);
        expect(c.difference).toBeGreaterThanOrEqual(low);
        expect(c.difference).toBeLessThanOrEqual(high);
        expect(c.ratio).toBeGreaterThanOrEqual(low);
        expect(c.ratio).toBeLessThanOrEqual(high);
      });
    }
  }

  it("the BCa second opinion covers less than the headline intervals at 6 embryos per group", () => {
    const reps = scaledReplicates(1000);
    const c = contrastCoverage({ ...scenarios[0][1], n: 6 }, reps, 20_006, 1000);
    console.log(`n=6 headline difference ${c.difference.toFixed(4)} ratio ${c.ratio.toFixed(4)}; BCa difference ${c.bootstrapDifference!.toFixed(4)} ratio ${c.bootstrapRatio!.toFixed(4)} over ${reps}`);
    expect(c.bootstrapDifference!).toBeLessThan(c.difference);
    expect(c.bootstrapRatio!).toBeLessThan(c.ratio);
  });
});
