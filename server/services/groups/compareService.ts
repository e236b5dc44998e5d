import { storeAnalysis } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import type { CompareResult } from "../../analysis/compare/compareGroups.ts";
import { ENGINE_VERSION } from "../../version.ts";
import type { CompareRequest } from "./compareRequest.ts";
import type { CompareTaskInput } from "./compareTask.ts";
import { gatherEmbryoRecords, type EmbryoRecords } from "./embryoRecords.ts";
import { storedGroupExtras } from "./groupExtras.ts";

export interface PreparedComparison {
  request: CompareRequest;
  gathered: Omit<EmbryoRecords, "records">;
  task: CompareTaskInput;
}

export function prepareComparison(db: Db, request: CompareRequest): PreparedComparison {
  const reference = request.reference ? { field: request.by, value: request.reference } : undefined;
  const { records, ...gathered } = gatherEmbryoRecords(db, request, reference);
  const extras = request.by === "genotype" ? storedGroupExtras(db, gathered.channel, request.fitModel) : {};
  return {
    request,
    gathered,
    task: {
      records,
      options: {
        by: request.by === "genotype" ? "group" : request.by,
        reference: request.reference,
        metric: request.metric,
        permutations: request.permutations,
        bootstrap: request.bootstrap,
        seed: request.seed,
        extras,
      },
    },
  };
}

/** Store the comparison with its inputs and settings; answer with the result and its provenance. */
export function storeComparison(db: Db, prepared: PreparedComparison, result: CompareResult) {
  const analysisId = storeAnalysis(db, {
    kind: "comparison",
    selection: { ...prepared.request.selection, channel: prepared.gathered.channel },
    settings: { ...prepared.request, threshold: prepared.gathered.threshold },
    engineVersion: ENGINE_VERSION,
    result,
    profileIds: prepared.gathered.profileIds,
  });
  return {
    analysis_id: analysisId,
    channel: prepared.gathered.channel,
    by: prepared.request.by,
    metric: prepared.request.metric,
    fit_model: prepared.gathered.fitModel,
    boundary_threshold: prepared.gathered.threshold,
    fitted_now: prepared.gathered.fittedNow,
    ...result,
  };
}
