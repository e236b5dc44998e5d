import { createHash } from "node:crypto";
import { akaikeWeights } from "../../analysis/fit/akaikeWeights.ts";
import { fitProfile } from "../../analysis/fit/fitProfile.ts";
import type { ResolvedFitOptions } from "../../analysis/fit/fitOptions.ts";
import { modelNames, type ModelName } from "../../analysis/models/steadyStateModel.ts";
import { canonicalJson } from "../../../db/stableHash.ts";

/** A profile as the model check needs it. */
export interface PreferenceProfile {
  profileId: number;
  group: string;
  x: Float64Array;
  y: Float64Array;
  lengthUm: number | null;
}

/** Per group, which model AICc prefers over the profiles of the group. */
export interface GroupModelPreference {
  group: string;
  /** Profiles where at least two models produced an AICc. */
  n: number;
  /** Each model's Akaike weights summed over the group's profiles, as a share of n (they add up to 1). */
  weight_share: Record<string, number>;
  /** The model with the largest summed weight. */
  preferred: string | null;
  /** Each model's AICc summed over the profiles where every compared model produced one. */
  summed_aicc: Record<string, number>;
  /** Profiles behind summed_aicc. */
  n_summed: number;
  /** The model with the smallest summed AICc. */
  best_by_summed_aicc: string | null;
}

export interface ModelPreference {
  /** The model of the fit setting the analysis used. */
  used_model: string;
  models_compared: string[];
  groups: GroupModelPreference[];
  /** One model for all groups: the smallest AICc summed over every group. */
  best_overall: string | null;
  /** Plain-language notes: a group for which AICc prefers another model than the one used. */
  warnings: string[];
}

// Source: Burnham & Anderson 2002, Model Selection and Multimodel Inference, §2.9 (Akaike weights as the
// relative support of each model); summing weights (or AICc) over independent profiles pools that support
// over a group (common practice, no source).
const MAJORITY = 0.5;

/** Per profile, each model's AICc (models that fail are absent). */
export type AiccTable = Map<number, Map<string, number>>;

/**
 * AICc of fits already made in this process, by the profile's data, options
 * and model, so a repeated analysis does not refit the same profiles (keyed by
 * the data, not the id: another database file can reuse an id). Bounded, and
 * cleared whole when full.
 */
const remembered = new Map<string, number | null>();
const REMEMBER_AT_MOST = 200_000;

/**
 * Fit every model to every profile with the same options except the model
 * (so AICc compares models on the same points). AICc values already known
 * (the stored fits of the setting used) are passed in and not refitted. The
 * extra fits are not stored: they only inform the choice.
 */
export function modelAicc(profiles: readonly PreferenceProfile[], options: ResolvedFitOptions, known: ReadonlyMap<number, number | null>): AiccTable {
  const aicc: AiccTable = new Map();
  for (const p of profiles) {
    const row = new Map<string, number>();
    const fingerprint = createHash("sha256").update(new Uint8Array(p.x.buffer, p.x.byteOffset, p.x.byteLength)).update(new Uint8Array(p.y.buffer, p.y.byteOffset, p.y.byteLength)).update(String(p.lengthUm)).digest("base64");
    for (const model of modelNames as readonly ModelName[]) {
      const given = model === options.model ? known.get(p.profileId) : undefined;
      if (given !== undefined) {
        if (given !== null && Number.isFinite(given)) row.set(model, given);
        continue;
      }
      const key = `${fingerprint}|${canonicalJson({ ...options, model })}`;
      let value = remembered.get(key);
      if (value === undefined) {
        const fit = fitProfile(p.x, p.y, { ...options, model }, { lengthUm: p.lengthUm ?? undefined });
        value = fit.ok && fit.aicc !== null && Number.isFinite(fit.aicc) ? fit.aicc : null;
        if (remembered.size >= REMEMBER_AT_MOST) remembered.clear();
        remembered.set(key, value);
      }
      if (value !== null) row.set(model, value);
    }
    aicc.set(p.profileId, row);
  }
  return aicc;
}

/** Per group, the summed Akaike weights and the summed AICc of each model, and a warning where most of a group prefers another model than the one used. */
export function modelPreference(profiles: readonly PreferenceProfile[], aicc: AiccTable, usedModel: string): ModelPreference {
  const models = [...modelNames] as string[];
  // A model that fails on most profiles is left out of the summed AICc, which needs every model on the same profiles.
  const usable = models.filter((m) => profiles.filter((p) => aicc.get(p.profileId)!.has(m)).length > profiles.length / 2);
  const groups = [...new Set(profiles.map((p) => p.group))].map((group): GroupModelPreference => {
    const members = profiles.filter((p) => p.group === group);
    const share: Record<string, number> = {};
    let n = 0;
    for (const p of members) {
      const row = aicc.get(p.profileId)!;
      if (row.size < 2) continue;
      n++;
      for (const r of akaikeWeights([...row].map(([model, value]) => ({ model, aicc: value }))).ranking) share[r.model] = (share[r.model] ?? 0) + r.weight;
    }
    for (const m of Object.keys(share)) share[m] /= Math.max(n, 1);
    const complete = members.filter((p) => usable.every((m) => aicc.get(p.profileId)!.has(m)));
    const summed: Record<string, number> = {};
    for (const m of usable) summed[m] = complete.reduce((s, p) => s + aicc.get(p.profileId)!.get(m)!, 0);
    const rank = (o: Record<string, number>, better: (a: number, b: number) => boolean) =>
      Object.entries(o).reduce<string | null>((best, [m, v]) => (best === null || better(v, o[best]) ? m : best), null);
    return {
      group,
      n,
      weight_share: share,
      preferred: n > 0 ? rank(share, (a, b) => a > b) : null,
      summed_aicc: complete.length > 0 ? summed : {},
      n_summed: complete.length,
      best_by_summed_aicc: complete.length > 0 ? rank(summed, (a, b) => a < b) : null,
    };
  });
  const total: Record<string, number> = {};
  for (const g of groups) for (const [m, v] of Object.entries(g.summed_aicc)) total[m] = (total[m] ?? 0) + v;
  const bestOverall = groups.every((g) => g.n_summed > 0) ? Object.entries(total).reduce<string | null>((b, [m, v]) => (b === null || v < total[b] ? m : b), null) : null;
  // One warning per preferred model, naming every group that prefers it, so many groups do not mean many notices.
  const byModel = new Map<string, string[]>();
  for (const g of groups) {
    if (g.preferred === null || g.preferred === usedModel) continue;
    const share = g.weight_share[g.preferred];
    if (share <= MAJORITY) continue;
    byModel.set(g.preferred, [...(byModel.get(g.preferred) ?? []), `${g.group} (${share.toFixed(2)}; ${(g.weight_share[usedModel] ?? 0).toFixed(2)} for ${usedModel})`]);
  }
  const warnings = [...byModel].map(
    ([model, groupsText]) =>
      `AICc prefers the ${model} model for most profiles of ${groupsText.join(", ")} — summed Akaike weight of 1 per group; ${usedModel} is the model used. ` +
      `λ from ${usedModel} fits may be biased here; compare with fits of ${model} (--fit-model ${model}) or let the groups choose one model by summed AICc (--fit-model best).`,
  );
  return { used_model: usedModel, models_compared: models, groups, best_overall: bestOverall, warnings };
}
