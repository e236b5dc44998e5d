import type { Estimate } from "../../estimate.ts";
import { createRandom } from "../../random/seededRandom.ts";
import { mean, standardError } from "../../stats/descriptive.ts";
import { normalQuantile } from "../../stats/normal.ts";
import { studentTQuantile } from "../../stats/studentT.ts";
import { deriveSeed } from "../deriveSeed.ts";
import type { EmbryoRecord, ExcludedEmbryo } from "../embryoRecord.ts";
import { selectRecords } from "../selectRecords.ts";
import { summarizeMetric, type MetricSummary } from "../summarizeMetric.ts";
import { DosageOptions, type DosageOptionsInput, type ResolvedDosageOptions } from "./dosageOptions.ts";
import { fitLinearTrend } from "./linearTrend.ts";

export interface DosageLevel {
  /** Relative source dosage (1 = wild type). */
  dosage: number;
  n: number;
  boundary_um: MetricSummary | null;
}

export interface DosageResult {
  settings: Omit<ResolvedDosageOptions, "lambdaFitUm">;
  /** Embryos used (converged, with a positive dosage and a boundary). */
  n: number;
  dosages: DosageLevel[];
  /** Slope of boundary position on ln(dosage): λ from the shift, with its regression CI at `level`. */
  lambda_from_shift_um: Estimate | null;
  /** Intercept: the boundary position at dosage 1, in µm. */
  boundary_at_unit_dosage_um: Estimate | null;
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
 */
export function dosageSeries(records: readonly EmbryoRecord[], options: DosageOptionsInput = {}): DosageResult {
  const o = DosageOptions.parse(options);
  const { lambdaFitUm, ...settings } = o;
  const { used, excluded } = selectRecords(records, o.excludeStatuses);
  const out: ExcludedEmbryo[] = excluded.map(({ embryo, reason }) => ({ embryo, reason }));
  const series: EmbryoRecord[] = [];
  for (const r of used) {
    if (!(r.dosage !== undefined && Number.isFinite(r.dosage) && r.dosage > 0)) out.push({ embryo: r.embryo, reason: "no positive dosage" });
    else if (!(r.boundaryUm !== undefined && Number.isFinite(r.boundaryUm))) out.push({ embryo: r.embryo, reason: "no boundary position" });
    else series.push(r);
  }
  const warnings: string[] = [];
  const byDosage = new Map<number, number[]>();
  for (const r of series) byDosage.set(r.dosage!, [...(byDosage.get(r.dosage!) ?? []), r.boundaryUm!]);
  const dosages = [...byDosage.entries()].sort(([a], [b]) => a - b).map(([dosage, values]) => ({
    dosage,
    n: values.length,
    boundary_um: summarizeMetric(values, { ...o, random: createRandom(deriveSeed(o.seed, `dosage:${dosage}`)) }),
  }));

  let shift: Estimate | null = null;
  let intercept: Estimate | null = null;
  let r2: number | null = null;
  if (byDosage.size >= 2 && series.length >= 3) {
    const fit = fitLinearTrend(series.map((r) => Math.log(r.dosage!)), series.map((r) => r.boundaryUm!), o.level);
    shift = fit.slope;
    intercept = fit.intercept;
    r2 = fit.r2;
    if (fit.slope.value <= 0) warnings.push("the boundary does not move away from the source with more dosage; check that x is measured from the source and that boundaries are read at one threshold");
  } else {
    warnings.push(`a dosage series needs at least 2 dosages and 3 embryos with boundaries, got ${byDosage.size} dosage(s) and ${series.length} embryo(s)`);
  }
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
