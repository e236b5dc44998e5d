import { normalCdf } from "../stats/normal.ts";
import { studentTTwoSidedP } from "../stats/studentT.ts";
import { formatNumber } from "./formatNumber.ts";

/** Below this p-value a residual check warns (1%: one false alarm in a hundred fits). */
export const RESIDUAL_CHECK_ALPHA = 0.01;

export interface ResidualCheck {
  /**
   * Spearman rank correlation between |residual| and the fitted intensity,
   * with its two-sided p-value: a positive, significant value means the
   * noise grows with the intensity. Null with fewer than 5 points.
   */
  intensityTrend: { spearman: number; p: number } | null;
  /** Runs of residual signs along x against their expectation for independent noise (one-sided p for too few runs). Null when all residuals share a sign or with fewer than 5 points. */
  runs: { runs: number; expected: number; z: number; p: number } | null;
  /** What the checks say: "ok", or the problems found. */
  verdict: ("ok" | "noise-grows-with-intensity" | "systematic-residuals")[];
}

/**
 * Check a fit's residuals (in x order) against its error model: does |r|
 * trend with the fitted intensity (heteroscedasticity: Spearman rank
 * correlation, p from the t approximation t = ρ√((n−2)/(1−ρ²)) as in
 * scipy.stats.spearmanr), and do the signs come in fewer runs than
 * independent noise would give (Wald–Wolfowitz runs test, normal
 * approximation: Wald & Wolfowitz 1940, Ann Math Stat)? Adds warnings that
 * say how to fix what is wrong: constant-noise ("classic") error bars under
 * noise that grows with the intensity; any error bars when residuals are
 * systematic (wrong model or window, or noise correlated along the profile).
 * `segments` lists where each further profile starts, for a global fit:
 * runs are counted within each profile.
 */
export function residualCheck(
  fitted: ArrayLike<number>,
  residuals: ArrayLike<number>,
  errorModel: "hc3" | "classic",
  warnings: string[],
  label = "",
  segments: readonly number[] = [],
): ResidualCheck {
  const n = residuals.length;
  const verdict: ResidualCheck["verdict"] = [];
  let intensityTrend: ResidualCheck["intensityTrend"] = null;
  let runs: ResidualCheck["runs"] = null;
  if (n >= 5) {
    const rho = spearman(Array.from(fitted), Array.from(residuals, Math.abs));
    if (Number.isFinite(rho)) {
      const p = Math.abs(rho) >= 1 ? 0 : studentTTwoSidedP(rho * Math.sqrt((n - 2) / (1 - rho * rho)), n - 2);
      intensityTrend = { spearman: rho, p };
      if (rho > 0 && p < RESIDUAL_CHECK_ALPHA) {
        verdict.push("noise-grows-with-intensity");
        if (errorModel === "classic")
          warnings.push(
            `${label}the residuals grow with the fitted intensity (Spearman ρ = ${formatNumber(rho)}, p = ${formatNumber(p)}), so the noise is not constant and the classic error bars are too narrow where it matters; use the default error model "hc3" or Poisson weights`,
          );
      }
    }
    // Runs counted within each segment (profile); counts, expectations and variances add.
    let count = 0;
    let expected = 0;
    let variance = 0;
    let signs = 0;
    const bounds = [...segments.filter((b) => b > 0 && b < n), n];
    let from = 0;
    for (const to of bounds) {
      let positive = 0;
      let negative = 0;
      let segmentRuns = 0;
      let last = 0;
      for (let i = from; i < to; i++) {
        const s = Math.sign(residuals[i]);
        if (s === 0) continue;
        if (s > 0) positive++;
        else negative++;
        if (s !== last) segmentRuns++;
        last = s;
      }
      from = to;
      const total = positive + negative;
      if (positive === 0 || negative === 0 || total < 2) continue;
      count += segmentRuns;
      signs += total;
      expected += 1 + (2 * positive * negative) / total;
      variance += (2 * positive * negative * (2 * positive * negative - total)) / (total * total * (total - 1));
    }
    if (signs >= 5 && variance > 0) {
      const z = (count - expected) / Math.sqrt(variance);
      const p = normalCdf(z);
      runs = { runs: count, expected, z, p };
      if (p < RESIDUAL_CHECK_ALPHA) {
        verdict.push("systematic-residuals");
        warnings.push(
          `${label}the residuals run in long stretches of one sign (${count} runs where independent noise gives about ${formatNumber(expected)}, p = ${formatNumber(p)}): the model or window misses a systematic shape, or the noise is correlated along the profile (e.g. a smoothed or averaged profile), and the error bars are then too narrow; compare models (--model all), narrow the window, or fit unsmoothed profiles`,
        );
      }
    }
  }
  if (verdict.length === 0) verdict.push("ok");
  return { intensityTrend, runs, verdict };
}

/** Spearman rank correlation (average ranks for ties). */
function spearman(a: number[], b: number[]): number {
  const ra = ranks(a);
  const rb = ranks(b);
  const n = a.length;
  const ma = (n + 1) / 2;
  let sab = 0;
  let saa = 0;
  let sbb = 0;
  for (let i = 0; i < n; i++) {
    sab += (ra[i] - ma) * (rb[i] - ma);
    saa += (ra[i] - ma) ** 2;
    sbb += (rb[i] - ma) ** 2;
  }
  return saa > 0 && sbb > 0 ? sab / Math.sqrt(saa * sbb) : NaN;
}

function ranks(values: number[]): number[] {
  const order = values.map((_, i) => i).sort((i, j) => values[i] - values[j]);
  const out = new Array<number>(values.length);
  for (let k = 0; k < order.length; ) {
    let m = k;
    while (m + 1 < order.length && values[order[m + 1]] === values[order[k]]) m++;
    const rank = (k + m) / 2 + 1;
    for (let t = k; t <= m; t++) out[order[t]] = rank;
    k = m + 1;
  }
  return out;
}
