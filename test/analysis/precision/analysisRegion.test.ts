import { describe, expect, it } from "vitest";
import { onNodes, regionNodes, resolveRegion, stateRegion } from "../../../server/analysis/precision/analysisRegion.ts";
import { regionSigma } from "../../../server/analysis/precision/regionSigma.ts";

describe("stateRegion", () => {
  const x = Array.from({ length: 11 }, (_, k) => 10 * k);

  it("defaults to the covered span trimmed by a fixed fraction at each end, whatever the noise", () => {
    // common practice, no source: the region is fixed before the noise is looked at.
    const r = stateRegion(x, [0, 100], null, { span: null, trimFraction: 0.1 });
    expect([r.from, r.to, r.length, r.source, r.startIndex, r.endIndex]).toEqual([10, 90, 80, "default", 1, 9]);
    expect(r.description).toBe("span covered by every profile (0–100), trimmed by 10% at each end");
    const shared = stateRegion(x, [0, 100], null, { span: [5, 95], trimFraction: 0.1 });
    expect([shared.from, shared.to]).toEqual([14, 86]);
    expect(shared.description).toContain("every group");
  });

  it("keeps a requested region exactly, and refuses one that reaches beyond the grid instead of shrinking it", () => {
    // common practice, no source.
    const r = stateRegion(x, [0, 100], [15, 62], { span: null, trimFraction: 0.1 });
    expect([r.from, r.to, r.source, r.startIndex, r.endIndex]).toEqual([15, 62, "requested", 2, 6]);
    expect(() => resolveRegion(x, [0, 120], "requested", "requested")).toThrow(/region 0 to 120 reaches beyond the grid 0 to 100/);
    expect(() => resolveRegion(x, [31, 39], "requested", "requested")).toThrow(/holds 0 grid points; at least 3/);
  });

  it("regionNodes puts nodes at the exact ends and interpolates linearly onto them", () => {
    // common practice, no source: linear interpolation between grid points.
    const r = resolveRegion(x, [15, 62], "requested", "requested");
    const nodes = regionNodes(x, r);
    expect(Array.from(nodes.x)).toEqual([15, 20, 30, 40, 50, 60, 62]);
    expect(Array.from(onNodes(nodes, x.map((v) => 2 * v + 1)))).toEqual([31, 41, 61, 81, 101, 121, 125].map((v) => expect.closeTo(v, 12)));
  });
});

describe("regionSigma", () => {
  const x = Array.from({ length: 11 }, (_, k) => 10 * k);
  const region = resolveRegion(x, [0, 100], "requested", "requested");
  const nodes = regionNodes(x, region);

  it("counts positions with an unresolved slope as no information (σ_x = L/√(2πe)) instead of leaving a hole, and fills positions without spread", () => {
    // Source: a Gaussian of SD L/√(2πe) has the entropy of a uniform prior on L (differential entropy of the
    // normal and uniform distributions; Cover & Thomas 2006, ch. 8), so such a position adds no information.
    const sd = x.map((_, k) => (k === 5 ? 0 : 1));
    const slope = x.map((_, k) => (k === 8 ? 0.001 : 0.5));
    const slopeSe = x.map(() => 0.01);
    const r = regionSigma(sd, [{ slope, slopeSe }], slope, { minSlopeSnr: 3, embryos: 1e9 }, region, nodes);
    const cap = 100 / Math.sqrt(2 * Math.PI * Math.E);
    expect(r.capped).toBe(1);
    expect(r.filled).toBe(1);
    expect(r.sigma[8]).toBeCloseTo(cap, 9);
    expect(r.sigma[5]).toBeCloseTo(2, 6);
    expect(r.sigma[0]).toBeCloseTo(2, 6);
  });
});
