import { describe, expect, it } from "vitest";
import { dosageSeries } from "../../../../server/analysis/compare/tracking/dosageSeries.ts";
import type { EmbryoRecord } from "../../../../server/analysis/compare/embryoRecord.ts";
import { createRandom, type Random } from "../../../../server/analysis/random/seededRandom.ts";

/**
 * Dosage lines 0.5×, 1×, 2×, 4× of an exponential gradient read at a fixed threshold:
 * x_b = λ_i·ln(A_i·f/θ) per embryo, with embryo-to-embryo variation in λ and A and a small
 * read-out error. Source: Driever & Nüsslein-Volhard 1988, Cell; Houchmandzadeh et al. 2002, Nature.
 */
function series(random: Random, lambdaUm: number, perLine: number): EmbryoRecord[] {
  const out: EmbryoRecord[] = [];
  for (const f of [0.5, 1, 2, 4]) {
    for (let i = 0; i < perLine; i++) {
      const lambda = lambdaUm * (1 + 0.08 * random.normal());
      const amplitude = 1000 * Math.exp(0.15 * random.normal());
      out.push({
        embryo: `${f}x-${i}`, group: `${f}x`, dosage: f, lambdaUm: lambda, converged: true,
        boundaryUm: lambda * Math.log((amplitude * f) / 50) + 3 * random.normal(),
      });
    }
  }
  return out;
}

describe("dosageSeries", () => {
  it("dosageSeries recovers λ from the boundary shift within its CI and agrees with the profile λ", () => {
    const r = dosageSeries(series(createRandom(10), 85, 12), { bootstrap: 200 });
    const shift = r.lambda_from_shift_um!;
    expect(shift.ci95![0]).toBeLessThan(85);
    expect(shift.ci95![1]).toBeGreaterThan(85);
    expect(r.dosages.map((d) => d.dosage)).toEqual([0.5, 1, 2, 4]);
    expect(r.lambda_fit_source).toBe("embryo_mean");
    expect(r.agree).toBe(true);
    // Source: Δx = λ·ln 2 ≈ 0.69λ per doubling (METHODS.md §5, from memory).
    const step = r.dosages[2].boundary_um!.mean - r.dosages[1].boundary_um!.mean;
    expect(step / (85 * Math.LN2)).toBeGreaterThan(0.7);
    expect(step / (85 * Math.LN2)).toBeLessThan(1.3);
    expect(r.assumptions.join(" ")).toMatch(/steady state/);
  });

  it("dosageSeries' CI of λ covers the true λ in ≥ 92% of 300 simulated series", () => {
    // Source: OLS slope CI (Draper & Smith, Applied Regression Analysis) — nominal 95%; the
    // embryo-to-embryo λ variation makes the errors mildly heteroscedastic, hence the 92% floor
    // (binomial SE of 300 series ≈ 1.3%).
    const rng = createRandom(11);
    let hit = 0;
    for (let s = 0; s < 300; s++) {
      const r = dosageSeries(series(rng, 60, 8), { bootstrap: 100 });
      const [lo, hi] = r.lambda_from_shift_um!.ci95!;
      if (lo <= 60 && 60 <= hi) hit++;
    }
    expect(hit / 300).toBeGreaterThanOrEqual(0.92);
  });

  it("dosageSeries flags disagreement with a supplied profile λ that is far off", () => {
    const r = dosageSeries(series(createRandom(12), 85, 12), { bootstrap: 200, lambdaFitUm: { value: 140, se: 3, ci95: null } });
    expect(r.lambda_fit_source).toBe("supplied");
    expect(r.agree).toBe(false);
    expect(r.difference_um!.value).toBeLessThan(0);
  });

  it("dosageSeries warns with fewer than 2 dosages and lists embryos without dosage or boundary", () => {
    const one: EmbryoRecord[] = [
      { embryo: "a", group: "1x", dosage: 1, boundaryUm: 200, lambdaUm: 80, converged: true },
      { embryo: "b", group: "1x", dosage: 1, boundaryUm: 205, lambdaUm: 82, converged: true },
      { embryo: "c", group: "1x", lambdaUm: 82, converged: true, boundaryUm: 190 },
      { embryo: "d", group: "1x", dosage: 2, lambdaUm: 82, converged: true },
    ];
    const r = dosageSeries(one, { bootstrap: 100 });
    expect(r.lambda_from_shift_um).toBeNull();
    expect(r.warnings[0]).toMatch(/at least 2 dosages and 3 embryos with boundaries, got 1 dosage\(s\) and 2 embryo\(s\)/);
    expect(r.excluded).toEqual([{ embryo: "c", reason: "no positive dosage" }, { embryo: "d", reason: "no boundary position" }]);
  });
});
