import { contrastMeans } from "../../server/analysis/compare/contrastMeans.ts";
import { createRandom } from "../../server/analysis/random/seededRandom.ts";
import { fiellerInterval } from "../../server/analysis/stats/fiellerInterval.ts";
import { welchInterval } from "../../server/analysis/stats/welchInterval.ts";

export interface ContrastScenario {
  /** Embryos per group. */
  n: number;
  /** True means of a and b (e.g. λ in µm). */
  meanA: number;
  meanB: number;
  /** Embryo-to-embryo CVs; unequal by default, the case Welch's t exists for. */
  cvA: number;
  cvB: number;
  /** normal: values ~ N(mean, (cv·mean)²); lognormal: the same mean and CV, skewed. */
  shape: "normal" | "lognormal";
}

export interface ContrastCoverage {
  replicates: number;
  difference: number;
  ratio: number;
  /** Coverage of the bootstrap second opinion, when it was run. */
  bootstrapDifference: number | null;
  bootstrapRatio: number | null;
}

function draw(random: ReturnType<typeof createRandom>, n: number, m: number, cv: number, shape: ContrastScenario["shape"]): number[] {
  if (shape === "normal") return Array.from({ length: n }, () => m * (1 + cv * random.normal()));
  const s2 = Math.log(1 + cv * cv);
  return Array.from({ length: n }, () => m * Math.exp(Math.sqrt(s2) * random.normal() - s2 / 2));
}

/**
 * Fraction of seeded simulated experiments whose headline difference (Welch) and ratio (Fieller)
 * intervals contain the true values; with `bootstrap` > 0 also the BCa second opinion's.
 */
export function contrastCoverage(s: ContrastScenario, replicates: number, seed: number, bootstrap = 0): ContrastCoverage {
  const random = createRandom(seed);
  const trueDiff = s.meanA - s.meanB;
  const trueRatio = s.meanA / s.meanB;
  let diff = 0;
  let ratio = 0;
  let bootDiff = 0;
  let bootRatio = 0;
  const inside = (c: [number, number] | null | undefined, v: number) => (c ? c[0] <= v && v <= c[1] : false);
  for (let r = 0; r < replicates; r++) {
    const a = draw(random, s.n, s.meanA, s.cvA, s.shape);
    const b = draw(random, s.n, s.meanB, s.cvB, s.shape);
    if (bootstrap > 0) {
      const c = contrastMeans(a, b, { bootstrap, permutations: 99, level: 0.95, interval: "bca", seeds: { difference: 3 * r + 1, ratio: 3 * r + 2, permutation: 3 * r + 3 } });
      if (inside(c.difference.ci95, trueDiff)) diff++;
      if (inside(c.ratio?.ci95, trueRatio)) ratio++;
      if (inside(c.difference.bootstrap_ci95, trueDiff)) bootDiff++;
      if (inside(c.ratio?.bootstrap_ci95, trueRatio)) bootRatio++;
    } else {
      if (inside(welchInterval(a, b, 0.95), trueDiff)) diff++;
      if (inside(fiellerInterval(a, b, 0.95).interval, trueRatio)) ratio++;
    }
  }
  return {
    replicates,
    difference: diff / replicates,
    ratio: ratio / replicates,
    bootstrapDifference: bootstrap > 0 ? bootDiff / replicates : null,
    bootstrapRatio: bootstrap > 0 ? bootRatio / replicates : null,
  };
}
