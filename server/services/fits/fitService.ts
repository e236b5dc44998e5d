import { storeAnalysis } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import { storeFits } from "../../../db/fits.ts";
import { loadProfiles } from "../../../db/profiles.ts";
import { steadyStateCaveat } from "../../analysis/derived.ts";
import type { ParameterEstimate } from "../../analysis/fit/parameterEstimate.ts";
import { UserError } from "../../userError.ts";
import { ENGINE_VERSION } from "../../version.ts";
import { describeSelection, selectionFilter } from "../selection.ts";
import { resolveFitOptions, resolveModels, type FitRequest } from "./fitRequest.ts";
import type { FitTaskInput, FitTaskOutput } from "./fitTask.ts";

/** Read the selected profiles and resolve the options: the input of a fit task. */
export function prepareFitInput(db: Db, request: FitRequest): FitTaskInput {
  const options = resolveFitOptions(request);
  const profiles = loadProfiles(db, selectionFilter(request.selection));
  if (profiles.length === 0) {
    throw new UserError("nothing-selected", `No stored profiles match ${describeSelection(request.selection)}.`, { status: 404 });
  }
  return {
    profiles: profiles.map((p) => ({
      profileId: p.profileId,
      embryo: p.embryo,
      genotype: p.genotype,
      channel: p.channel,
      timeS: p.timeS,
      x: p.positionsUm,
      y: p.intensities,
      lengthUm: p.lengthUm,
    })),
    models: resolveModels(request.models),
    options,
    global: request.global,
    diffusion: request.diffusion ?? null,
    accumulationPositionsUm: request.accumulationPositionsUm,
  };
}

export interface EstimateJson {
  value: number;
  se: number | null;
  ci95: [number, number] | null;
}

export interface FitSummary {
  fit_id: number;
  profile_id: number;
  embryo: string;
  genotype: string;
  channel: string;
  time_s: number | null;
  model: string;
  status: string;
  message: string;
  warnings: string[];
  lambda_um: EstimateJson | null;
  amplitude: EstimateJson | null;
  background: EstimateJson | null;
  aicc: number | null;
  r2: number | null;
  n_points: number;
  parameters: Record<string, ParameterEstimate>;
  derived: Record<string, ParameterEstimate>;
  akaike_weight: number | null;
}

export interface GlobalSummary {
  analysis_id: number;
  genotype: string;
  channel: string;
  model: string;
  status: string;
  message: string;
  n_embryos: number;
  lambda_um: EstimateJson | null;
  shared: Record<string, ParameterEstimate>;
  aicc: number | null;
  per_embryo: { parameter: string; fitted: number; failed: number; mean_um: number | null; sd_um: number | null; median_um: number | null; sem_um: number | null; mean_over_global: number | null };
  note: string;
  akaike_weight: number | null;
}

export interface FitRunResult {
  fits: FitSummary[];
  global: GlobalSummary[];
  /** Per group, the models ranked by AICc of the global fits. */
  group_model_comparison: { genotype: string; channel: string; best: string | null; indistinguishable: boolean; message: string; ranking: { model: string; aicc: number; deltaAicc: number; weight: number }[] }[];
  caveat: string;
}

const est = (p: ParameterEstimate | undefined): EstimateJson | null => (p ? { value: p.value, se: p.se, ci95: p.ci95 } : null);

/**
 * Store the fits (replacing those with identical options) and global fits in
 * one transaction, and answer with their summaries: a failure part-way stores none of them.
 */
export function storeFitOutput(db: Db, input: FitTaskInput, output: FitTaskOutput): FitRunResult {
  return db.transaction(() => storeFitOutputNow(db, input, output))();
}

