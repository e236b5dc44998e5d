import type { Random } from "../../random/seededRandom.ts";
import { fQuantile } from "../../stats/fDistribution.ts";
import { variance } from "../../stats/descriptive.ts";
import { permutationTest } from "../../stats/permutationTest.ts";
import { welchTTest } from "../../stats/welchTTest.ts";

export interface MeanPowerSimulation {
  nPerGroup: number;
  /** Standardized effect δ/σ between the two normal populations. */
  standardizedEffect: number;
  alpha: number;
  repetitions: number;
  test: "welch" | "permutation";
  /** Relabellings per permutation test (permutation only). */
  permutations?: number;
  random: Random;
}

/**
 * Fraction of simulated experiments that reject at α: two normal groups of n
 * embryos with equal SD and means differing by the given number of SDs,
 * tested by Welch's t or by the permutation test. Its Monte-Carlo SE is
 * √(p(1 − p)/repetitions).
 */
export function simulateMeanPower(s: MeanPowerSimulation): number {
  const a = new Float64Array(s.nPerGroup);
  const b = new Float64Array(s.nPerGroup);
  let rejections = 0;
  for (let r = 0; r < s.repetitions; r++) {
    for (let i = 0; i < s.nPerGroup; i++) {
      a[i] = s.random.normal();
      b[i] = s.standardizedEffect + s.random.normal();
    }
    const p = s.test === "welch"
      ? welchTTest(a, b).p
      : permutationTest(a, b, { permutations: s.permutations ?? 999, random: s.random }).p;
    if (p <= s.alpha) rejections++;
  }
  return rejections / s.repetitions;
}

export interface SpreadPowerSimulation {
  nPerGroup: number;
  /** True ratio of the two SDs. */
  sdRatio: number;
  alpha: number;
  repetitions: number;
  random: Random;
}

/** Simulated power of the two-sided F-test of equal variances (normal groups). */
export function simulateSpreadPower(s: SpreadPowerSimulation): number {
  const d = s.nPerGroup - 1;
  const upper = fQuantile(1 - s.alpha / 2, d, d);
  const lower = fQuantile(s.alpha / 2, d, d);
  const a = new Float64Array(s.nPerGroup);
  const b = new Float64Array(s.nPerGroup);
  let rejections = 0;
  for (let r = 0; r < s.repetitions; r++) {
    for (let i = 0; i < s.nPerGroup; i++) {
      a[i] = s.sdRatio * s.random.normal();
      b[i] = s.random.normal();
    }
    const f = variance(a) / variance(b);
    if (f > upper || f < lower) rejections++;
  }
  return rejections / s.repetitions;
}
