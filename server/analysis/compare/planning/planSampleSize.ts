import { createRandom } from "../../random/seededRandom.ts";
import { mean, standardDeviation } from "../../stats/descriptive.ts";
import { normalCdf, normalQuantile } from "../../stats/normal.ts";
import { twoSampleTTestPower } from "../../stats/tTestPower.ts";
import { varianceRatioTestPower } from "../../stats/varianceRatioTestPower.ts";
import { deriveSeed } from "../deriveSeed.ts";
import { PlanOptions, type PlanOptionsInput, type ResolvedPlanOptions } from "./planOptions.ts";
import { simulateMeanPower, simulateSpreadPower } from "./simulatePower.ts";

export interface PowerRow {
  /** Embryos per group. */
  n: number;
  /** Exact power of the analytic test: pooled t (noncentral t) for means, F-test for spread. */
  power_analytic: number;
  /** Power by the normal approximation behind `n_normal`. */
  power_normal: number;
  /** Simulated power of Welch's t (means) or the F-test (spread). */
  power_simulated: number;
  /** Simulated power of the permutation test (means only; null when skipped). */
  power_permutation_simulated: number | null;
}

export interface SamplePlan {
  settings: Omit<ResolvedPlanOptions, "observed">;
  quantity: ResolvedPlanOptions["quantity"];
  /** CV used for a mean plan (from cv, sd/mean or the observed values); null for spread. */
  cv: number | null;
  /** Effect in SD units, |Δ|/CV, for a mean plan; ln(1 + Δ) for spread. */
  standardized_effect: number;
  /** Unrounded normal-approximation size per group. */
  n_normal_exact: number;
  /** Normal-approximation size per group, rounded up. */
  n_normal: number;
  /** Smallest n per group whose exact power (noncentral t, or F) reaches the target. */
  n_required: number;
  /** Whether n_required hit `maxN` without reaching the target. */
  capped: boolean;
  table: PowerRow[];
  formula: string;
  notes: string[];
}

/**
 * Embryos per group needed to detect a relative change Δ at power 1 − β and
 * two-sided level α.
 *
 * Mean (e.g. λ): n = 2(z_{1−α/2} + z_{1−β})²·σ²/δ² with σ/δ = CV/|Δ|
 * (Chow, Shao & Wang 2008, Sample Size Calculations in Clinical Research,
 * §3.2; recalled, not re-read), then raised to the smallest n whose exact
 * pooled-t power from the noncentral t reaches the target (Cohen 1988, ch. 2).
 *
 * Spread (e.g. σ_x, boundary SD): with Var(ln s) ≈ 1/(2(n − 1)) for normal
 * data, n = 1 + (z_{1−α/2} + z_{1−β})²/ln²(1 + Δ); refined with the exact power
 * of the F-test of equal variances.
 *
 * Both are checked by simulation (seeded): Welch's t and the permutation test
 * for means, the F-test for spread, at each n of the table.
 */
export function planSampleSize(options: PlanOptionsInput): SamplePlan {
  const o = PlanOptions.parse(options);
  const { observed, ...settings } = o;
  const za = normalQuantile(1 - o.alpha / 2);
  const zb = normalQuantile(o.power);
  const notes: string[] = [];
  let cv: number | null = null;
  let standardized: number;
  let nExact: number;
  let powerExact: (n: number) => number;
  let powerNormal: (n: number) => number;
  let formula: string;
  if (o.quantity === "mean") {
    cv = o.cv ?? (o.sd !== undefined && o.mean !== undefined ? o.sd / o.mean : cvOf(observed!));
    standardized = Math.abs(o.effect) / cv;
    nExact = (2 * (za + zb) ** 2) / standardized ** 2;
    powerExact = (n) => twoSampleTTestPower(n, standardized, o.alpha);
    powerNormal = (n) => normalCdf(standardized * Math.sqrt(n / 2) - za);
    formula = "n = 2(z_{1−α/2} + z_{power})²·(CV/Δ)², refined with the noncentral t";
    notes.push("assumes equal embryo-to-embryo SD in both groups and roughly normal values; with a constant CV the larger group's SD grows with its mean, so add a margin for large Δ");
  } else {
    standardized = Math.abs(Math.log(1 + o.effect));
    nExact = 1 + (za + zb) ** 2 / standardized ** 2;
    powerExact = (n) => varianceRatioTestPower(n, 1 + o.effect, o.alpha);
    powerNormal = (n) => normalCdf(standardized * Math.sqrt(n - 1) - za);
    formula = "n = 1 + (z_{1−α/2} + z_{power})²/ln²(1 + Δ), refined with the F-test";
    notes.push("spread comparisons assume normal data; heavy tails or outlying embryos inflate the variance-ratio test's error rate, so bootstrap the SD ratio in the analysis itself");
    notes.push("σ_x from n embryos has a relative error of about 1/√(2(n − 1)) (Gregor et al. 2007, Cell)");
  }
  const nNormal = Math.max(2, Math.ceil(nExact - 1e-9));
  let n = nNormal;
  let capped = false;
  while (powerExact(n) < o.power) {
    if (n >= o.maxN) {
      capped = true;
      break;
    }
    n++;
  }
  while (!capped && n > 2 && powerExact(n - 1) >= o.power) n--;
  if (capped) notes.push(`the target power is not reached with ${o.maxN} embryos per group`);

  const sizes = o.nValues ?? defaultSizes(n, nNormal);
  const table = [...new Set(sizes)].sort((a, b) => a - b).map((size) => row(size, o, standardized, powerExact, powerNormal));
  return {
    settings,
    quantity: o.quantity,
    cv,
    standardized_effect: standardized,
    n_normal_exact: nExact,
    n_normal: nNormal,
    n_required: n,
    capped,
    table,
    formula,
    notes,
  };
}

function cvOf(values: number[]): number {
  const m = mean(values);
  if (!(m > 0)) throw new RangeError(`planSampleSize: observed values must have a positive mean, got ${m}`);
  return standardDeviation(values) / m;
}

function defaultSizes(n: number, nNormal: number): number[] {
  return [0.5, 0.75, 1, 1.25, 1.5, 2].map((f) => Math.max(2, Math.round(n * f))).concat([n, nNormal]);
}

function row(
  n: number, o: ResolvedPlanOptions, standardized: number,
  powerExact: (n: number) => number, powerNormal: (n: number) => number,
): PowerRow {
  const random = createRandom(deriveSeed(o.seed, `plan:${o.quantity}:${n}`));
  const simulated = o.quantity === "mean"
    ? simulateMeanPower({ nPerGroup: n, standardizedEffect: standardized, alpha: o.alpha, repetitions: o.simulations, test: "welch", random })
    : simulateSpreadPower({ nPerGroup: n, sdRatio: 1 + o.effect, alpha: o.alpha, repetitions: o.simulations, random });
  const permutation = o.quantity === "mean" && o.permutationSimulations > 0
    ? simulateMeanPower({
      nPerGroup: n, standardizedEffect: standardized, alpha: o.alpha, repetitions: o.permutationSimulations,
      test: "permutation", permutations: o.permutations, random: createRandom(deriveSeed(o.seed, `plan:permutation:${n}`)),
    })
    : null;
  return { n, power_analytic: powerExact(n), power_normal: Math.min(1, powerNormal(n)), power_simulated: simulated, power_permutation_simulated: permutation };
}
