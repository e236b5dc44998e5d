import type { LeftOut } from "../exclusions/exclusionService.ts";
import type { Profile } from "../../analysis/ensemble/profile.ts";
import { prepareEnsemble } from "../../analysis/ensemble/prepareEnsemble.ts";
import { ensembleMoments } from "../../analysis/precision/ensembleMoments.ts";
import { analysePrecision, type PrecisionResult } from "../../analysis/precision/analysePrecision.ts";
import { analyseJointPrecision, type JointPrecisionResult } from "../../analysis/precision/analyseJointPrecision.ts";
import { PrecisionOptions, type PrecisionOptionsInput, type SlopeModel, type SlopeRefit } from "../../analysis/precision/precisionOptions.ts";
import { chooseGrid } from "../../analysis/ensemble/chooseGrid.ts";
import { defaultRegionRange } from "../../analysis/precision/analysisRegion.ts";
import { FitOptions } from "../../analysis/fit/fitOptions.ts";
import { fitProfile } from "../../analysis/fit/fitProfile.ts";
import type { ProgressCallback } from "../../jobs/jobTypes.ts";
import { UserError } from "../../userError.ts";
import type { PrecisionRequest } from "./precisionRequest.ts";

export interface PrecisionTaskGroup {
  name: string;
  channels: { channel: string; profiles: Profile[]; profileIds: number[] }[];
  /** Per-embryo summaries (e.g. fitted λ) screened for outliers and used for length scaling. */
  embryoSummaries: Record<string, Record<string, number>>;
}

export interface PrecisionTaskInput {
  request: PrecisionRequest;
  groups: PrecisionTaskGroup[];
  /** Per group, the embryos and profiles left out by an exclusion, with the reasons. */
  leftOut?: Record<string, LeftOut[]>;
}

export interface PrecisionGroupOutput {
  name: string;
  channels: string[];
  profileIds: number[];
  /** One result per channel. */
  perChannel: { channel: string; result: PrecisionResult }[];
  /** Joint positional error when several channels were asked for. */
  joint: JointPrecisionResult | null;
  /** The exponential fit to the mean used as the slope model, when requested, with its fit window (grid units). */
  slopeModel: { lambda: number; amplitude: number; background: number; window: [number, number] } | null;
  /** Embryos and profiles left out by an exclusion (added when stored). */
  left_out?: LeftOut[];
}

export function precisionOptions(
  request: PrecisionRequest,
  progress: ProgressCallback | undefined,
  commonSpan: [number, number] | null,
  model?: { slopeModel: SlopeModel; refit: SlopeRefit },
): PrecisionOptionsInput {
  return {
    coords: request.coords,
    grid: { spacing: request.spacing ?? null, range: request.range ?? null },
    normalisation: request.normalisation,
    flip: request.flip,
    derivative: model ? { method: "model", slopeModel: model.slopeModel, refit: model.refit } : { method: "savitzky-golay" },
    region: request.region ?? null,
    regionDefault: { span: commonSpan },
    mask: request.mask,
    positions: request.positions,
    boundary: { threshold: request.threshold ?? null, atPosition: request.atPosition ?? null },
    information: { kernelDensity: request.kernelDensity },
    bootstrap: { resamples: request.bootstrap, seed: request.seed },
    onProgress: progress,
  };
}

/**
 * The span every selected profile covers (all groups and channels), in grid units: the default
 * region is cut from it, so every group in one analysis gets the same region.
 */
export function commonSpan(input: PrecisionTaskInput): [number, number] {
  const all = input.groups.flatMap((g) => g.channels.flatMap((c) => c.profiles));
  return wrapRangeErrors(() => chooseGrid(all, { coords: input.request.coords, spacing: null, range: input.request.range ?? null }).range, "all groups together");
}

/** The fit window of the model derivative: the request's window (open ends taken from the region), or the region. */
function modelWindowOf(request: PrecisionRequest, region: [number, number]): [number, number] {
  return [request.modelWindow?.from ?? region[0], request.modelWindow?.to ?? region[1]];
}

/** Exponential A·e^(−x/λ) + B fitted to a mean profile inside a window; null when the fit fails. */
function fitExponential(xs: ArrayLike<number>, mean: ArrayLike<number>, window: [number, number]) {
  const fit = fitProfile(Float64Array.from(xs), Float64Array.from(mean), FitOptions.parse({ model: "exponential", window: { xMinUm: window[0], xMaxUm: window[1] } }));
  if (!fit.ok) return { ok: false as const, message: fit.message };
  const lambda = fit.parameters.lambdaUm.value;
  const amplitude = fit.parameters.amplitude.value;
  const background = fit.parameters.background.value;
  return {
    ok: true as const,
    params: { lambda, amplitude, background },
    value: (x: number) => amplitude * Math.exp(-x / lambda) + background,
    slope: (x: number) => (-amplitude / lambda) * Math.exp(-x / lambda),
  };
}

