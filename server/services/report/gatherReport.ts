import type { ModelPreference } from "../../analysis/fit/modelPreference.ts";
import { getAnalysis, listAnalyses, type StoredAnalysis } from "../../../db/analyses.ts";
import { findFitSetting } from "../../../db/fitSettings.ts";
import { assignMissingFitSettings } from "../fits/fitSettings.ts";
import type { Db } from "../../../db/connection.ts";
import { listFitItems, type FitListItem } from "../../../db/fits.ts";
import { listImports, type ImportRow } from "../../../db/imports.ts";
import { distinctValues, listProfiles } from "../../../db/profiles.ts";
import type { GlobalFitResult } from "../../analysis/fit/fitGlobal.ts";
import type { DecayLengthSummary } from "../../analysis/fit/summarizeDecayLengths.ts";
import type { ProgressCallback } from "../../jobs/jobTypes.ts";
import { isUserError, UserError } from "../../userError.ts";
import { comparisonResponse, type ComparisonResponse } from "../groups/comparisonResponse.ts";
import { planResponse, type PlanResponse } from "../groups/planResponse.ts";
import { trackingResponse, type TrackingResponse } from "../groups/trackingResponse.ts";
import { FitRequest } from "../fits/fitRequest.ts";
import { fitResponse, type FitResponse } from "../fits/fitResponse.ts";
import { prepareFitInput, storeFitOutput } from "../fits/fitService.ts";
import { runFitTask } from "../fits/fitTask.ts";
import { precisionChannel } from "../precision/precisionChannel.ts";
import { PrecisionRequest } from "../precision/precisionRequest.ts";
import { storedPrecisionResponse } from "../precision/precisionResponse.ts";
import { preparePrecisionInput, storePrecisionOutput } from "../precision/precisionService.ts";
import { runPrecisionTask } from "../precision/precisionTask.ts";
import type { ReportOptions } from "./reportOptions.ts";

/** Where a stored result came from: its id, settings, engine version and time, and whether this report ran it. */
export interface Provenance {
  analysisId: number;
  settings: unknown;
  engineVersion: string;
  createdAt: string;
  /** Run by the report because nothing was stored. */
  runByReport: boolean;
}

export interface GlobalFitEntry extends Provenance {
  genotype: string;
  channel: string;
  model: string;
  fit: GlobalFitResult;
  summary: DecayLengthSummary;
  /** Which model AICc preferred over the group's profiles when the global fit was run (absent in older analyses). */
  modelPreference: ModelPreference | null;
}

export interface GroupReport {
  genotype: string;
  channel: string;
  profiles: number;
  /** Newest fit of each profile and model. */
  fits: FitListItem[];
  /** Profiles this report fitted with default options because they had no fit. */
  fittedByReport: number;
  globals: GlobalFitEntry[];
  /** The fit drawn as the group's example: the converged exponential fit whose λ is nearest the group median. */
  example: FitResponse | null;
  precision: { response: ReturnType<typeof precisionChannel>; provenance: Provenance } | null;
  /** Why there is no precision analysis, when there is none. */
  precisionNote: string | null;
}

export interface ReportData {
  genotypes: string[];
  channels: string[];
  imports: ImportRow[];
  groups: GroupReport[];
  comparisons: { response: ComparisonResponse; provenance: Provenance }[];
  trackings: { response: TrackingResponse; provenance: Provenance }[];
  plans: { response: PlanResponse; provenance: Provenance }[];
  bootstrap: number;
}

const provenance = (a: Pick<StoredAnalysis, "id" | "settings" | "engineVersion" | "createdAt">, runByReport = false): Provenance => ({
  analysisId: a.id, settings: a.settings, engineVersion: a.engineVersion, createdAt: a.createdAt, runByReport,
});

function chosen(kind: string, given: string[] | undefined, stored: string[]): string[] {
  if (!given) return stored;
  const unknown = given.filter((g) => !stored.includes(g));
  if (unknown.length) throw new UserError("unknown-selection", `No profiles of ${kind} ${unknown.map((u) => `"${u}"`).join(", ")} are stored (${kind}s: ${stored.join(", ") || "none"}).`, { status: 404 });
  return given;
}

/** Fit, with default options, every profile of the group that has no fit yet (and the group globally when none had one). */
function fitMissing(db: Db, genotype: string, channel: string): number {
  const profiles = listProfiles(db, { genotype, channel });
  const fitted = new Set(listFitItems(db, { genotype, channel }).map((f) => f.profileId));
  const missing = profiles.filter((p) => !fitted.has(p.profileId)).map((p) => p.profileId);
  if (missing.length === 0) return 0;
  const request = FitRequest.parse({ selection: { profileIds: missing }, models: ["exponential"], global: fitted.size === 0 });
  const input = prepareFitInput(db, request);
  storeFitOutput(db, input, runFitTask(input));
  return missing.length;
}

