import { getAnalysis, listAnalyses } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import { fitSettingHash } from "../../../db/fitSettings.ts";
import type { GroupExtras } from "../../analysis/compare/compareOptions.ts";

/**
 * Results of earlier group analyses that a comparison can use, per genotype:
 * the newest global fit's λ (same channel and fit setting) and the newest absolute-
 * coordinate precision analysis's headline σ_x (its geometric mean over the stated region; the raw
 * minimum of older analyses is biased low and is not used).
 */
export function storedGroupExtras(db: Db, channel: string, settingHash: string): Record<string, GroupExtras> {
  const extras: Record<string, GroupExtras> = {};
  for (const a of listAnalyses(db, "global-fit")) {
    const sel = a.selection as { genotype?: string; channel?: string };
    const settings = a.settings as { options?: unknown };
    if (!sel.genotype || sel.channel !== channel || fitSettingHash(settings.options) !== settingHash || extras[sel.genotype]?.lambdaGlobalUm) continue;
    const full = getAnalysis(db, a.id)!;
    const fit = (full.result as { fit: { ok: boolean; shared?: Record<string, { value: number; se: number | null; ci95: [number, number] | null }> } }).fit;
    const lambda = fit.ok ? fit.shared?.lambdaUm : undefined;
    if (lambda) (extras[sel.genotype] ??= {}).lambdaGlobalUm = { value: lambda.value, se: lambda.se, ci95: lambda.ci95 };
  }
  for (const a of listAnalyses(db, "precision")) {
    const sel = a.selection as { genotype?: string; channels?: string[] };
    const settings = a.settings as { coords?: string };
    if (!sel.genotype || sel.channels?.[0] !== channel || settings.coords !== "absolute" || extras[sel.genotype]?.sigmaXMinUm) continue;
    const full = getAnalysis(db, a.id)!;
    const min = (full.result as { perChannel: { result: { sigmaXSummary?: { value: number; se: number | null; ci95: [number, number] | null } | null } }[] }).perChannel[0]?.result.sigmaXSummary;
    if (min) (extras[sel.genotype] ??= {}).sigmaXMinUm = { value: min.value, se: min.se, ci95: min.ci95 };
  }
  return extras;
}
