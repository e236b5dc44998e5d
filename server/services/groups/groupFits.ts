import type { Db } from "../../../db/connection.ts";
import { findFitSetting, fitSettingHash, listFitSettings, type StoredFitSetting } from "../../../db/fitSettings.ts";
import { listFits, type StoredFit } from "../../../db/fits.ts";
import type { ProfileData } from "../../../db/profiles.ts";
import { FitOptions, type ResolvedFitOptions } from "../../analysis/fit/fitOptions.ts";
import { modelNames, type ModelName } from "../../analysis/models/steadyStateModel.ts";
import { UserError } from "../../userError.ts";
import { storeFitOutput } from "../fits/fitService.ts";
import { assignMissingFitSettings, defaultFitOptions, describeFitSetting, fitSettingSummary, planFitSettings, type FitSettingSummary } from "../fits/fitSettings.ts";
import { runFitTask } from "../fits/fitTask.ts";
import { modelAicc, modelPreference, type ModelPreference } from "./modelPreference.ts";

/** How the caller chose the fits: a named setting, a model (or "best"), or nothing. */
export interface FitChoice {
  fits?: string;
  fitModel?: ModelName | "best";
}

/** The one fit setting a group analysis used and the fit of each profile under it. */
export interface GroupFits {
  setting: FitSettingSummary;
  /** How the setting was chosen, in words. */
  chosen: string;
  /** The fit of each profile, by profile id. */
  fitByProfile: Map<number, StoredFit>;
  /** Profiles that had no fit under the setting and were fitted now with it. */
  fittedNow: number;
  preference: ModelPreference;
}

const genotypeCounts = (profiles: readonly ProfileData[], ids: ReadonlySet<number>) => {
  const out = new Map<string, { fitted: number; profiles: number }>();
  for (const p of profiles) {
    const c = out.get(p.genotype) ?? { fitted: 0, profiles: 0 };
    c.profiles++;
    if (ids.has(p.profileId)) c.fitted++;
    out.set(p.genotype, c);
  }
  return [...out].map(([g, c]) => `${g} ${c.fitted}/${c.profiles}`).join(", ");
};

/** The newest fit of each profile under one setting. */
function fitsUnder(db: Db, settingId: number, profileIds: number[]): Map<number, StoredFit> {
  const out = new Map<number, StoredFit>();
  for (const f of listFits(db, { profileIds, settingId })) {
    const prev = out.get(f.profileId);
    if (!prev || f.createdAt > prev.createdAt || (f.createdAt === prev.createdAt && f.id > prev.id)) out.set(f.profileId, f);
  }
  return out;
}

function settingOptions(s: StoredFitSetting | { options: Record<string, unknown> }): ResolvedFitOptions {
  // Re-resolved so options added to the schema since the setting was stored get their defaults.
  return FitOptions.parse(s.options);
}

/**
 * Pick the one fit setting for every profile of a group analysis, never mixing
 * settings: the named one (`fits`); a model's fits (`fitModel`, or "best": the
 * model with the smallest AICc summed over all groups, one model for every group);
 * otherwise the single stored setting that covers every profile, or the only
 * setting any of them has been fitted with, or the default exponential fit when
 * none has. Several candidates and no single covering one: refuse, listing them.
 */
function chooseSetting(db: Db, profiles: readonly ProfileData[], choice: FitChoice): { options: ResolvedFitOptions; chosen: string } {
  const ids = profiles.map((p) => p.profileId);
  if (choice.fits !== undefined) {
    let named: { options: Record<string, unknown>; name: string } | null = findFitSetting(db, { name: choice.fits });
    if (!named && (modelNames as readonly string[]).includes(choice.fits)) {
      const options = defaultFitOptions(choice.fits as ModelName) as unknown as Record<string, unknown>;
      named = findFitSetting(db, { hash: fitSettingHash(options) }) ?? { options, name: choice.fits };
    }
    if (!named) {
      const known = listFitSettings(db).map((s) => s.name);
      throw new UserError("unknown-fit-setting", `No fit setting is named "${choice.fits}". Stored settings: ${known.length ? known.join(", ") : "none"}; a model name (${modelNames.join(", ")}) means that model's default fit.`, {
        status: 404,
        issues: [{ path: "fits", message: "unknown fit setting" }],
      });
    }
    const options = settingOptions(named);
    if (choice.fitModel === "best") return { options, chosen: `setting "${named.name}" as the base of the model chosen by summed AICc` };
    if (choice.fitModel !== undefined && choice.fitModel !== options.model) {
      throw new UserError("conflicting-fit-choice", `Fit setting "${named.name}" uses the ${options.model} model, but the ${choice.fitModel} model was asked for; give one of the two.`, { status: 400 });
    }
    return { options, chosen: `named: "${named.name}"` };
  }
  if (choice.fitModel === "best") return { options: defaultFitOptions("exponential"), chosen: "the model with the smallest AICc summed over all groups, default options" };

  const settings = new Map(listFitSettings(db).map((s) => [s.id, s]));
  const profilesWithFit = new Map<number, Set<number>>();
  for (const f of listFits(db, { profileIds: ids })) {
    if (f.settingId === null) continue;
    if (choice.fitModel !== undefined && f.model !== choice.fitModel) continue;
    profilesWithFit.set(f.settingId, (profilesWithFit.get(f.settingId) ?? new Set()).add(f.profileId));
  }
  const candidates = [...profilesWithFit].map(([id, covered]) => ({ setting: settings.get(id)!, covered }));
  const covering = candidates.filter((c) => c.covered.size === ids.length);
  if (covering.length === 1) return { options: settingOptions(covering[0].setting), chosen: `the only fit setting covering every selected profile: "${covering[0].setting.name}"` };
  if (candidates.length === 1) {
    const c = candidates[0];
    return { options: settingOptions(c.setting), chosen: `the only fit setting any selected profile was fitted with: "${c.setting.name}" (${ids.length - c.covered.size} profiles fitted now with it)` };
  }
  if (candidates.length === 0) {
    const model = choice.fitModel ?? "exponential";
    return { options: defaultFitOptions(model), chosen: `no stored fits: the default ${model} fit` };
  }
  const list = candidates
    .sort((a, b) => b.covered.size - a.covered.size)
    .map((c) => `  ${c.setting.name} (${describeFitSetting(c.setting.options)}): ${genotypeCounts(profiles, c.covered)}`)
    .join("\n");
  throw new UserError(
    "choose-fit-setting",
    `The selected profiles were fitted under ${candidates.length} different fit settings${covering.length ? `, ${covering.length} of which cover all ${ids.length}` : " and none covers all of them"}. ` +
      `Group analyses never mix settings: choose one with --fits NAME (field "fits"); profiles without a fit under it are fitted now with it.\n${list}`,
    { status: 409, issues: candidates.map((c) => ({ path: "fits", message: `${c.setting.name}: ${c.covered.size}/${ids.length} profiles` })) },
  );
}

