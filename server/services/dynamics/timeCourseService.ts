import { storeAnalysis } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import { loadProfiles } from "../../../db/profiles.ts";
import { fitBuildUp, type BuildUpFitResult } from "../../analysis/dynamics/buildUp/fitBuildUp.ts";
import type { BuildUpFitOptions } from "../../analysis/dynamics/buildUp/buildUpFitOptions.ts";
import { UserError } from "../../userError.ts";
import { ENGINE_VERSION } from "../../version.ts";
import { describeSelection, selectionFilter } from "../selection.ts";
import type { TimeCourseRequest } from "./dynamicsRequests.ts";
import { emptyQuantities, est, type DynamicsQuantities } from "./dynamicsJson.ts";

export interface TimeCourseGroupInput {
  genotype: string;
  channel: string;
  profileIds: number[];
  embryos: string[];
  timesS: number[];
  xUm: number[];
  values: number[];
}

export interface TimeCourseTaskInput {
  selection: TimeCourseRequest["selection"];
  options: BuildUpFitOptions;
  groups: TimeCourseGroupInput[];
}

/** Read the selected profiles that carry a time, one group per genotype × channel. */
export function prepareTimeCourse(db: Db, request: TimeCourseRequest): TimeCourseTaskInput {
  const all = loadProfiles(db, selectionFilter(request.selection));
  const timed = all.filter((p) => p.timeS !== null);
  if (timed.length === 0)
    throw new UserError(
      "nothing-selected",
      `No stored profiles with a time point match ${describeSelection(request.selection)}${all.length > 0 ? ` (${all.length} profiles match but none has a time)` : ""}. Import build-up profiles with a "time" column (seconds since production started).`,
      { status: 404 },
    );
  const groups = new Map<string, TimeCourseGroupInput>();
  for (const p of timed) {
    const key = `${p.genotype}\u0000${p.channel}`;
    let g = groups.get(key);
    if (!g) {
      g = { genotype: p.genotype, channel: p.channel, profileIds: [], embryos: [], timesS: [], xUm: [], values: [] };
      groups.set(key, g);
    }
    g.profileIds.push(p.profileId);
    if (!g.embryos.includes(p.embryo)) g.embryos.push(p.embryo);
    for (let i = 0; i < p.positionsUm.length; i++) {
      g.timesS.push(p.timeS as number);
      g.xUm.push(p.positionsUm[i]);
      g.values.push(p.intensities[i]);
    }
  }
  return { selection: request.selection, options: request.options, groups: [...groups.values()] };
}

export interface TimeCourseGroupOutput {
  genotype: string;
  channel: string;
  fit: BuildUpFitResult;
}

/** Pure: fit each group. */
export function runTimeCourseTask(input: TimeCourseTaskInput): TimeCourseGroupOutput[] {
  return input.groups.map((g) => ({
    genotype: g.genotype,
    channel: g.channel,
    fit: fitBuildUp({ xUm: Float64Array.from(g.xUm), tS: Float64Array.from(g.timesS), values: Float64Array.from(g.values) }, input.options),
  }));
}

export interface TimeCourseGroupJson extends DynamicsQuantities {
  analysis_id: number;
  genotype: string;
  channel: string;
  status: "ok" | "failed";
  message: string;
  n_profiles: number;
  n_embryos: number;
  times_s: number[];
  source_strength: (ReturnType<typeof est> & { unit: string }) | null;
  background: ReturnType<typeof est>;
  correlation_D_k: number | null;
  identifiable: boolean | null;
  profile_likelihood_k: { k_per_s: number; D_um2_per_s: number; deviance: number }[];
  profile_interval_k: [number | null, number | null] | null;
  warnings: string[];
  /** Observations with the fitted curve and residual, for figures. */
  points: { x_um: number; t_s: number; value: number; fitted: number }[];
  settings: BuildUpFitOptions;
  caveat: string;
}

const caveat =
  "D and k come from how the gradient builds up over time, assuming production started at t = 0 and D, k and the source stayed constant; profiles from different embryos are pooled, so embryo-to-embryo amplitude differences count as noise.";

/** Store one analysis per group with its settings and answer the JSON of the command line and the API. */
export function storeTimeCourse(db: Db, input: TimeCourseTaskInput, output: TimeCourseGroupOutput[]): DynamicsQuantities & { note: string; groups: TimeCourseGroupJson[] } {
  const groups = output.map((o, i) => {
    const g = input.groups[i];
    const { analysis_id: _placeholder, ...json } = timeCourseJson(0, g, o.fit, input.options);
    const id = storeAnalysis(db, {
      kind: "dynamics",
      selection: { ...input.selection, genotype: g.genotype, channel: g.channel, profileIds: g.profileIds },
      settings: input.options,
      engineVersion: ENGINE_VERSION,
      result: json,
      profileIds: g.profileIds,
    });
    return { analysis_id: id, ...json };
  });
  // With one group its quantities also stand at the top, under the names every dynamics command uses.
  const only = groups.length === 1 ? groups[0] : null;
  const top: DynamicsQuantities = only
    ? { D_um2_per_s: only.D_um2_per_s, k_per_s: only.k_per_s, mobile_fraction: null, half_time_s: null, lambda_um: only.lambda_um, half_life_s: only.half_life_s, accumulation_time_s: only.accumulation_time_s }
    : emptyQuantities();
  return { ...top, note: only ? "the quantities at the top are those of the only group fitted" : "several groups were fitted: see groups[] (the top-level quantities are null)", groups };
}

export function timeCourseJson(id: number, g: TimeCourseGroupInput, f: BuildUpFitResult, settings: BuildUpFitOptions): TimeCourseGroupJson {
  const base = {
    ...emptyQuantities(),
    analysis_id: id,
    genotype: g.genotype,
    channel: g.channel,
    n_profiles: g.profileIds.length,
    n_embryos: g.embryos.length,
    times_s: [...new Set(g.timesS)].sort((a, b) => a - b),
    settings,
    caveat,
  };
  if (!f.ok)
    return { ...base, status: "failed", message: f.reason, source_strength: null, background: null, correlation_D_k: null, identifiable: null, profile_likelihood_k: [], profile_interval_k: null, warnings: [], points: [] };
  return {
    ...base,
    status: "ok",
    message: f.identifiable ? "D and k separated by the build-up" : "k not identified by these data (see warnings)",
    D_um2_per_s: est(f.diffusionUm2PerS),
    k_per_s: est(f.degradationPerS),
    lambda_um: est(f.lambdaUm),
    half_life_s: est(f.halfLifeS),
    accumulation_time_s: f.accumulationTimes.map((a) => ({ x_um: a.positionUm, value: a.timeS.value, se: a.timeS.se, ci95: a.timeS.ci95 })),
    source_strength: { ...est(f.sourceStrength)!, unit: f.sourceStrength.unit },
    background: est(f.background),
    correlation_D_k: Number.isFinite(f.correlationDK) ? f.correlationDK : null,
    identifiable: f.identifiable,
    profile_likelihood_k: f.profileLikelihood.map((p) => ({ k_per_s: p.degradationPerS, D_um2_per_s: p.diffusionUm2PerS, deviance: p.deviance })),
    profile_interval_k: f.profileIntervalK,
    warnings: f.warnings,
    points: g.xUm.map((x, i) => ({ x_um: x, t_s: g.timesS[i], value: g.values[i], fitted: f.fitted[i] })),
  };
}
