import type { Estimate } from "../../api/types/estimate.ts";
import type { JobGlobalFit } from "../../api/types/fits.ts";

/** A group's global fit and its per-embryo λ spread, whichever way it was loaded. */
export interface GlobalFitView {
  analysisId: number;
  genotype: string;
  channel: string;
  model: string;
  status: string;
  message: string;
  lambdaUm: Estimate | null;
  perEmbryo: { fitted: number; failed: number; meanUm: number; sdUm: number; medianUm: number; semUm: number; meanOverGlobal: number } | null;
  note: string | null;
  /** The embryos' windows in words (absent for analyses stored before it was recorded). */
  window: string | null;
  /** Which model AICc prefers for the group, and whether it is the fitted one. */
  preference: { message: string; agrees: boolean } | null;
}

/** A stored global-fit analysis as GET /api/analyses/:id returns it (only the fields shown). */
export interface StoredGlobalFit {
  id: number;
  selection: { genotype?: string; channel?: string };
  settings: { model: string };
  result: {
    fit: { status: string; message: string; shared?: { lambdaUm?: Estimate }; window?: { description: string } | null };
    modelPreference?: { message: string; agrees: boolean } | null;
    summary: { fitted: number; failed: number; meanUm: number; sdUm: number; medianUm: number; semUm: number; meanOverGlobal: number; note: string | null } | null;
  };
}

/** From a fit job's `global` entry. */
export function globalFromJob(g: JobGlobalFit): GlobalFitView {
  const p = g.per_embryo;
  return {
    analysisId: g.analysis_id,
    genotype: g.genotype,
    channel: g.channel,
    model: g.model,
    status: g.status,
    message: g.message,
    lambdaUm: g.lambda_um,
    perEmbryo: p ? { fitted: p.fitted, failed: p.failed, meanUm: p.mean_um, sdUm: p.sd_um, medianUm: p.median_um, semUm: p.sem_um, meanOverGlobal: p.mean_over_global } : null,
    note: g.note,
    window: g.window?.how_chosen ?? null,
    preference: g.model_preference ? { message: g.model_preference.message, agrees: g.model_preference.agrees } : null,
  };
}

/** From a stored analysis of kind "global-fit". */
export function globalFromStored(a: StoredGlobalFit): GlobalFitView {
  const s = a.result.summary;
  return {
    analysisId: a.id,
    genotype: a.selection.genotype ?? "",
    channel: a.selection.channel ?? "",
    model: a.settings.model,
    status: a.result.fit.status,
    message: a.result.fit.message,
    lambdaUm: a.result.fit.shared?.lambdaUm ?? null,
    perEmbryo: s ? { fitted: s.fitted, failed: s.failed, meanUm: s.meanUm, sdUm: s.sdUm, medianUm: s.medianUm, semUm: s.semUm, meanOverGlobal: s.meanOverGlobal } : null,
    note: s?.note ?? null,
    window: a.result.fit.window?.description ?? null,
    preference: a.result.modelPreference ? { message: a.result.modelPreference.message, agrees: a.result.modelPreference.agrees } : null,
  };
}
