import type { Db } from "../../../db/connection.ts";
import {
  assignFitSetting,
  ensureFitSetting,
  findFitSetting,
  fitSettingCoverage,
  fitSettingHash,
  fitsWithoutSetting,
  listFitSettings,
  profilesPerGenotype,
  settingOptionsOf,
  type StoredFitSetting,
} from "../../../db/fitSettings.ts";
import { canonicalJson } from "../../../db/stableHash.ts";
import { FitOptions, type ResolvedFitOptions } from "../../analysis/fit/fitOptions.ts";
import { modelNames, type ModelName } from "../../analysis/models/steadyStateModel.ts";
import { UserError } from "../../userError.ts";

/** Names a user cannot give a setting: they mean something else where settings are chosen. */
const RESERVED = new Set(["best", "all"]);
const NAME_RULE = /^[A-Za-z0-9][A-Za-z0-9._-]{0,47}$/;

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);
const short = (v: unknown) => (typeof v === "number" ? String(Number(v.toPrecision(4))) : String(v));

/** The default options of a model: the setting a model name stands for. */
export function defaultFitOptions(model: ModelName): ResolvedFitOptions {
  return FitOptions.parse({ model });
}

/** The part of a generated name that says how a setting differs from its model's defaults. */
function differences(options: Record<string, unknown>): { tokens: string[]; words: string[] } {
  const defaults = defaultFitOptions(options.model as ModelName) as unknown as Record<string, unknown>;
  const tokens: string[] = [];
  const words: string[] = [];
  for (const key of [...new Set([...Object.keys(defaults), ...Object.keys(options)])].sort()) {
    if (key === "model") continue;
    const value = options[key];
    if (canonicalJson(value) === canonicalJson(defaults[key])) continue;
    if (key === "window" && isObject(value)) {
      const from = value.xMinUm ?? value.fromFraction;
      const to = value.xMaxUm ?? value.toFraction;
      const unit = value.xMinUm !== undefined || value.xMaxUm !== undefined ? "um" : "L";
      tokens.push(`${from !== undefined ? short(from) : ""}-${to !== undefined ? short(to) : ""}${unit}`.replace(/^-/, "to").replace(/-(um|L)$/, "$1-on"));
      words.push(`window ${from !== undefined ? short(from) : "start"}–${to !== undefined ? short(to) : "end"} ${unit === "um" ? "µm" : "× length"}`);
    } else if (key === "background" && value === false) {
      tokens.push("nobg");
      words.push("no background fitted");
    } else if (key === "fixed" && isObject(value)) {
      for (const [k, v] of Object.entries(value).sort()) {
        tokens.push(`${k.replace(/Um$/, "")}${short(v)}`);
        words.push(`${k.replace(/Um$/, " (µm)")} held at ${short(v)}`);
      }
    } else if (key === "robust" && isObject(value)) {
      tokens.push(String(value.loss));
      words.push(`robust loss ${String(value.loss)}${value.scale !== undefined ? ` (scale ${short(value.scale)})` : ""}`);
    } else if (typeof value === "string" || typeof value === "number" || typeof value === "boolean") {
      tokens.push(key === "weights" ? String(value) : `${key}-${short(value)}`);
      words.push(`${key} ${short(value)}`);
    } else {
      tokens.push(key);
      words.push(`${key} ${canonicalJson(value)}`);
    }
  }
  return { tokens, words };
}

/** A readable name from the options: the model, then what differs from its defaults (e.g. "exponential-30um-on"). */
export function generatedSettingName(options: Record<string, unknown>): string {
  const { tokens } = differences(options);
  return [String(options.model), ...tokens].join("-").replace(/[^A-Za-z0-9._-]/g, "").slice(0, 48);
}

/** The setting in words, for tables and messages: "exponential, window 30–end µm". */
export function describeFitSetting(options: Record<string, unknown>): string {
  const { words } = differences(options);
  return [String(options.model), ...(words.length ? words : ["whole profile, default options"])].join(", ");
}

function freeName(db: Db, base: string, hash: string): string {
  for (let i = 1; ; i++) {
    const name = i === 1 ? base : `${base}-${i}`;
    const taken = findFitSetting(db, { name });
    if (!taken || taken.hash === hash) return name;
  }
}

/**
 * Give every fit stored before fit settings existed its setting (by the hash of
 * its options, without the interpretation keys). Idempotent and cheap once done.
 */
