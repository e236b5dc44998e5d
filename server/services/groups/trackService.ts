import { storeAnalysis } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import type { PlanOptionsInput } from "../../analysis/compare/planning/planOptions.ts";
import type { SamplePlan } from "../../analysis/compare/planning/planSampleSize.ts";
import { mostVariableGroup, type PlanningGroupChoice } from "../../analysis/compare/planning/mostVariableGroup.ts";
import { UserError } from "../../userError.ts";
import { ENGINE_VERSION } from "../../version.ts";
import { gatherEmbryoRecords, type EmbryoRecords } from "./embryoRecords.ts";
import { storedGroupExtras } from "./groupExtras.ts";
import type { PlanRequest, TrackRequest } from "./trackRequest.ts";
import type { TrackTaskInput, TrackTaskOutput } from "./trackTask.ts";
import { planResponse } from "./planResponse.ts";
import { trackPoints } from "./trackPoints.ts";
import { trackingResponse, type StoredTracking } from "./trackingResponse.ts";

export interface PreparedTracking {
  request: TrackRequest;
  gathered: Omit<EmbryoRecords, "records">;
  task: TrackTaskInput;
}

export function prepareTracking(db: Db, request: TrackRequest): PreparedTracking {
  const { records, ...gathered } = gatherEmbryoRecords(db, request);
  let task: TrackTaskInput;
  if (request.over === "stage" || request.over === "age") {
    task = {
      over: "time",
      records,
      options: { metric: request.metric, time: request.over === "stage" ? "stage" : "ageS", by: "group", trend: request.trend, bins: request.bins, bootstrap: request.bootstrap, seed: request.seed },
    };
  } else if (request.over === "dosage") {
    const withDosage = records.filter((r) => r.dosage !== undefined);
    if (new Set(withDosage.map((r) => r.dosage)).size < 2) throw new UserError("no-dosage-series", "A dosage series needs embryos of at least two dosages (a dosage column in the data or side file).", { status: 422 });
    // λ from profile fits: the global fit of the dosage-1 line when one is stored.
    const units = new Set(withDosage.filter((r) => r.dosage === 1).map((r) => r.genotype));
    if (units.size > 1) {
      throw new UserError("mixed-dosage-series", `Several genotypes have dosage 1 (${[...units].join(", ")}); choose the lines of one series, e.g. --genotype ${[...new Set(withDosage.map((r) => r.genotype))].filter((g) => !units.has(g) || g === [...units][0]).join(",")}.`, { status: 422 });
    }
    const unit = [...units][0];
    const global = unit ? storedGroupExtras(db, gathered.channel, request.fitModel)[unit]?.lambdaGlobalUm : undefined;
    task = { over: "dosage", records: withDosage, options: { lambdaFitUm: global, bootstrap: request.bootstrap, seed: request.seed } };
  } else {
    task = { over: "length", records };
  }
  return { request, gathered, task };
}

/** Store the tracking result with its per-embryo points and settings; answer with it and its provenance. */
export function storeTracking(db: Db, prepared: PreparedTracking, output: TrackTaskOutput) {
  const stored: StoredTracking = { ...output, points: trackPoints(prepared.task.records, output), fitted_now: prepared.gathered.fittedNow };
  const analysis = {
    selection: { ...prepared.request.selection, channel: prepared.gathered.channel },
    settings: { ...prepared.request, threshold: prepared.gathered.threshold },
    result: stored,
  };
  const id = storeAnalysis(db, { kind: "tracking", ...analysis, engineVersion: ENGINE_VERSION, profileIds: prepared.gathered.profileIds });
  return trackingResponse({ id, ...analysis });
}

export interface PreparedPlan {
  request: PlanRequest;
  gathered: Omit<EmbryoRecords, "records"> | null;
  group: string | null;
  /** Which group's variability the plan uses and why; null for a spread plan. */
  choice: PlanningGroupChoice | null;
  options: PlanOptionsInput;
}

/** The plan's variability comes from the observed λ of one group: the chosen one, else the most variable (conservative). */
export function preparePlan(db: Db, request: PlanRequest): PreparedPlan {
  const base = { effect: request.effect, power: request.power, alpha: request.alpha, simulations: request.simulations, permutationSimulations: request.permutationSimulations, seed: request.seed };
  if (request.metric === "sigma_x") return { request, gathered: null, group: null, choice: null, options: { ...base, quantity: "spread" } };
  const { records, ...gathered } = gatherEmbryoRecords(db, request);
  const byGroup = new Map<string, number[]>();
  for (const r of records) if (r.converged && Number.isFinite(r.lambdaUm)) byGroup.set(r.group, [...(byGroup.get(r.group) ?? []), r.lambdaUm]);
  const choice = mostVariableGroup(byGroup, request.group);
  if (!choice) {
    const counts = [...byGroup].map(([g, v]) => `"${g}" has ${v.length}`).join(", ");
    throw new UserError("too-few-embryos", `Planning needs the fitted λ of at least 3 embryos of one group${request.group ? ` ("${request.group}" has ${byGroup.get(request.group)?.length ?? 0})` : counts ? ` (${counts})` : ""}.`, { status: 422 });
  }
  return { request, gathered, group: choice.group, choice, options: { ...base, quantity: "mean", observed: byGroup.get(choice.group)! } };
}

export function storePlan(db: Db, prepared: PreparedPlan, plan: SamplePlan) {
  const analysis = {
    selection: { ...prepared.request.selection, channel: prepared.gathered?.channel ?? null, group: prepared.group },
    settings: prepared.request,
    result: prepared.choice ? { ...plan, variability_group: prepared.choice } : plan,
  };
  const id = storeAnalysis(db, { kind: "plan", ...analysis, engineVersion: ENGINE_VERSION, profileIds: prepared.gathered?.profileIds ?? [] });
  return planResponse({ id, ...analysis });
}
