import type { EmbryoRecord } from "../../../server/analysis/compare/embryoRecord.ts";
import type { Random } from "../../../server/analysis/random/seededRandom.ts";

export interface SyntheticGroup {
  group: string;
  n: number;
  lambdaUm: number;
  /** Embryo-to-embryo CV of λ. */
  cv: number;
  amplitude?: number;
  background?: number;
  boundaryUm?: number;
  boundarySdUm?: number;
}

/** Embryo records with normal embryo-to-embryo variation, for tests only; every field needed by the comparison. */
export function syntheticEmbryos(groups: SyntheticGroup[], random: Random): EmbryoRecord[] {
  const out: EmbryoRecord[] = [];
  for (const g of groups) {
    for (let i = 0; i < g.n; i++) {
      const r: EmbryoRecord = {
        embryo: `${g.group}-${i + 1}`,
        group: g.group,
        lambdaUm: g.lambdaUm * (1 + g.cv * random.normal()),
        converged: true,
      };
      if (g.amplitude !== undefined) r.amplitude = g.amplitude * (1 + 0.2 * random.normal());
      if (g.background !== undefined) r.background = g.background * (1 + 0.1 * random.normal());
      if (g.boundaryUm !== undefined) r.boundaryUm = g.boundaryUm + (g.boundarySdUm ?? 5) * random.normal();
      out.push(r);
    }
  }
  return out;
}
