import { storeAnalysis } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import { listFitItems } from "../../../db/fits.ts";
import { distinctValues, loadProfiles } from "../../../db/profiles.ts";
import { UserError } from "../../userError.ts";
import { ENGINE_VERSION } from "../../version.ts";
import { describeSelection, selectionFilter } from "../selection.ts";
import type { PrecisionRequest } from "./precisionRequest.ts";
import { applyExclusions, type LeftOut } from "../exclusions/exclusionService.ts";
import { precisionGroupResponse } from "./precisionResponse.ts";
import type { PrecisionGroupOutput, PrecisionTaskInput } from "./precisionTask.ts";

export { precisionSummary, type PrecisionSummary } from "./precisionResponse.ts";

/** Read each group's profiles (one group per genotype unless one is chosen) and the per-embryo λ of stored fits. */
export function preparePrecisionInput(db: Db, request: PrecisionRequest): PrecisionTaskInput {
  const stored = distinctValues(db, "channel");
  const channels = request.channels ?? (stored.length === 1 ? stored : null);
  if (channels === null) {
    throw new UserError("choose-channel", `Several channels are stored (${stored.join(", ")}); choose one, or several for the joint positional error.`, { status: 400 });
  }
  for (const c of channels) if (!stored.includes(c)) throw new UserError("unknown-channel", `No profiles of channel "${c}" are stored (channels: ${stored.join(", ") || "none"}).`, { status: 404 });
  const genotypes = request.selection.genotype ? [request.selection.genotype] : (request.selection.genotypes ?? distinctValues(db, "genotype"));
  const groups = genotypes
    .map((genotype) => {
      const leftOut: LeftOut[] = [];
      const perChannel = channels.map((channel) => {
        // Excluded embryos and profiles are left out (and listed with their reasons) unless asked for.
        const split = applyExclusions(db, loadProfiles(db, { ...selectionFilter({ ...request.selection, genotypes: undefined, genotype }), channel }).filter((p) => p.timeS === null), request.includeExcluded);
        for (const l of split.leftOut) if (!leftOut.some((k) => k.embryo === l.embryo && k.channel === l.channel)) leftOut.push(l);
        const rows = split.kept;
        return {
          channel,
          profileIds: rows.map((r) => r.profileId),
          profiles: rows.map((r) => ({ embryo: r.embryo, positionUm: r.positionsUm, intensity: r.intensities, lengthUm: r.lengthUm ?? undefined })),
        };
      });
      const lambdas: Record<string, Record<string, number>> = {};
      for (const f of listFitItems(db, { genotype, channel: channels[0], model: "exponential" })) {
        if (f.status === "converged" && f.lambdaUm) lambdas[f.embryo] = { lambdaUm: f.lambdaUm.value };
      }
      return { name: genotype, channels: perChannel, embryoSummaries: lambdas, leftOut };
    })
    .filter((g) => g.channels.every((c) => c.profiles.length > 0));
  if (groups.length === 0) {
    throw new UserError("nothing-selected", `No stored profiles of channel ${channels.map((c) => `"${c}"`).join(", ")} match ${describeSelection(request.selection)}.`, { status: 404 });
  }
  const leftOut = Object.fromEntries(groups.map((g) => [g.name, g.leftOut]));
  return { request, groups: groups.map(({ leftOut: _l, ...g }) => g), leftOut };
}

/** Store each group's analysis with its selection and settings and answer with the summaries. */
export function storePrecisionOutput(db: Db, input: PrecisionTaskInput, output: PrecisionGroupOutput[]) {
  return {
    results: output.map((g) => {
      const analysisId = storeAnalysis(db, {
        kind: "precision",
        // Who was left out is part of what was analysed: a run after an exclusion is stored beside the earlier one.
        selection: { ...input.request.selection, genotype: g.name, channels: g.channels, ...(input.leftOut?.[g.name]?.length ? { leftOut: input.leftOut[g.name].map((l) => [l.embryo, l.channel]) } : {}) },
        settings: input.request,
        engineVersion: ENGINE_VERSION,
        result: { ...g, left_out: input.leftOut?.[g.name] ?? [] },
        profileIds: g.profileIds,
      });
      return precisionGroupResponse(analysisId, { ...g, left_out: input.leftOut?.[g.name] ?? [] });
    }),
  };
}
