import { createHash } from "node:crypto";
import { storeAnalysis } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import { fitFrapCurve, type FrapFit } from "../../analysis/dynamics/frap/fitFrapCurve.ts";
import type { FrapFitOptions } from "../../analysis/dynamics/frap/frapFitOptions.ts";
import { normaliseRecovery, type NormalisedRecovery } from "../../analysis/dynamics/frap/normaliseRecovery.ts";
import type { Estimate } from "../../analysis/estimate.ts";
import { tQuantile95 } from "../../analysis/fit/tQuantile95.ts";
import { parseFrapTable } from "../../import/parseFrapTable.ts";
import { UserError } from "../../userError.ts";
import { ENGINE_VERSION } from "../../version.ts";
import type { FrapRequest } from "./dynamicsRequests.ts";
import { emptyQuantities, est, frapCaveat, type DynamicsQuantities, type EstimateJson } from "./dynamicsJson.ts";

export interface FrapCurveInput {
  name: string;
  sha256: string;
  columns: Record<string, string>;
  curve: NormalisedRecovery;
}

export interface FrapTaskInput {
  options: FrapFitOptions;
  curves: FrapCurveInput[];
}

/** Read and normalise every table; a table that cannot be read stops the whole request (nothing is stored). */
export function prepareFrap(request: FrapRequest): FrapTaskInput {
  const names = new Set<string>();
  const curves = request.files.map((f) => {
    if (names.has(f.name)) throw new UserError("duplicate-file", `${f.name}: the same file name was given twice`);
    names.add(f.name);
    const { raw, columns } = parseFrapTable(f.text, f.name);
    return { name: f.name, sha256: createHash("sha256").update(f.text).digest("hex"), columns, curve: normaliseRecovery(raw) };
  });
  return { options: request.options, curves };
}

export interface FrapTaskOutput {
  fits: FrapFit[];
}

export function runFrapTask(input: FrapTaskInput): FrapTaskOutput {
  return { fits: input.curves.map((c) => fitFrapCurve(c.curve, input.options)) };
}

export interface FrapCurveJson {
  name: string;
  status: "ok" | "failed";
  message: string;
  D_um2_per_s: EstimateJson | null;
  mobile_fraction: EstimateJson | null;
  half_time_s: EstimateJson | null;
  post_bleach_intensity: EstimateJson | null;
  k_per_s: EstimateJson | null;
  residual_sd: number | null;
  correlation_D_mobile: number | null;
  normalisation: string[];
  pre_bleach_frames: number;
  warnings: string[];
  points: { t_s: number; value: number; fitted: number | null }[];
}

export interface FrapJson extends DynamicsQuantities {
  analysis_id: number;
  n_curves: number;
  n_fitted: number;
  /** How the summary was formed from the curves. */
  summary_method: string;
  curves: FrapCurveJson[];
  settings: FrapFitOptions;
  caveat: string;
}

/**
 * Summary over cells: one curve → its fit; several → mean over the fitted
 * curves with SE = SD/√n and a t-interval on n − 1 degrees of freedom (cells
 * are the replicates; common practice, no source).
 */
function summarise(values: number[], single: Estimate | null): EstimateJson | null {
  if (values.length === 0) return null;
  if (values.length === 1) return est(single);
  const n = values.length;
  const mean = values.reduce((a, b) => a + b, 0) / n;
  const sd = Math.sqrt(values.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1));
  const se = sd / Math.sqrt(n);
  const t = tQuantile95(n - 1);
  return { value: mean, se, ci95: [mean - t * se, mean + t * se] };
}

export function storeFrap(db: Db, input: FrapTaskInput, output: FrapTaskOutput): FrapJson {
  const curves: FrapCurveJson[] = input.curves.map((c, i) => {
    const f = output.fits[i];
    const common = { name: c.name, normalisation: c.curve.steps, pre_bleach_frames: c.curve.preBleachFrames };
    if (!f.ok)
      return { ...common, status: "failed", message: f.reason, D_um2_per_s: null, mobile_fraction: null, half_time_s: null, post_bleach_intensity: null, k_per_s: null, residual_sd: null, correlation_D_mobile: null, warnings: [], points: c.curve.timesS.map((t, j) => ({ t_s: t, value: c.curve.values[j], fitted: null })) };
    return {
      ...common,
      status: "ok",
      message: "fitted",
      D_um2_per_s: est(f.diffusionUm2PerS),
      mobile_fraction: est(f.mobileFraction),
      half_time_s: est(f.halfTimeS),
      post_bleach_intensity: est(f.postBleachIntensity),
      k_per_s: est(f.degradationPerS),
      residual_sd: f.residualSd,
      correlation_D_mobile: Number.isFinite(f.correlationDMobile) ? f.correlationDMobile : null,
      warnings: f.warnings,
      points: c.curve.timesS.map((t, j) => ({ t_s: t, value: c.curve.values[j], fitted: f.fitted[j] })),
    };
  });
  const ok = output.fits.filter((f): f is Extract<FrapFit, { ok: true }> => f.ok);
  const first = ok.length === 1 ? ok[0] : null;
  const result = {
    ...emptyQuantities(),
    n_curves: curves.length,
    n_fitted: ok.length,
    summary_method: ok.length > 1 ? `mean over ${ok.length} curves (cells), SE = SD/√n, t-interval` : "the single curve's fit",
    D_um2_per_s: summarise(ok.map((f) => f.diffusionUm2PerS.value), first?.diffusionUm2PerS ?? null),
    mobile_fraction: summarise(ok.map((f) => f.mobileFraction.value), first?.mobileFraction ?? null),
    half_time_s: summarise(ok.map((f) => f.halfTimeS.value), first?.halfTimeS ?? null),
    k_per_s: input.options.degradation.mode === "fit" ? summarise(ok.map((f) => f.degradationPerS!.value), first?.degradationPerS ?? null) : null,
    curves,
    settings: input.options,
    caveat: frapCaveat,
  };
  const id = storeAnalysis(db, {
    kind: "frap",
    selection: { files: input.curves.map((c) => ({ name: c.name, sha256: c.sha256, columns: c.columns })) },
    settings: input.options,
    engineVersion: ENGINE_VERSION,
    result,
    profileIds: [],
  });
  return { analysis_id: id, ...result };
}
