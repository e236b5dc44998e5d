import { describe, expect, it } from "vitest";
import { frapCoverage } from "../analysis/dynamics/frapCoverage.ts";
import { coverageBand, scaledReplicates } from "./validateScale.ts";

// Source: definition of a 95% confidence interval; with 1000 replicates the binomial SE of the coverage is 0.7%.
describe("FRAP fit coverage, 1000 replicates per geometry (npm run validate)", () => {
  const cases = [
    { name: "spot", c: { geometry: { kind: "spot" as const, radiusUm: 1.5 }, diffusionUm2PerS: 0.4, mobileFraction: 0.75, postBleach: 0.25, noiseSd: 0.02, frames: 60, frameIntervalS: 0.5 } },
    { name: "strip", c: { geometry: { kind: "strip" as const, widthUm: 3 }, diffusionUm2PerS: 0.2, mobileFraction: 0.9, postBleach: 0.15, noiseSd: 0.02, frames: 80, frameIntervalS: 1 } },
    { name: "rod", c: { geometry: { kind: "rod" as const, fromUm: 2, toUm: 4, lengthUm: 10 }, diffusionUm2PerS: 0.5, mobileFraction: 0.85, postBleach: 0.2, noiseSd: 0.015, frames: 80, frameIntervalS: 0.5 } },
  ];
  for (const { name, c } of cases)
    it(`${name}: 95% intervals of D and the mobile fraction cover the truth in 93–97% of replicates`, () => {
      const n = scaledReplicates(1000);
      // The full run holds the 93–97% band; a scaled-down run widens it with the binomial SE.
      const [lo, hi] = n >= 1000 ? [0.93, 0.97] : coverageBand(n);
      const r = frapCoverage(c, n, 424242);
      expect(r.failed).toBe(0);
      expect(r.coverageD).toBeGreaterThanOrEqual(lo);
      expect(r.coverageD).toBeLessThanOrEqual(hi);
      expect(r.coverageMf).toBeGreaterThanOrEqual(lo);
      expect(r.coverageMf).toBeLessThanOrEqual(hi);
    });
});
