import { describe, expect, it } from "vitest";
import { deriveSeed } from "../../../server/analysis/compare/deriveSeed.ts";

describe("deriveSeed", () => {
  it("deriveSeed is deterministic, separates labels and seeds, and stays a 32-bit unsigned integer", () => {
    // common practice, no source: sub-streams must differ per step and repeat per seed.
    const labels = ["contrast:lambda:a:b", "contrast:lambda:b:a", "summary:wt:lambda", "summary:wt:amplitude"];
    const seeds = labels.flatMap((l) => [deriveSeed(1, l), deriveSeed(2, l), deriveSeed(-7, l)]);
    expect(new Set(seeds).size).toBe(seeds.length);
    expect(deriveSeed(1, labels[0])).toBe(deriveSeed(1, labels[0]));
    for (const s of seeds) expect(Number.isInteger(s) && s >= 0 && s < 2 ** 32).toBe(true);
  });
});
