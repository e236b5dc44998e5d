import type { Db } from "../../../db/connection.ts";
import { listFits } from "../../../db/fits.ts";
import { distinctValues, loadProfiles, type ProfileData } from "../../../db/profiles.ts";
import { defaultBoundaryThreshold, readBoundary } from "../../analysis/compare/boundaryPosition.ts";
import type { EmbryoRecord } from "../../analysis/compare/embryoRecord.ts";
import { FitOptions } from "../../analysis/fit/fitOptions.ts";
import { runFitTask } from "../fits/fitTask.ts";
import { storeFitOutput } from "../fits/fitService.ts";
import { UserError } from "../../userError.ts";
import { describeSelection, selectionFilter } from "../selection.ts";
import type { RecordsRequest } from "./recordsRequest.ts";

export interface EmbryoRecords {
  channel: string;
  records: EmbryoRecord[];
  profileIds: number[];
  threshold: { value: number; source: string };
  /** Profiles that had no stored fit of the model and were fitted now with default options. */
  fittedNow: number;
  fitModel: string;
}

/** Stage labels such as "S10" or "cycle 14" are compared as numbers when they carry one. */
function stageValue(stage: string | null): number | string | undefined {
  if (stage === null) return undefined;
  const m = /-?\d+(\.\d+)?/.exec(stage);
  return m ? Number(m[0]) : stage;
}

/**
 * Per-embryo values for group statistics: the newest fit of each selected
 * profile (fitting, with default options, any profile that has none yet),
 * the boundary position at a common threshold read from the data, and the
 * embryo's metadata.
 */
export function gatherEmbryoRecords(db: Db, request: RecordsRequest, referenceGroup?: { field: string; value: string }): EmbryoRecords {
  const stored = distinctValues(db, "channel");
  const channel = request.channel ?? (stored.length === 1 ? stored[0] : null);
  if (channel === null) throw new UserError("choose-channel", `Several channels are stored (${stored.join(", ")}); choose one with channel.`, { status: 400 });
  const profiles = loadProfiles(db, { ...selectionFilter(request.selection), channel }).filter((p) => p.timeS === null);
  if (profiles.length === 0) throw new UserError("nothing-selected", `No stored profiles of channel "${channel}" match ${describeSelection(request.selection)}.`, { status: 404 });

  const latest = new Map<number, ReturnType<typeof listFits>[number]>();
  for (const f of listFits(db, { profileIds: profiles.map((p) => p.profileId), model: request.fitModel })) {
    const prev = latest.get(f.profileId);
    if (!prev || f.createdAt > prev.createdAt || (f.createdAt === prev.createdAt && f.id > prev.id)) latest.set(f.profileId, f);
  }
  const missing = profiles.filter((p) => !latest.has(p.profileId));
  if (missing.length > 0) {
    const input = {
      profiles: missing.map((p) => ({ profileId: p.profileId, embryo: p.embryo, genotype: p.genotype, channel: p.channel, timeS: p.timeS, x: p.positionsUm, y: p.intensities, lengthUm: p.lengthUm })),
      models: [request.fitModel],
      options: { [request.fitModel]: FitOptions.parse({ model: request.fitModel }) },
      global: false,
      diffusion: null,
      accumulationPositionsUm: [],
    };
    storeFitOutput(db, input, runFitTask(input));
    for (const f of listFits(db, { profileIds: missing.map((p) => p.profileId), model: request.fitModel })) latest.set(f.profileId, f);
  }

  const threshold = resolveThreshold(profiles, request.threshold, referenceGroup);
  const records: EmbryoRecord[] = profiles.map((p) => {
    const fit = latest.get(p.profileId)!;
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
  return { channel, records, profileIds: profiles.map((p) => p.profileId), threshold, fittedNow: missing.length, fitModel: request.fitModel };
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
