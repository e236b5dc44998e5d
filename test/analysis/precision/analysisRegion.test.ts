import { describe, expect, it } from "vitest";
import { chooseRegion } from "../../../server/analysis/precision/analysisRegion.ts";

describe("chooseRegion", () => {
  const x = Array.from({ length: 11 }, (_, k) => 10 * k);
  const masked = [true, false, false, false, true, false, false, false, false, false, true];

  it("takes the longest run of unmasked positions when no region is requested", () => {
    // common practice, no source: the information integral needs a contiguous stretch with σ_x defined.
    expect(chooseRegion(x, masked, null)).toEqual({ startIndex: 5, endIndex: 9, from: 50, to: 90, length: 40, source: "longest unmasked run" });
  });

  it("keeps a requested region that is fully unmasked and shrinks one that is not", () => {
    // common practice, no source.
    expect(chooseRegion(x, masked, [10, 30])?.source).toBe("requested");
    const shrunk = chooseRegion(x, masked, [10, 70])!;
    expect([shrunk.from, shrunk.to, shrunk.source]).toEqual([10, 30, "longest unmasked run inside the requested region"]);
    expect(chooseRegion(x, masked, [35, 45])).toBeNull();
  });
});
