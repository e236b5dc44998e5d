import type { Estimate } from "../../estimate.ts";
import { createRandom } from "../../random/seededRandom.ts";
import { mean, standardError } from "../../stats/descriptive.ts";
import { normalQuantile } from "../../stats/normal.ts";
import { studentTQuantile } from "../../stats/studentT.ts";
import { deriveSeed } from "../deriveSeed.ts";
import type { EmbryoRecord, ExcludedEmbryo } from "../embryoRecord.ts";
import { selectRecords } from "../selectRecords.ts";
import { censoredRegression } from "../../stats/censoredRegression.ts";
import { summarizeMetric, type MetricSummary } from "../summarizeMetric.ts";
import { DosageOptions, type DosageOptionsInput, type ResolvedDosageOptions } from "./dosageOptions.ts";
import { fitLinearTrend } from "./linearTrend.ts";

export interface DosageLevel {
  /** Relative source dosage (1 = wild type). */
  dosage: number;
  /** Embryos whose profile crossed the threshold (those summarised in boundary_um). */
  n: number;
  /** Every embryo of this dosage in the series, crossed or not. */
  n_embryos: number;
  /** Embryos that never crossed: starting below the threshold, or never falling below it. */
  no_crossing: { before_start: number; beyond_end: number };
  /** Summary of the crossed boundaries only; biased towards the far end when embryos start below the threshold. */
  boundary_um: MetricSummary | null;
}

export interface DosageResult {
  settings: Omit<ResolvedDosageOptions, "lambdaFitUm">;
  /** Embryos used (converged, with a positive dosage, and a boundary or a censored reading). */
  n: number;
  /** Embryos that never crossed the threshold, over all dosages. */
  no_crossing: { before_start: number; beyond_end: number };
  /** How the shift was estimated: least squares when every embryo crossed, else censored-normal maximum likelihood. */
  shift_method: string | null;
  /** Why the shift was not estimated, when it was refused. */
  shift_refused: string | null;
  dosages: DosageLevel[];
  /** Slope of boundary position on ln(dosage): λ from the shift, with its regression CI at `level`. */
  lambda_from_shift_um: Estimate | null;
  /** Intercept: the boundary position at dosage 1, in µm (of the whole line, censored embryos included). */
  boundary_at_unit_dosage_um: Estimate | null;
  /** Coefficient of determination of the least-squares fit; null when censored embryos make it undefined. */
  r2: number | null;
  /** λ from profile fits: the supplied estimate or the mean of the series' per-embryo λ. */
  lambda_from_fit_um: Estimate | null;
  lambda_fit_source: "supplied" | "embryo_mean" | null;
  /** λ_shift − λ_fit with a normal-theory CI from the two SEs. */
  difference_um: Estimate | null;
  /** Whether the CI of the difference contains 0; null when it cannot be formed. */
  agree: boolean | null;
  /** The conditions under which the shift measures λ. */
  assumptions: string[];
  warnings: string[];
  excluded: ExcludedEmbryo[];
}

const ASSUMPTIONS = [
  "the gradient is exponential, c = A·e^(−x/λ), with linear degradation (for nonlinear decay the shift is not λ·ln f)",
  "the gradient is at steady state in every line",
  "boundaries lie far from a no-flux far end of the tissue (within ~2λ of it the profile flattens)",
  "the boundary is read at the same threshold in every line and the dosage scales the source amplitude only",
];

/**
 * Dosage series: for an exponential gradient read at a fixed threshold θ,
 * x_b = λ·ln(A·f/θ), so multiplying the source by f shifts the boundary by
 * Δx = λ·ln f and the slope of x_b on ln f estimates λ (Driever &
 * Nüsslein-Volhard 1988, Cell; Houchmandzadeh, Wieschaus & Leibler 2002,
 * Nature). The slope comes from OLS on the per-embryo boundaries, with a
 * t-based CI; it is set beside λ from the profile fits, and the two agree
 * when the CI of their difference contains 0.
 *
 * Embryos whose profile never crosses the threshold are not missing at
 * random (at low dosage they are the low-amplitude ones), so dropping them
 * biases the low-dosage boundary away from the source and λ low. They are
 * counted per dosage and kept as censored values: the line is fitted by
 * censored-normal maximum likelihood (Tobin 1958, Econometrica), which equals
 * OLS when nothing is censored. When more than `maxUncrossedFraction` of one
 * dosage's embryos never cross, the shift is refused instead.
 */