export function assignMissingFitSettings(db: Db): void {
  const pending = fitsWithoutSetting(db);
  if (pending.length === 0) return;
  const byHash = new Map<string, { options: Record<string, unknown>; model: string; ids: number[] }>();
  for (const f of pending) {
    const options = settingOptionsOf(f.options);
    const hash = fitSettingHash(options);
    const entry = byHash.get(hash) ?? { options, model: f.model, ids: [] };
    entry.ids.push(f.id);
    byHash.set(hash, entry);
  }
  for (const [hash, e] of byHash) {
    const setting = ensureFitSetting(db, { name: freeName(db, generatedSettingName(e.options), hash), model: e.model, options: e.options, rename: false });
    assignFitSetting(db, e.ids, setting.id);
  }
}

/** What a fit run will store its fits under, per model: the name and whether an existing setting takes it. */
export interface PlannedSetting {
  name: string;
  hash: string;
  /** A user-given name renames the setting when it already exists under another name. */
  rename: boolean;
}

/**
 * The setting each model's fits will belong to. A name the user gives (`as`)
 * is checked before anything is fitted: it must be free or already belong to
 * these options. With several models, each setting is named NAME-model.
 */
export function planFitSettings(db: Db, options: Record<string, ResolvedFitOptions>, as: string | undefined): Record<string, PlannedSetting> {
  assignMissingFitSettings(db);
  const models = Object.keys(options);
  const out: Record<string, PlannedSetting> = {};
  for (const model of models) {
    const opts = options[model] as unknown as Record<string, unknown>;
    const hash = fitSettingHash(opts);
    const existing = findFitSetting(db, { hash });
    if (as === undefined) {
      out[model] = { name: existing?.name ?? freeName(db, generatedSettingName(opts), hash), hash, rename: false };
      continue;
    }
    const name = models.length > 1 ? `${as}-${model}` : as;
    if (!NAME_RULE.test(name)) {
      throw new UserError("bad-setting-name", `Fit setting name "${name}" is not allowed: use up to 48 letters, digits, ".", "_" or "-", starting with a letter or digit.`, { status: 400, issues: [{ path: "as", message: "invalid name" }] });
    }
    if (RESERVED.has(name)) throw new UserError("bad-setting-name", `"${name}" cannot name a fit setting: it means something else where settings are chosen (--fits ${name}).`, { status: 400, issues: [{ path: "as", message: "reserved name" }] });
    if ((modelNames as readonly string[]).includes(name) && fitSettingHash(defaultFitOptions(name as ModelName)) !== hash) {
      throw new UserError("bad-setting-name", `"${name}" names the default ${name} fit (whole profile, default options); give these options another name.`, { status: 400, issues: [{ path: "as", message: "model name" }] });
    }
    const owner = findFitSetting(db, { name });
    if (owner && owner.hash !== hash) {
      throw new UserError(
        "setting-name-taken",
        `The fit setting name "${name}" is already used for other options (${describeFitSetting(owner.options)}); choose another name, or fit with those options.`,
        { status: 409, issues: [{ path: "as", message: "name taken" }] },
      );
    }
    out[model] = { name, hash, rename: existing !== null && existing.name !== name };
  }
  return out;
}

/** Create (or rename) the planned setting; returns it as stored. */
export function storePlannedSetting(db: Db, planned: PlannedSetting, options: ResolvedFitOptions): StoredFitSetting {
  return ensureFitSetting(db, { name: planned.name, model: options.model, options, rename: planned.rename });
}

/** A setting as analyses and listings show it. */
export interface FitSettingSummary {
  name: string;
  hash: string;
  model: string;
  description: string;
  options: Record<string, unknown>;
}

export function fitSettingSummary(s: Pick<StoredFitSetting, "name" | "hash" | "model" | "options">): FitSettingSummary {
  return { name: s.name, hash: s.hash, model: s.model, description: describeFitSetting(s.options), options: s.options };
}

/** Every stored setting with, per genotype, how many steady-state profiles have a fit under it. */
export function fitSettingsOverview(db: Db, filter: { channel?: string } = {}) {
  assignMissingFitSettings(db);
  const totals = profilesPerGenotype(db, filter);
  const coverage = fitSettingCoverage(db, filter);
  return {
    channel: filter.channel ?? null,
    settings: listFitSettings(db).map((s) => ({
      ...fitSettingSummary(s),
      created_at: s.createdAt,
      coverage: totals.map((t) => ({ genotype: t.genotype, fitted: coverage.find((c) => c.settingId === s.id && c.genotype === t.genotype)?.fitted ?? 0, profiles: t.profiles })),
    })),
  };
}

export type FitSettingsOverview = ReturnType<typeof fitSettingsOverview>;