function newestGlobals(db: Db, genotype: string, channel: string): GlobalFitEntry[] {
  const seen = new Set<string>();
  const out: GlobalFitEntry[] = [];
  for (const a of listAnalyses(db, "global-fit")) {
    const sel = a.selection as { genotype?: string; channel?: string };
    const model = (a.settings as { model: string }).model;
    if (sel.genotype !== genotype || sel.channel !== channel || seen.has(model)) continue;
    seen.add(model);
    const full = getAnalysis(db, a.id)!;
    const r = full.result as { fit: GlobalFitResult; summary: DecayLengthSummary; modelPreference?: ModelPreference | null };
    out.push({ ...provenance(full), genotype, channel, model, fit: r.fit, summary: r.summary, modelPreference: r.modelPreference ?? null });
  }
  return out;
}

function exampleFit(db: Db, fits: FitListItem[]): FitResponse | null {
  const ok = fits.filter((f) => f.model === "exponential" && f.status === "converged" && f.lambdaUm).sort((a, b) => a.lambdaUm!.value - b.lambdaUm!.value || a.fitId - b.fitId);
  if (ok.length === 0) return null;
  return fitResponse(db, ok[Math.floor((ok.length - 1) / 2)].fitId);
}

function precisionFor(db: Db, genotype: string, channel: string, bootstrap: number): Pick<GroupReport, "precision" | "precisionNote"> {
  for (const a of listAnalyses(db, "precision")) {
    const sel = a.selection as { genotype?: string; channels?: string[] };
    if (sel.genotype === genotype && sel.channels?.includes(channel)) {
      const full = getAnalysis(db, a.id)!;
      return { precision: { response: precisionChannel(storedPrecisionResponse(full), channel), provenance: provenance(full) }, precisionNote: null };
    }
  }
  try {
    const input = preparePrecisionInput(db, PrecisionRequest.parse({ selection: { genotype }, channels: [channel], bootstrap }));
    const [result] = storePrecisionOutput(db, input, runPrecisionTask(input)).results;
    const full = getAnalysis(db, result.analysis_id)!;
    return { precision: { response: result, provenance: provenance(full, true) }, precisionNote: null };
  } catch (e) {
    if (isUserError(e)) return { precision: null, precisionNote: e.message };
    throw e;
  }
}

/** Newest stored analyses of a kind whose channel is reported, answered as their jobs answered. */
function storedOfKind<T>(db: Db, kind: "comparison" | "tracking" | "plan", channels: string[], respond: (a: StoredAnalysis) => T, fits: string | undefined) {
  return listAnalyses(db, kind)
    .filter((a) => fits === undefined || (a.settings as { fitSetting?: { name: string } }).fitSetting?.name === fits)
    // A spread plan has no channel: it is kept whatever channels are reported.
    .filter((a) => {
      const channel = (a.selection as { channel?: string | null }).channel ?? null;
      return channel === null || channels.includes(channel);
    })
    .map((a) => getAnalysis(db, a.id)!)
    .map((a) => ({ response: respond(a), provenance: provenance(a) }));
}

/**
 * Everything a report shows, for the selected genotypes and channels: the
 * imports the profiles came from, the newest fits and global fits, a precision
 * analysis per group, and the stored comparisons, tracking analyses and plans.
 * Groups without any fit are fitted with default options (exponential, with a
 * global fit); groups without a precision analysis get one with default
 * settings and `bootstrap` resamples. Both are stored, like any other run.
 */
export function gatherReport(db: Db, options: ReportOptions, progress: ProgressCallback = () => {}): ReportData {
  if (options.fits !== undefined) {
    assignMissingFitSettings(db);
    if (!findFitSetting(db, { name: options.fits })) throw new UserError("unknown-fit-setting", `No fit setting is named "${options.fits}" (see morphogauge fits settings).`, { status: 404, issues: [{ path: "fits", message: "unknown fit setting" }] });
  }
  const genotypes = chosen("genotype", options.genotypes, distinctValues(db, "genotype"));
  const channels = chosen("channel", options.channels, distinctValues(db, "channel"));
  const pairs = genotypes.flatMap((genotype) => channels.map((channel) => ({ genotype, channel, profiles: listProfiles(db, { genotype, channel }) }))).filter((p) => p.profiles.length > 0);
  if (pairs.length === 0) throw new UserError("nothing-selected", `No stored profiles of genotype ${genotypes.join(", ")} in channel ${channels.join(", ")}.`, { status: 404 });
  const importIds = new Set(pairs.flatMap((p) => p.profiles.map((q) => q.importId)));
  const groups = pairs.map(({ genotype, channel, profiles }, i) => {
    progress(i / pairs.length, `fitting ${genotype} / ${channel}`);
    const fittedByReport = fitMissing(db, genotype, channel);
    const fits = listFitItems(db, { genotype, channel, setting: options.fits });
    progress((i + 0.4) / pairs.length, `precision ${genotype} / ${channel}`);
    return { genotype, channel, profiles: profiles.length, fits, fittedByReport, globals: newestGlobals(db, genotype, channel), example: exampleFit(db, fits), ...precisionFor(db, genotype, channel, options.bootstrap) };
  });
  progress(1, "stored analyses");
  return {
    genotypes,
    channels,
    imports: listImports(db).filter((i) => importIds.has(i.id)),
    groups,
    comparisons: storedOfKind(db, "comparison", channels, comparisonResponse, options.fits),
    trackings: storedOfKind(db, "tracking", channels, trackingResponse, options.fits),
    plans: storedOfKind(db, "plan", channels, planResponse, options.fits),
    bootstrap: options.bootstrap,
  };
}
