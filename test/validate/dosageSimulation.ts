import { readBoundary } from "../../server/analysis/compare/boundaryPosition.ts";
import type { EmbryoRecord } from "../../server/analysis/compare/embryoRecord.ts";
import type { Random } from "../../server/analysis/random/seededRandom.ts";

/**
 * A dosage series read from simulated profiles: c(x) = A_i·f·e^(−x/λ)·(1 + 3% noise) on 0–300 µm
 * (2 µm spacing), with the amplitude varying log-normally between embryos (SD of ln A = `spread`),
 * read at threshold θ = 100 a.u. by the tool's own boundary reading. The true boundary is
 * x_b = λ·ln(A_i·f/θ), so its mean moves by λ·ln f (Driever & Nüsslein-Volhard 1988, Cell;
 * Houchmandzadeh, Wieschaus & Leibler 2002, Nature). With A₀ = 3θ and spread 0.5, about a fifth of
 * the 0.5× embryos start below the threshold and never cross it.
 */
export function simulatedDosageSeries(random: Random, o: { lambdaUm: number; perDosage: number; dosages?: number[]; amplitude?: number; spread?: number }): EmbryoRecord[] {
  const x = Array.from({ length: 151 }, (_, k) => 2 * k);
  const out: EmbryoRecord[] = [];
  for (const f of o.dosages ?? [0.5, 1, 2]) {
    for (let i = 0; i < o.perDosage; i++) {
      const a = (o.amplitude ?? 300) * Math.exp((o.spread ?? 0.5) * random.normal());
      const y = x.map((xi) => a * f * Math.exp(-xi / o.lambdaUm) * (1 + 0.03 * random.normal()));
      const r = readBoundary(x, y, 100);
      out.push({
        embryo: `${f}x-${i}`, group: `${f}x`, dosage: f, lambdaUm: o.lambdaUm, converged: true,
        ...(r.kind === "crossed" ? { boundaryUm: r.positionUm } : { boundaryCensored: r.kind, boundaryLimitUm: r.limitUm }),
      });
    }
  }
  return out;
}
