import { describe, expect, it } from "vitest";
import { FitOptions } from "../../../server/analysis/fit/fitOptions.ts";
import { fitProfile } from "../../../server/analysis/fit/fitProfile.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { positions, simulateProfile } from "./fitTestData.ts";

// Source: science.md §8 — a width, a decay length or an offset is positive; its interval must not cross 0.
// The cases are chosen where a Wald interval does cross it: a source width far below the point spacing,
// and a power-law offset the data barely constrain.
describe("intervals of positive parameters never cross their bound", () => {
  it("source width, decay length, power-law offset and exponent: ci95 low > 0 in every one of 60 poorly determined fits", () => {
    const random = createRandom(4242);
    const x = positions(0, 300, 40);
    let checked = 0;
    let waldWouldCross = 0;
    for (let r = 0; r < 20; r++) {
      const cases = [
        { model: "source" as const, y: simulateProfile("source", x, [60, 0.3], 100, 10).map((m) => m + 4 * random.normal()) },
        { model: "power" as const, y: simulateProfile("power", x, [400], 100, 10).map((m) => m + 3 * random.normal()) },
        { model: "power-free" as const, y: simulateProfile("power-free", x, [30, 1.2], 100, 10).map((m) => m + 3 * random.normal()) },
      ];
      for (const c of cases) {
        const fit = fitProfile(x, c.y, FitOptions.parse({ model: c.model, autoWindow: false }));
        if (!fit.ok) continue;
        for (const name of ["lambdaUm", "sourceWidthUm", "x0Um", "exponent"]) {
          const p = fit.parameters[name];
          if (!p || p.fixed || p.ci95 === null || p.se === null) continue;
          checked++;
          expect(p.ci95[0], `${c.model} ${name}`).toBeGreaterThan(0);
          expect(p.ci95[0]).toBeLessThanOrEqual(p.value);
          expect(p.ci95[1]).toBeGreaterThanOrEqual(p.value);
          expect(p.ciScale).toBe("log");
          if (p.value - 1.96 * p.se < 0) waldWouldCross++;
        }
      }
    }
    expect(checked).toBeGreaterThan(60);
    // The cases do probe the bound: symmetric intervals would have crossed it in some of them.
    expect(waldWouldCross).toBeGreaterThan(0);
  });
});
