import { describe, expect, it } from "vitest";
import { detectOrientation } from "../../../server/analysis/ensemble/detectOrientation.ts";
import { flipProfile } from "../../../server/analysis/ensemble/flipProfile.ts";
import { prepareEnsemble } from "../../../server/analysis/ensemble/prepareEnsemble.ts";
import { exponentialGroup } from "../precision/simulateGradients.ts";

const settings = { grid: { coords: "absolute" as const, spacing: null, range: null }, normalisation: "none" as const };

describe("orientation", () => {
  const group = exponentialGroup({ embryos: 25, lambdaUm: 80, cv: 0.15, noise: "pointwise", seed: 91 });
  const reversed = group.map((p, i) => (i === 4 || i === 17 ? flipProfile(p) : p));

  it("detectOrientation flags exactly the embryos imaged end to end", () => {
    // common practice, no source: a reversed gradient correlates negatively with the group's median profile.
    const values = reversed.map((p) => Float64Array.from(p.intensity));
    const check = detectOrientation(reversed.map((p) => p.embryo), values, Float64Array.from(group[0].positionUm));
    expect(check.groupTrend).toBe("falls");
    expect(check.flagged).toEqual([group[4].embryo, group[17].embryo]);
    expect(check.correlations[4].correlation!).toBeLessThan(-0.5);
  });

  it("prepareEnsemble with flip 'auto' flips them back, lists them, and reports the variance removed", () => {
    // common practice, no source.
    const prepared = prepareEnsemble(reversed, { ...settings, flip: "auto" });
    expect(prepared.orientation.flipped).toEqual([group[4].embryo, group[17].embryo]);
    prepared.resampled[4].forEach((v, k) => expect(v).toBeCloseTo(group[4].intensity[k], 9));
    expect(prepared.orientation.variance!.fractionRemoved!).toBeGreaterThan(0.5);
    expect(prepared.warnings.map((w) => w.code)).toEqual(["embryos-flipped"]);
  });

  it("prepareEnsemble with flip 'none' only flags them", () => {
    // common practice, no source.
    const prepared = prepareEnsemble(reversed, { ...settings, flip: "none" });
    expect(prepared.orientation.flipped).toEqual([]);
    expect(prepared.orientation.flagged).toHaveLength(2);
    expect(prepared.warnings[0].code).toBe("orientation-flagged");
  });

  it("flipProfile mirrors about the embryo length, or about the sampled span when the length is unknown", () => {
    // Source: definition of reading the axis from the other end, x → L − x.
    const f = flipProfile({ embryo: "a", positionUm: [1, 2, 4], intensity: [3, 2, 1], lengthUm: 10 });
    expect(Array.from(f.positionUm)).toEqual([6, 8, 9]);
    expect(Array.from(f.intensity)).toEqual([1, 2, 3]);
    const g = flipProfile({ embryo: "a", positionUm: [1, 2, 4], intensity: [3, 2, 1] });
    expect(Array.from(g.positionUm)).toEqual([1, 3, 4]);
  });
});