/**
 * An exponential A·e^(−x/λ) + B fitted to the group's prepared mean profile
 * (same grid, normalisation and orientation as the analysis) inside the fit window,
 * whose slope −(A/λ)·e^(−x/λ) replaces the smoothed derivative; bootstrap resamples refit it.
 */
function meanProfileModel(profiles: Profile[], request: PrecisionRequest, window: [number, number]) {
  const prepared = prepareEnsemble(profiles, {
    grid: { coords: request.coords, spacing: request.spacing ?? null, range: request.range ?? null },
    normalisation: request.normalisation,
    flip: request.flip,
  });
  const mean = ensembleMoments(prepared.values).mean;
  const fit = fitExponential(prepared.grid.x, mean, window);
  if (!fit.ok) throw new UserError("model-derivative-failed", `The exponential fit to the mean profile between ${window[0]} and ${window[1]} failed (${fit.message}); give another --window or use the Savitzky–Golay derivative.`, { status: 422 });
  const slopeModel: SlopeModel = (xs) => ({ value: xs.map(fit.value), slope: xs.map(fit.slope) });
  const refit: SlopeRefit = (xs, m) => {
    const again = fitExponential(xs, m, window);
    return again.ok ? xs.map(again.slope) : null;
  };
  return { slopeModel, refit, params: { ...fit.params, window } };
}

/** Positional precision of each group (and jointly across channels). Pure: runs in a worker thread or in-process. */
export function runPrecisionTask(input: PrecisionTaskInput, progress: ProgressCallback = () => {}): PrecisionGroupOutput[] {
  const out: PrecisionGroupOutput[] = [];
  const span = commonSpan(input);
  const trim = PrecisionOptions.shape.regionDefault.parse({}).trimFraction;
  const region = input.request.region ?? defaultRegionRange(span, trim);
  const steps = input.groups.reduce((s, g) => s + g.channels.length + (g.channels.length > 1 ? 1 : 0), 0);
  let step = 0;
  const sub = (label: string): ProgressCallback => (f, stage) => progress((step + f) / steps, `${label}: ${stage}`);
  for (const g of input.groups) {
    const perChannel: PrecisionGroupOutput["perChannel"] = [];
    let slopeParams: PrecisionGroupOutput["slopeModel"] = null;
    for (const c of g.channels) {
      if (c.profiles.length < 3) throw new UserError("too-few-embryos", `Group "${g.name}", channel "${c.channel}": ${c.profiles.length} embryo(s); positional error needs at least 3.`, { status: 422 });
      let model: { slopeModel: SlopeModel; refit: SlopeRefit } | undefined;
      if (input.request.derivative === "model") {
        const m = wrapRangeErrors(() => meanProfileModel(c.profiles, input.request, modelWindowOf(input.request, region)), g.name);
        model = m;
        slopeParams = m.params;
      }
      const options = { ...precisionOptions(input.request, sub(`${g.name}/${c.channel}`), span, model), embryoSummaries: g.embryoSummaries };
      perChannel.push({ channel: c.channel, result: wrapRangeErrors(() => analysePrecision(c.profiles, options), g.name) });
      step++;
    }
    let joint: JointPrecisionResult | null = null;
    if (g.channels.length > 1) {
      const options = precisionOptions({ ...input.request, derivative: "savitzky-golay" }, sub(`${g.name}/joint`), span);
      joint = wrapRangeErrors(() => analyseJointPrecision(g.channels.map((c) => ({ name: c.channel, profiles: c.profiles })), options), g.name);
      step++;
    }
    out.push({
      name: g.name,
      channels: g.channels.map((c) => c.channel),
      profileIds: g.channels.flatMap((c) => c.profileIds),
      perChannel,
      joint,
      slopeModel: slopeParams,
    });
  }
  return out;
}

/** The analysis signals unusable input with RangeError naming embryo and field: that is the user's data, so a 422. */
function wrapRangeErrors<T>(f: () => T, group: string): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof RangeError) throw new UserError("precision-input", `Group "${group}": ${e.message}`, { status: 422 });
    throw e;
  }
}