/** Fit, with the setting's options, the profiles that have no fit under it, and store those fits under it. */
function fitMissing(db: Db, profiles: readonly ProfileData[], options: ResolvedFitOptions): number {
  if (profiles.length === 0) return 0;
  const byModel = { [options.model]: options };
  const input = {
    profiles: profiles.map((p) => ({ profileId: p.profileId, embryo: p.embryo, genotype: p.genotype, channel: p.channel, timeS: p.timeS, x: p.positionsUm, y: p.intensities, lengthUm: p.lengthUm })),
    models: [options.model],
    options: byModel,
    global: false,
    diffusion: null,
    accumulationPositionsUm: [],
    settings: planFitSettings(db, byModel, undefined),
  };
  storeFitOutput(db, input, runFitTask(input));
  return profiles.length;
}

/** The one fit setting of a group analysis and every profile's fit under it, fitting the missing ones now. */
export function resolveGroupFits(db: Db, profiles: readonly ProfileData[], choice: FitChoice): GroupFits {
  assignMissingFitSettings(db);
  let { options, chosen } = chooseSetting(db, profiles, choice);
  const hash = () => fitSettingHash(options);
  const stored = () => findFitSetting(db, { hash: hash() });
  const known = (opts: ResolvedFitOptions) => {
    const s = findFitSetting(db, { hash: fitSettingHash(opts) });
    const fits = s ? fitsUnder(db, s.id, profiles.map((p) => p.profileId)) : new Map<number, StoredFit>();
    return new Map([...fits].map(([id, f]) => [id, f.aicc]));
  };
  const prefProfiles = profiles.map((p) => ({ profileId: p.profileId, group: p.genotype, x: p.positionsUm, y: p.intensities, lengthUm: p.lengthUm }));
  const table = modelAicc(prefProfiles, options, known(options));
  let preference = modelPreference(prefProfiles, table, options.model);
  if (choice.fitModel === "best") {
    if (preference.best_overall === null) throw new UserError("no-best-model", "No model could be fitted to every group, so none can be chosen by summed AICc; choose a model.", { status: 422 });
    const perGroup = preference.groups.map((g) => `${g.group}: ${g.best_by_summed_aicc}`).join(", ");
    options = FitOptions.parse({ ...options, model: preference.best_overall });
    chosen = `${chosen} → ${preference.best_overall} (best per group by summed AICc: ${perGroup}; one model for every group keeps them comparable)`;
    preference = modelPreference(prefProfiles, table, options.model);
  }
  const existing = stored();
  const have = existing ? fitsUnder(db, existing.id, profiles.map((p) => p.profileId)) : new Map<number, StoredFit>();
  const fittedNow = fitMissing(db, profiles.filter((p) => !have.has(p.profileId)), options);
  const setting = stored()!;
  return { setting: fitSettingSummary(setting), chosen, fitByProfile: fitsUnder(db, setting.id, profiles.map((p) => p.profileId)), fittedNow, preference };
}

/**
 * The fits given by id, exactly: to re-run a stored analysis on the same inputs.
 * They must be of one setting and of different profiles.
 */
export function givenGroupFits(db: Db, fitIds: number[]): { setting: FitSettingSummary; fitByProfile: Map<number, StoredFit> } {
  assignMissingFitSettings(db);
  const fits = listFits(db, { ids: fitIds });
  const missing = fitIds.filter((id) => !fits.some((f) => f.id === id));
  if (missing.length) throw new UserError("unknown-fit", `No stored fit has id ${missing.slice(0, 10).join(", ")}${missing.length > 10 ? ", …" : ""}.`, { status: 404, issues: [{ path: "fitIds", message: "unknown fit ids" }] });
  const settingIds = new Set(fits.map((f) => f.settingId));
  if (settingIds.size !== 1) throw new UserError("mixed-fit-settings", `The given fits belong to ${settingIds.size} different fit settings; a group analysis uses one.`, { status: 422, issues: [{ path: "fitIds", message: "mixed settings" }] });
  const byProfile = new Map<number, StoredFit>();
  for (const f of fits) {
    if (byProfile.has(f.profileId)) throw new UserError("duplicate-profile", `Fits ${byProfile.get(f.profileId)!.id} and ${f.id} are of the same profile; give one fit per profile.`, { status: 422, issues: [{ path: "fitIds", message: "two fits of one profile" }] });
    byProfile.set(f.profileId, f);
  }
  return { setting: fitSettingSummary(findFitSetting(db, { id: [...settingIds][0]! })!), fitByProfile: byProfile };
}
