import { describe, expect, it } from "vitest";
import { analysePrecision } from "../../server/analysis/precision/analysePrecision.ts";
import { exponentialGroup } from "../analysis/precision/simulateGradients.ts";
import { coverageBand, scaledReplicates } from "./validateScale.ts";

/*
 * Slow coverage runs of the precision headlines (`npm run validate`); the bounded version is in
 * test/analysis/precision/precisionTruth.test.ts. Ensemble: A·e^(−x/λ) over 0–500 µm, λ = 100 µm,
 * multiplicative log-normal noise of CV 10% at every position, so σ_x = λ·CV = 10 µm
 * (METHODS.md §4 [derived]). MORPHOGAUGE_VALIDATE_SCALE scales the replicate count down (validateScale.ts).
 */
const TRUE_SIGMA = 10;
const spec = { lambdaUm: 100, cv: 0.1, noise: "pointwise" as const, lengthUm: 500, spacingUm: 5 };
const replicates = scaledReplicates(400, 100);
/** ≥ 90% as asked of a 95% interval, widened to ±3 binomial SEs when a scaled-down run is small. */
const lowest = Math.min(0.9, coverageBand(replicates, 0.95, 0.05)[0]);

describe("headline σ_x coverage (slow)", () => {
  for (const n of [30, 200]) {
    it(`at ${n} embryos the 95% interval of the headline σ_x contains λ·CV in ≥ ${Math.round(100 * lowest)}% of ${replicates} seeded replicates (200 resamples each), and always its own value`, () => {
      // Source: definition of a 95% confidence interval; σ_x = λ·CV (METHODS.md §4 [derived]).
      let covered = 0;
      let contains = 0;
      let sum = 0;
      for (let r = 0; r < replicates; r++) {
        const s = analysePrecision(exponentialGroup({ ...spec, embryos: n, seed: 40_000 + 1000 * n + r }), {
          bootstrap: { resamples: 200, seed: r + 1, slowResamples: 0 },
          decoding: { enabled: false },
          information: { extrapolate: false },
        }).sigmaXSummary!;
        sum += s.value;
        if (s.ci95![0] <= TRUE_SIGMA && TRUE_SIGMA <= s.ci95![1]) covered++;
        if (s.ci95![0] <= s.value && s.value <= s.ci95![1]) contains++;
      }
      expect(contains).toBe(replicates);
      expect(covered / replicates).toBeGreaterThanOrEqual(lowest);
      expect(Math.abs(sum / replicates / TRUE_SIGMA - 1)).toBeLessThan(0.02);
    });
  }
});