export function dosageSeries(records: readonly EmbryoRecord[], options: DosageOptionsInput = {}): DosageResult {
  const o = DosageOptions.parse(options);
  const { lambdaFitUm, ...settings } = o;
  const { used, excluded } = selectRecords(records, o.excludeStatuses);
  const out: ExcludedEmbryo[] = excluded.map(({ embryo, reason }) => ({ embryo, reason }));
  const series: EmbryoRecord[] = [];
  for (const r of used) {
    if (!(r.dosage !== undefined && Number.isFinite(r.dosage) && r.dosage > 0)) out.push({ embryo: r.embryo, reason: "no positive dosage" });
    else if (r.boundaryUm !== undefined && Number.isFinite(r.boundaryUm)) series.push(r);
    else if (r.boundaryCensored !== undefined && r.boundaryLimitUm !== undefined && Number.isFinite(r.boundaryLimitUm)) series.push(r);
    else out.push({ embryo: r.embryo, reason: "no boundary position" });
  }
  const warnings: string[] = [];
  const byDosage = new Map<number, EmbryoRecord[]>();
  for (const r of series) byDosage.set(r.dosage!, [...(byDosage.get(r.dosage!) ?? []), r]);
  const dosages: DosageLevel[] = [...byDosage.entries()].sort(([a], [b]) => a - b).map(([dosage, rs]) => {
    const crossed = rs.filter((r) => r.boundaryCensored === undefined).map((r) => r.boundaryUm!);
    return {
      dosage,
      n: crossed.length,
      n_embryos: rs.length,
      no_crossing: { before_start: rs.filter((r) => r.boundaryCensored === "before_start").length, beyond_end: rs.filter((r) => r.boundaryCensored === "beyond_end").length },
      boundary_um: summarizeMetric(crossed, { ...o, random: createRandom(deriveSeed(o.seed, `dosage:${dosage}`)) }),
    };
  });
  const noCrossing = {
    before_start: dosages.reduce((s, d) => s + d.no_crossing.before_start, 0),
    beyond_end: dosages.reduce((s, d) => s + d.no_crossing.beyond_end, 0),
  };
  const censored = noCrossing.before_start + noCrossing.beyond_end;
  const crossedTotal = series.length - censored;
  if (censored > 0) {
    const per = dosages.filter((d) => d.n < d.n_embryos).map((d) => `dosage ${d.dosage}: ${d.n_embryos - d.n} of ${d.n_embryos}`).join("; ");
    warnings.push(`${censored} of ${series.length} embryos never crossed the threshold (${per}); they are kept as censored values (their boundary lies before the first or beyond the last measured position), not dropped, and the per-dosage mean boundaries summarise only the embryos that crossed`);
  }

  let shift: Estimate | null = null;
  let intercept: Estimate | null = null;
  let r2: number | null = null;
  let method: string | null = null;
  let refused: string | null = null;
  const worst = dosages.reduce<DosageLevel | null>((w, d) => (w === null || 1 - d.n / d.n_embryos > 1 - w.n / w.n_embryos ? d : w), null);
  const dosagesWithCrossings = dosages.filter((d) => d.n > 0).length;
  if (byDosage.size < 2 || series.length < 3 || crossedTotal < 2) {
    warnings.push(`a dosage series needs at least 2 dosages and 3 embryos with boundaries, got ${byDosage.size} dosage(s) and ${series.length} embryo(s) (${crossedTotal} crossing the threshold)`);
  } else if (worst && 1 - worst.n / worst.n_embryos > o.maxUncrossedFraction) {
    refused = `at dosage ${worst.dosage}, ${worst.n_embryos - worst.n} of ${worst.n_embryos} embryos never crossed the threshold, more than the limit of ${Math.round(o.maxUncrossedFraction * 100)}%; the shift is not estimated because that dosage's boundary would rest on an assumed distribution. Choose a lower threshold (or leave that dosage out)`;
    warnings.push(refused);
  } else if (dosagesWithCrossings < 2) {
    refused = "fewer than 2 dosages have embryos that cross the threshold; the shift is not estimated";
    warnings.push(refused);
  } else if (censored === 0) {
    const fit = fitLinearTrend(series.map((r) => Math.log(r.dosage!)), series.map((r) => r.boundaryUm!), o.level);
    shift = fit.slope;
    intercept = fit.intercept;
    r2 = fit.r2;
    method = "least squares of boundary on ln(dosage), t interval (every embryo crossed the threshold)";
  } else {
    const fit = censoredRegression(series.map((r) => ({
      t: Math.log(r.dosage!),
      y: r.boundaryCensored === undefined ? r.boundaryUm! : r.boundaryLimitUm!,
      kind: r.boundaryCensored === undefined ? "observed" as const : r.boundaryCensored === "before_start" ? "below" as const : "above" as const,
    })));
    const q = studentTQuantile(0.5 + o.level / 2, series.length - 2);
    const at = (value: number, variance: number): Estimate => {
      const se = Math.sqrt(variance);
      return { value, se, ci95: [value - q * se, value + q * se] };
    };
    shift = at(fit.slope, fit.covariance[1][1]);
    intercept = at(fit.intercept, fit.covariance[0][0]);
    method = `censored-normal maximum likelihood of boundary on ln(dosage) with ${censored} embryo(s) censored at the measured span, t interval with n − 2 df`;
    if (!fit.converged) warnings.push("the censored fit of the boundary shift did not converge; treat λ from the shift with caution");
  }
  if (shift && shift.value <= 0) warnings.push("the boundary does not move away from the source with more dosage; check that x is measured from the source and that boundaries are read at one threshold");
  if (byDosage.size === 2) warnings.push("only 2 dosages: the exponential form (boundary linear in ln dosage) cannot be checked");

  let fitLambda: Estimate | null = null;
  let source: DosageResult["lambda_fit_source"] = null;
  if (lambdaFitUm) {
    fitLambda = lambdaFitUm;
    source = "supplied";
  } else {
    const lambdas = series.map((r) => r.lambdaUm);
    if (lambdas.length >= 2) {
      const m = mean(lambdas);
      const se = standardError(lambdas);
      const q = studentTQuantile(0.5 + o.level / 2, lambdas.length - 1);
      fitLambda = { value: m, se, ci95: [m - q * se, m + q * se] };
      source = "embryo_mean";
    }
  }

  let difference: Estimate | null = null;
  let agree: boolean | null = null;
  const seFit = fitLambda ? seOf(fitLambda) : null;
  if (shift && fitLambda && shift.se !== null && seFit !== null) {
    const value = shift.value - fitLambda.value;
    const se = Math.hypot(shift.se, seFit);
    const z = normalQuantile(0.5 + o.level / 2);
    difference = { value, se, ci95: [value - z * se, value + z * se] };
    agree = difference.ci95![0] <= 0 && difference.ci95![1] >= 0;
  }
  return {
    settings,
    n: series.length,
    no_crossing: noCrossing,
    shift_method: method,
    shift_refused: refused,
    dosages,
    lambda_from_shift_um: shift,
    boundary_at_unit_dosage_um: intercept,
    r2,
    lambda_from_fit_um: fitLambda,
    lambda_fit_source: source,
    difference_um: difference,
    agree,
    assumptions: ASSUMPTIONS,
    warnings,
    excluded: out,
  };
}

/** SE of a supplied estimate; from its 95% CI when no SE is given. */
function seOf(e: Estimate): number | null {
  if (e.se !== null) return e.se;
  if (e.ci95) return (e.ci95[1] - e.ci95[0]) / (2 * 1.959963984540054);
  return null;
}
