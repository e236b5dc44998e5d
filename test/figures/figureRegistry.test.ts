import { describe, expect, it } from "vitest";
import { buildFigure, FIGURE_KINDS, FIGURE_REGISTRY, figureKindsFor } from "../../client/figures/figureRegistry.ts";
import { axisTitles } from "../helpers/figureConfig.ts";
import { relativePrecision, stageTracking, timeTracking, lengthTracking, spreadComparison } from "./figureFixtures.ts";
import { fixtureFor } from "./figureFixturesByKind.ts";

// A unit in parentheses ends every axis title: µm, a.u., s, fractions, ranks, counts (common practice, no source).
const UNIT = /\((µm|a\.u\.|s|n|rank|group label|label|stage number|probability, 0–1|fraction of length|dimensionless[^)]*|[^)]*µm, log scale|a\.u\., log scale|[^)]*)\)$/;

describe("figure registry", () => {
  it("FIGURE_REGISTRY has every kind, each with a title and one of the eight sources", () => {
    expect(Object.keys(FIGURE_REGISTRY).sort()).toEqual([...FIGURE_KINDS].sort());
    for (const k of FIGURE_KINDS) {
      expect(FIGURE_REGISTRY[k].title.length).toBeGreaterThan(3);
      expect(["fit", "precision", "comparison", "tracking", "plan", "dynamics", "frap", "simulation"]).toContain(FIGURE_REGISTRY[k].source);
    }
    expect(figureKindsFor("precision")).toEqual(["ensemble", "sigma-x", "boundary", "decoding-map"]);
    expect(figureKindsFor("fit")).toEqual(["profile-fit", "residuals"]);
    expect(figureKindsFor("dynamics")).toEqual(["build-up", "build-up-residuals", "profile-likelihood-k", "dk-region", "accumulation-time"]);
  });

  it("buildFigure passes the scale option to the profile-fit builder", () => {
    const log = buildFigure("profile-fit", fixtureFor("profile-fit") as never, { scale: "log" });
    expect((log.options?.scales?.y as { type: string }).type).toBe("logarithmic");
  });

  it("every builder gives every axis a title that ends with its unit in parentheses", () => {
    const configs = [
      ...FIGURE_KINDS.map((k) => buildFigure(k, fixtureFor(k) as never)),
      ...["ensemble", "sigma-x", "boundary", "decoding-map"].map((k) => buildFigure(k as "ensemble", relativePrecision)),
      ...[timeTracking, stageTracking, lengthTracking].map((t) => buildFigure("trend", t)),
      buildFigure("group-values", spreadComparison),
      buildFigure("profile-fit", fixtureFor("profile-fit") as never, { scale: "log" }),
    ];
    for (const c of configs) {
      const titles = axisTitles(c);
      expect(titles).toHaveLength(2);
      for (const t of titles) {
        expect(t, `axis title "${t}"`).toMatch(UNIT);
        expect(t.replace(/\s*\(.*\)$/, "").length, `axis title "${t}" names its quantity`).toBeGreaterThan(0);
      }
    }
  });

  it("every builder is pure: the same input gives the same configuration, and the input is left unchanged", () => {
    for (const k of FIGURE_KINDS) {
      const input = fixtureFor(k);
      const before = JSON.stringify(input);
      expect(JSON.stringify(buildFigure(k, input as never))).toBe(JSON.stringify(buildFigure(k, input as never)));
      expect(JSON.stringify(input)).toBe(before);
    }
  });

  it("every figure has a fixed size, no animation, an explicit font, a title and a legend", () => {
    for (const k of FIGURE_KINDS) {
      const o = buildFigure(k, fixtureFor(k) as never).options!;
      expect(o.responsive).toBe(false);
      expect(o.animation).toBe(false);
      expect(o.plugins?.title?.display).toBe(true);
      expect(o.plugins?.legend?.display).toBe(true);
      expect((o as { font: { family: string } }).font.family).toBe("DejaVu Sans");
    }
  });
});
