import { describe, expect, it } from "vitest";
import { dosageSeries } from "../../server/analysis/compare/tracking/dosageSeries.ts";
import { fitLinearTrend } from "../../server/analysis/compare/tracking/linearTrend.ts";
import { createRandom } from "../../server/analysis/random/seededRandom.ts";
import { simulatedDosageSeries } from "./dosageSimulation.ts";
import { coverageBand, scaledReplicates } from "./validateScale.ts";

// Source: Δx = λ·ln f (Driever & Nüsslein-Volhard 1988, Cell; Houchmandzadeh, Wieschaus & Leibler 2002,
// Nature); censored-normal maximum likelihood (Tobin 1958, Econometrica) for embryos that never cross.
describe("dosage series with uncrossed embryos (validate)", () => {
  for (const perDosage of [10, 30]) {
    it(`λ from the shift covers the truth 93–97% with ${perDosage} embryos per dosage, ~20% of the 0.5× line uncrossed`, () => {
      const reps = scaledReplicates(1000);
      const rng = createRandom(31_000 + perDosage);
      let covered = 0;
      let ml = 0;
      let naive = 0;
      let refused = 0;
      for (let r = 0; r < reps; r++) {
        const records = simulatedDosageSeries(rng, { lambdaUm: 60, perDosage });
        const s = dosageSeries(records, { bootstrap: 100 }).lambda_from_shift_um;
        // More than half of a dosage uncrossed: refused by design (counted, not scored).
        if (s === null) {
          refused++;
          continue;
        }
        if (s.ci95![0] <= 60 && 60 <= s.ci95![1]) covered++;
        ml += s.value;
        const crossed = records.filter((e) => e.boundaryUm !== undefined);
        naive += fitLinearTrend(crossed.map((e) => Math.log(e.dosage!)), crossed.map((e) => e.boundaryUm!)).slope.value;
      }
      const scored = reps - refused;
      const [low, high] = coverageBand(scored);
      console.log(`dosage n=${perDosage}: coverage ${(covered / scored).toFixed(4)}, mean λ ML ${(ml / scored).toFixed(2)}, dropping uncrossed ${(naive / scored).toFixed(2)} (truth 60) over ${scored}, ${refused} refused`);
      expect(refused / reps).toBeLessThan(0.1);
      expect(covered / scored).toBeGreaterThanOrEqual(low);
      expect(covered / scored).toBeLessThanOrEqual(high);
      expect(Math.abs(ml / scored - 60)).toBeLessThan(1.5);
    });
  }
});
