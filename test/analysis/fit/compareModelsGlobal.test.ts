import { describe, expect, it } from "vitest";
import { compareModelsGlobal } from "../../../server/analysis/fit/compareModelsGlobal.ts";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

describe("compareModelsGlobal", () => {
  it("picks the generating model for a group of replicates, exponential and power alike", () => {
    // Source: AICc model selection (Hurvich & Tsai 1989; Burnham & Anderson 2002).
    const random = createRandom(41);
    const x = positions(0, 250, 60);
    for (const [model, theta] of [["exponential", 35], ["power", 15]] as const) {
      const profiles = [70, 110, 90, 130].map((a, k) => ({ x, y: simulateProfile(model, x, [theta], a, 5 + 3 * k, { noiseSd: 3, random }) }));
      const c = compareModelsGlobal(profiles, ["exponential", "power", "power-free"], FitOptions.parse({}));
      expect(c.ranking.find((r) => r.model === model)!.deltaAicc).toBeLessThan(2.5);
      const other = model === "exponential" ? "power" : "exponential";
      expect(c.ranking.find((r) => r.model === other)!.deltaAicc).toBeGreaterThan(10);
      expect(Object.keys(c.fits).sort()).toEqual(["exponential", "power", "power-free"]);
    }
  });
});
