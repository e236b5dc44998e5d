import type { LeftOut } from "../exclusions/exclusionService.ts";
import type { Profile } from "../../analysis/ensemble/profile.ts";
import { prepareEnsemble } from "../../analysis/ensemble/prepareEnsemble.ts";
import { ensembleMoments } from "../../analysis/precision/ensembleMoments.ts";
import { analysePrecision, type PrecisionResult } from "../../analysis/precision/analysePrecision.ts";
import { analyseJointPrecision, type JointPrecisionResult } from "../../analysis/precision/analyseJointPrecision.ts";
import type { PrecisionOptionsInput, SlopeModel } from "../../analysis/precision/precisionOptions.ts";
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
  /** The exponential fit to the mean used as the slope model, when requested. */
  slopeModel: { lambda: number; amplitude: number; background: number } | null;
  /** Embryos and profiles left out by an exclusion (added when stored). */
  left_out?: LeftOut[];
}

export function precisionOptions(request: PrecisionRequest, progress: ProgressCallback | undefined, slopeModel?: SlopeModel): PrecisionOptionsInput {
  return {
    coords: request.coords,
    grid: { spacing: request.spacing ?? null, range: request.range ?? null },
    normalisation: request.normalisation,
    flip: request.flip,
    derivative: slopeModel ? { method: "model", slopeModel } : { method: "savitzky-golay" },
    region: request.region ?? null,
    mask: request.mask,
    positions: request.positions,
    boundary: { threshold: request.threshold ?? null, atPosition: request.atPosition ?? null },
    information: { kernelDensity: request.kernelDensity },
    bootstrap: { resamples: request.bootstrap, seed: request.seed },
    onProgress: progress,
  };
}

/**
 * An exponential A·e^(−x/λ) + B fitted to the group's prepared mean profile
 * (same grid, normalisation and orientation as the analysis), whose slope
 * −(A/λ)·e^(−x/λ) replaces the smoothed derivative.
 */
function meanProfileModel(profiles: Profile[], request: PrecisionRequest): { model: SlopeModel; params: { lambda: number; amplitude: number; background: number } } {
  const prepared = prepareEnsemble(profiles, {
    grid: { coords: request.coords, spacing: request.spacing ?? null, range: request.range ?? null },
    normalisation: request.normalisation,
    flip: request.flip,
  });
  const mean = ensembleMoments(prepared.values).mean;
  const window = request.modelWindow ? { xMinUm: request.modelWindow[0], xMaxUm: request.modelWindow[1] } : undefined;
  const fit = fitProfile(prepared.grid.x, mean, FitOptions.parse({ model: "exponential", window }));
  if (!fit.ok) throw new UserError("model-derivative-failed", `The exponential fit to the mean profile failed (${fit.message}); use the Savitzky–Golay derivative instead.`, { status: 422 });
  const lambda = fit.parameters.lambdaUm.value;
  const amplitude = fit.parameters.amplitude.value;
  const background = fit.parameters.background.value;
  return {
    model: (xs) => ({
      value: xs.map((x) => amplitude * Math.exp(-x / lambda) + background),
      slope: xs.map((x) => (-amplitude / lambda) * Math.exp(-x / lambda)),
    }),
    params: { lambda, amplitude, background },
  };
}

/** Positional precision of each group (and jointly across channels). Pure: runs in a worker thread or in-process. */
export function runPrecisionTask(input: PrecisionTaskInput, progress: ProgressCallback = () => {}): PrecisionGroupOutput[] {
  const out: PrecisionGroupOutput[] = [];
  const steps = input.groups.reduce((s, g) => s + g.channels.length + (g.channels.length > 1 ? 1 : 0), 0);
  let step = 0;
  const sub = (label: string): ProgressCallback => (f, stage) => progress((step + f) / steps, `${label}: ${stage}`);
  for (const g of input.groups) {
    const perChannel: PrecisionGroupOutput["perChannel"] = [];
    let slopeParams: PrecisionGroupOutput["slopeModel"] = null;
    for (const c of g.channels) {
      if (c.profiles.length < 3) throw new UserError("too-few-embryos", `Group "${g.name}", channel "${c.channel}": ${c.profiles.length} embryo(s); positional error needs at least 3.`, { status: 422 });
      let slope: SlopeModel | undefined;
      if (input.request.derivative === "model") {
        const m = meanProfileModel(c.profiles, input.request);
        slope = m.model;
        slopeParams = m.params;
      }
      const options = { ...precisionOptions(input.request, sub(`${g.name}/${c.channel}`), slope), embryoSummaries: g.embryoSummaries };
      perChannel.push({ channel: c.channel, result: wrapRangeErrors(() => analysePrecision(c.profiles, options), g.name) });
      step++;
    }
    let joint: JointPrecisionResult | null = null;
    if (g.channels.length > 1) {
      const options = precisionOptions({ ...input.request, derivative: "savitzky-golay" }, sub(`${g.name}/joint`));
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