function storeFitOutputNow(db: Db, input: FitTaskInput, output: FitTaskOutput): FitRunResult {
  const meta = new Map(input.profiles.map((p) => [p.profileId, p]));
  const ids = storeFits(
    db,
    output.fits.map((f) => ({
      profileId: f.profileId,
      model: f.model,
      options: { ...f.fit.options, diffusion: input.diffusion, accumulationPositionsUm: input.accumulationPositionsUm },
      engineVersion: ENGINE_VERSION,
      status: f.fit.status,
      lambdaUm: f.fit.ok ? (f.fit.parameters.lambdaUm?.value ?? null) : null,
      lambdaSeUm: f.fit.ok ? (f.fit.parameters.lambdaUm?.se ?? null) : null,
      aicc: f.fit.ok ? f.fit.aicc : null,
      result: { fit: f.fit, interpretation: f.interpretation, profile: { embryo: meta.get(f.profileId)!.embryo, genotype: meta.get(f.profileId)!.genotype, channel: meta.get(f.profileId)!.channel } },
    })),
  );
  const weightOf = (profileId: number, model: string) =>
    output.comparisons.find((c) => c.profileId === profileId)?.comparison.ranking.find((r) => r.model === model)?.weight ?? null;
  const fits: FitSummary[] = output.fits.map((f, i) => {
    const p = meta.get(f.profileId)!;
    const kinetics = f.interpretation?.ok && f.interpretation.kinetics ? f.interpretation.kinetics : null;
    const fromLambda = f.interpretation?.ok ? f.interpretation.decayLength : null;
    const derived: Record<string, ParameterEstimate> = { ...(f.fit.ok ? f.fit.derived : {}) };
    if (fromLambda?.lambdaFractionOfLength) derived.lambdaFractionOfLength = fromLambda.lambdaFractionOfLength;
    if (kinetics) {
      derived.degradationPerS = kinetics.degradationPerS;
      derived.halfLifeS = kinetics.halfLifeS;
      if (kinetics.sourceFlux) derived.sourceFlux = kinetics.sourceFlux;
      for (const t of kinetics.accumulationTimes) derived[`accumulationTimeS_at_${t.positionUm}um`] = t.timeS;
    }
    return {
      fit_id: ids[i],
      profile_id: f.profileId,
      embryo: p.embryo,
      genotype: p.genotype,
      channel: p.channel,
      time_s: p.timeS,
      model: f.model,
      status: f.fit.status,
      message: f.fit.message,
      warnings: f.fit.warnings,
      lambda_um: f.fit.ok ? est(f.fit.parameters.lambdaUm) : null,
      amplitude: f.fit.ok ? est(f.fit.parameters.amplitude) : null,
      background: f.fit.ok ? est(f.fit.parameters.background) : null,
      aicc: f.fit.ok ? f.fit.aicc : null,
      r2: f.fit.ok ? f.fit.r2 : null,
      n_points: f.fit.n,
      parameters: f.fit.ok ? f.fit.parameters : {},
      derived,
      akaike_weight: weightOf(f.profileId, f.model),
    };
  });
  const global: GlobalSummary[] = output.globals.map((g) => {
    const analysisId = storeAnalysis(db, {
      kind: "global-fit",
      selection: { genotype: g.genotype, channel: g.channel, profileIds: g.profileIds },
      settings: { model: g.model, options: input.options[g.model] },
      engineVersion: ENGINE_VERSION,
      result: { fit: g.fit, summary: g.summary },
      profileIds: g.profileIds,
    });
    const cmp = output.groupComparisons.find((c) => c.genotype === g.genotype && c.channel === g.channel);
    return {
      analysis_id: analysisId,
      genotype: g.genotype,
      channel: g.channel,
      model: g.model,
      status: g.fit.status,
      message: g.fit.message,
      n_embryos: g.profileIds.length,
      lambda_um: g.fit.ok ? est(g.fit.shared.lambdaUm) : null,
      shared: g.fit.ok ? g.fit.shared : {},
      aicc: g.fit.ok ? g.fit.aicc : null,
      per_embryo: {
        parameter: g.summary.parameter,
        fitted: g.summary.fitted,
        failed: g.summary.failed,
        mean_um: g.summary.meanUm,
        sd_um: g.summary.sdUm,
        median_um: g.summary.medianUm,
        sem_um: g.summary.semUm,
        mean_over_global: g.summary.meanOverGlobal,
      },
      note: g.summary.note,
      akaike_weight: cmp?.comparison.ranking.find((r) => r.model === g.model)?.weight ?? null,
    };
  });
  return {
    fits,
    global,
    group_model_comparison: output.groupComparisons.map((c) => ({ genotype: c.genotype, channel: c.channel, ...c.comparison })),
    caveat: steadyStateCaveat,
  };
}
