import { describe, expect, it } from "vitest";
import { decayingExponential } from "../../../server/analysis/models/decayingExponential.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";

describe("decayingExponential", () => {
  it("matches Math.exp(−x/λ) to 1e-14 relative on a uniform grid of 10 000 points", () => {
    // Source: Math.exp as reference; the recurrence re-anchors every 32 points.
    const x = Float64Array.from({ length: 10_000 }, (_, i) => 0.3245 * i);
    const out = decayingExponential(x, 87.1, new Float64Array(x.length));
    for (let i = 0; i < x.length; i++) {
      const exact = Math.exp(-x[i] / 87.1);
      if (exact > 0) expect(Math.abs(out[i] / exact - 1)).toBeLessThan(1e-14);
    }
  });

  it("matches Math.exp on an irregular, unsorted grid with negative positions", () => {
    // Source: Math.exp as reference (x·(1/λ) and x/λ differ by rounding, hence 1e-14).
    const random = createRandom(11);
    const x = Float64Array.from({ length: 500 }, () => -50 + 400 * random.uniform());
    const out = decayingExponential(x, 33, new Float64Array(x.length));
    for (let i = 0; i < x.length; i++) expect(Math.abs(out[i] / Math.exp(-x[i] / 33) - 1)).toBeLessThan(1e-14);
  });
});
