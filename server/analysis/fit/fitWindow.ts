import type { ModelName } from "../models/steadyStateModel.ts";
import { detectSourcePlateau } from "./detectSourcePlateau.ts";
import type { ResolvedFitOptions } from "./fitOptions.ts";
import { formatNumber } from "./formatNumber.ts";
import { prepareProfile, releasePreparedProfile, type PrepareOutcome, type ProfileContext } from "./prepareProfile.ts";

/** How one end of a fit window was chosen. */
export type WindowEndRule = "data" | "given-um" | "given-fraction-of-length" | "past-source-plateau" | "past-source-dip";

/** The positions a fit actually used, and how they were chosen. */
export interface FitWindow {
  /** First and last position fitted (µm). */
  fromUm: number;
  toUm: number;
  startRule: WindowEndRule;
  endRule: WindowEndRule;
  /** One sentence: the window and how it was chosen. */
  description: string;
}

/** The ends the options ask for, in µm; a fraction of length needs the embryo's length. */
export function requestedRange(options: ResolvedFitOptions, lengthUm: number | null):
  | { ok: true; minUm: number; maxUm: number; startRule: WindowEndRule; endRule: WindowEndRule }
  | { ok: false; message: string } {
  const w = options.window ?? {};
  const needsLength = w.xMinFractionOfLength !== undefined || w.xMaxFractionOfLength !== undefined;
  if (needsLength && lengthUm === null)
    return { ok: false, message: "the window is given as a fraction of the embryo length, but this embryo has no length; give the window in µm or import the embryo lengths" };
  const L = lengthUm ?? NaN;
  const minUm = w.xMinUm ?? (w.xMinFractionOfLength !== undefined ? w.xMinFractionOfLength * L : -Infinity);
  const maxUm = w.xMaxUm ?? (w.xMaxFractionOfLength !== undefined ? w.xMaxFractionOfLength * L : Infinity);
  const rule = (um: number | undefined, fraction: number | undefined): WindowEndRule =>
    um !== undefined ? "given-um" : fraction !== undefined ? "given-fraction-of-length" : "data";
  return { ok: true, minUm, maxUm, startRule: rule(w.xMinUm, w.xMinFractionOfLength), endRule: rule(w.xMaxUm, w.xMaxFractionOfLength) };
}

/**
 * Select the points of one profile to fit: the requested window (µm or a
 * fraction of the embryo length), then, when its start is open and
 * `autoWindow` is on, the start moved past a detected source plateau or dip
 * (never for the `source` model, which describes the source region). Adds a
 * warning saying how to override an automatic start. The caller releases
 * the prepared profile.
 */
export function prepareWindowedProfile(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  options: ResolvedFitOptions,
  context: ProfileContext,
  warnings: string[],
): { outcome: PrepareOutcome; window: FitWindow | null } {
  const range = requestedRange(options, context.lengthUm ?? null);
  if (!range.ok) return { outcome: { ok: false, message: range.message }, window: null };
  let outcome = prepareProfile(x, y, options, context, range);
  if (!outcome.ok) return { outcome, window: null };
  let startRule = range.startRule;
  const model: ModelName = options.model;
  if (options.autoWindow && startRule === "data" && model !== "source") {
    const profile = outcome.profile;
    const found = detectSourcePlateau(profile.x, profile.y);
    if (found.kind !== "none" && found.startUm > profile.x[0]) {
      releasePreparedProfile(profile);
      outcome = prepareProfile(x, y, options, context, { minUm: found.startUm, maxUm: range.maxUm });
      if (!outcome.ok) return { outcome, window: null };
      startRule = found.kind === "dip" ? "past-source-dip" : "past-source-plateau";
      warnings.push(
        `the profile ${found.kind === "dip" ? "rises before it falls" : "is flat"} near the source, so the fit starts at ${formatNumber(found.startUm)} µm, where it falls most steeply; ` +
          "to fit from the first point give the window's start (--window 0: on the command line, window.xMinUm in the options) or turn autoWindow off",
      );
    }
  }
  const p = outcome.profile;
  const n = p.x.length;
  const fromUm = n > 0 ? p.x[0] : NaN;
  const toUm = n > 0 ? p.x[n - 1] : NaN;
  const why: Record<WindowEndRule, string> = {
    data: "the data",
    "given-um": "given in µm",
    "given-fraction-of-length": `given as a fraction of the length L = ${formatNumber(context.lengthUm ?? NaN)} µm`,
    "past-source-plateau": "past a detected source plateau",
    "past-source-dip": "past a detected source dip",
  };
  const description =
    startRule === "data" && range.endRule === "data"
      ? `whole profile, ${formatNumber(fromUm)}–${formatNumber(toUm)} µm`
      : `${formatNumber(fromUm)}–${formatNumber(toUm)} µm (start: ${why[startRule]}; end: ${why[range.endRule]})`;
  return { outcome, window: { fromUm, toUm, startRule, endRule: range.endRule, description } };
}
