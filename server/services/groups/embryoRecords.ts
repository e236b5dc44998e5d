import type { Db } from "../../../db/connection.ts";
import { distinctValues, loadProfiles, type ProfileData } from "../../../db/profiles.ts";
import { defaultBoundaryThreshold, readBoundary } from "../../analysis/compare/boundaryPosition.ts";
import type { EmbryoRecord } from "../../analysis/compare/embryoRecord.ts";
import type { FitSettingSummary } from "../fits/fitSettings.ts";
import { applyExclusions, type LeftOut } from "../exclusions/exclusionService.ts";
import { givenGroupFits, resolveGroupFits, type GroupFits } from "./groupFits.ts";
import type { ModelPreference } from "./modelPreference.ts";
import { UserError } from "../../userError.ts";
import { describeSelection, selectionFilter } from "../selection.ts";
import type { RecordsRequest } from "./recordsRequest.ts";

export interface EmbryoRecords {
  channel: string;
  records: EmbryoRecord[];
  profileIds: number[];
  threshold: { value: number; source: string };
  /** Profiles that had no fit under the setting and were fitted now with it. */
  fittedNow: number;
  /** The one fit setting every group's values come from, and how it was chosen. */
  fitSetting: FitSettingSummary;
  fitSettingChosen: string;
  /** The fit used for each profile, in the order of profileIds. */
  fitIds: number[];
  /** Embryos and profiles left out by an exclusion, with the reasons. */
  leftOut: LeftOut[];
  /** Which model AICc prefers per group (null when the fits were given by id). */
  modelPreference: ModelPreference | null;
}

/** Stage labels such as "S10" or "cycle 14" are compared as numbers when they carry one. */
function stageValue(stage: string | null): number | string | undefined {
  if (stage === null) return undefined;
  const m = /-?\d+(\.\d+)?/.exec(stage);
  return m ? Number(m[0]) : stage;
}

/**
 * Per-embryo values for group statistics: each selected profile's fit under
 * one fit setting (fitting, with that setting, any profile that has none yet),
 * the boundary position at a common threshold read from the data, and the
 * embryo's metadata. Excluded embryos are left out and listed; with fitIds,
 * exactly the given fits are used.
 */
export function gatherEmbryoRecords(db: Db, request: RecordsRequest, referenceGroup?: { field: string; value: string }): EmbryoRecords {
  let profiles: ProfileData[];
  let channel: string;
  let leftOut: LeftOut[] = [];
  let fits: Pick<GroupFits, "setting" | "fitByProfile"> & Partial<GroupFits>;
  if (request.fitIds) {
    fits = givenGroupFits(db, request.fitIds);
    profiles = loadProfiles(db, { profileIds: [...fits.fitByProfile.keys()] });
    const channels = [...new Set(profiles.map((p) => p.channel))];
    if (channels.length !== 1 || profiles.some((p) => p.timeS !== null)) throw new UserError("mixed-fit-ids", "The given fits must be of steady-state profiles of one channel.", { status: 422, issues: [{ path: "fitIds", message: "several channels or time points" }] });
    channel = channels[0];
    if (request.channel !== undefined && request.channel !== channel) throw new UserError("mixed-fit-ids", `The given fits are of channel "${channel}", not "${request.channel}".`, { status: 422 });
  } else {
    const stored = distinctValues(db, "channel");
    const chosen = request.channel ?? (stored.length === 1 ? stored[0] : null);
    if (chosen === null) throw new UserError("choose-channel", `Several channels are stored (${stored.join(", ")}); choose one with channel.`, { status: 400 });
    channel = chosen;
    const selected = loadProfiles(db, { ...selectionFilter(request.selection), channel }).filter((p) => p.timeS === null);
    if (selected.length === 0) throw new UserError("nothing-selected", `No stored profiles of channel "${channel}" match ${describeSelection(request.selection)}.`, { status: 404 });
    const split = applyExclusions(db, selected, request.includeExcluded);
    profiles = split.kept;
    leftOut = split.leftOut;
    if (profiles.length === 0) throw new UserError("all-excluded", `Every selected profile of channel "${channel}" is excluded (${leftOut.map((l) => `${l.embryo}: ${l.reason}`).join("; ")}).`, { status: 422 });
    fits = resolveGroupFits(db, profiles, { fits: request.fits, fitModel: request.fitModel });
  }

  const threshold = resolveThreshold(profiles, request.threshold, referenceGroup);
  const records: EmbryoRecord[] = profiles.map((p) => {
    const fit = fits.fitByProfile.get(p.profileId)!;
    const r = fit.result as { fit: { ok: boolean; parameters?: Record<string, { value: number; se: number | null }> } };
    const params = r.fit.ok ? r.fit.parameters! : {};
    const boundary = readBoundary(p.positionsUm, p.intensities, threshold.value);
    const background = params.background?.value;
    const amplitude = params.amplitude?.value;
    return {
      embryo: p.embryo,
      group: p.genotype,
      genotype: p.genotype,
      channel: p.channel,
      lambdaUm: params.lambdaUm?.value ?? params.x0Um?.value ?? NaN,
      lambdaSeUm: params.lambdaUm?.se ?? undefined,
      // The comparison layer subtracts the background itself, so pass the amplitude including it.
      amplitude: amplitude !== undefined && background !== undefined ? amplitude + background : amplitude,
      background,
      boundaryUm: boundary.kind === "crossed" ? boundary.positionUm : undefined,
      boundaryCensored: boundary.kind === "crossed" ? undefined : boundary.kind,
      boundaryLimitUm: boundary.kind === "crossed" ? undefined : boundary.limitUm,
      lengthUm: p.lengthUm ?? undefined,
      stage: stageValue(p.stage),
      ageS: p.ageS ?? undefined,
      dosage: p.dosage ?? undefined,
      session: p.session ?? undefined,
      converged: fit.status === "converged",
      status: fit.status,
      metadata: p.metadata,
    };
  });
  return {
    channel,
    records,
    profileIds: profiles.map((p) => p.profileId),
    threshold,
    fittedNow: fits.fittedNow ?? 0,
    fitSetting: fits.setting,
    fitSettingChosen: fits.chosen ?? "given as fit ids",
    fitIds: profiles.map((p) => fits.fitByProfile.get(p.profileId)!.id),
    leftOut,
    modelPreference: fits.preference ?? null,
  };
}

function resolveThreshold(profiles: ProfileData[], given: number | undefined, reference?: { field: string; value: string }): { value: number; source: string } {
  if (given !== undefined) return { value: given, source: "given" };
  const pick = (p: ProfileData) => {
    if (!reference) return p.dosage === 1 || p.dosage === null;
    const v = reference.field === "genotype" ? p.genotype : reference.field === "stage" ? p.stage : reference.field === "session" ? p.session : reference.field === "dosage" ? String(p.dosage) : p.metadata[reference.field];
    return v === reference.value;
  };
  const ref = profiles.filter(pick);
  const used = ref.length > 0 ? ref : profiles;
  const label = reference && ref.length > 0 ? `${reference.field} "${reference.value}"` : ref.length > 0 ? "the dosage-1 embryos" : "all selected embryos";
  return {
    value: defaultBoundaryThreshold(used.map((p) => ({ intensity: p.intensities }))),
    source: `a quarter of the way from the far-end to the source-end level of ${label}`,
  };
}
