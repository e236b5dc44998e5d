import { describe, expect, it } from "vitest";
import { hedgesG, hedgesGFromMoments } from "../../../server/analysis/stats/hedgesG.ts";

describe("hedgesG", () => {
  it("hedgesGFromMoments reproduces the worked example of Borenstein et al. 2009", () => {
    // Source: Borenstein, Hedges, Higgins & Rothstein 2009, Introduction to Meta-Analysis, ch. 4
    // (value from memory): means 103 and 100, SDs 5.5 and 4.5, n = 50 each →
    // d = 0.5970, SE(d) = 0.2044, J = 0.9923, g = 0.5924, SE(g) = 0.2028.
    const g = hedgesGFromMoments({ mean: 103, sd: 5.5, n: 50 }, { mean: 100, sd: 4.5, n: 50 });
    expect(g.cohensD).toBeCloseTo(0.597, 3);
    expect(g.correction).toBeCloseTo(0.9923, 4);
    expect(g.value).toBeCloseTo(0.5924, 4);
    expect(g.se!).toBeCloseTo(0.2028, 4);
    expect(g.ci95![0]).toBeCloseTo(0.5924 - 1.959964 * 0.2028, 3);
  });

  it("hedgesG's exact correction matches the approximation J ≈ 1 − 3/(4ν − 1) for moderate ν", () => {
    // Source: Hedges 1981, J Educ Stat 6:107–128 — the approximation is accurate to < 0.001 for ν ≥ 10.
    for (const [na, nb] of [[6, 6], [10, 14], [30, 25]]) {
      const g = hedgesGFromMoments({ mean: 1, sd: 1, n: na }, { mean: 0, sd: 1, n: nb });
      expect(Math.abs(g.correction - (1 - 3 / (4 * g.df - 1)))).toBeLessThan(1e-3);
    }
  });

  it("hedgesG on raw samples equals the moment form and its sign follows mean(a) − mean(b)", () => {
    // common practice, no source: g of (a, b) is minus g of (b, a).
    const a = [4.1, 5.3, 6.0, 4.8, 5.5];
    const b = [6.2, 7.1, 6.6, 7.9];
    expect(hedgesG(a, b).value).toBeLessThan(0);
    expect(hedgesG(a, b).value).toBeCloseTo(-hedgesG(b, a).value, 14);
  });
});
