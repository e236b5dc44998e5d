import { storeAnalysis } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import type { CompareResult } from "../../analysis/compare/compareGroups.ts";
import { ENGINE_VERSION } from "../../version.ts";
import type { CompareRequest } from "./compareRequest.ts";
import type { CompareTaskInput } from "./compareTask.ts";
import { gatherEmbryoRecords, type EmbryoRecords } from "./embryoRecords.ts";
import { storedGroupExtras } from "./groupExtras.ts";
import { comparisonEmbryoValues } from "./comparisonEmbryoValues.ts";
import { comparisonResponse, type StoredComparison } from "./comparisonResponse.ts";
import { analysisInputs, inputSettings } from "./analysisInputs.ts";

export interface PreparedComparison {
  request: CompareRequest;
  gathered: Omit<EmbryoRecords, "records">;
  task: CompareTaskInput;
}

export function prepareComparison(db: Db, request: CompareRequest): PreparedComparison {
  const reference = request.reference ? { field: request.by, value: request.reference } : undefined;
  const { records, ...gathered } = gatherEmbryoRecords(db, request, reference);
  const extras = request.by === "genotype" ? storedGroupExtras(db, gathered.channel, gathered.fitSetting.hash) : {};
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

/** Store the comparison with its inputs, settings and per-embryo values; answer with the result and its provenance. */
export function storeComparison(db: Db, prepared: PreparedComparison, result: CompareResult) {
  const stored: StoredComparison = {
    ...result,
    embryo_values: comparisonEmbryoValues(prepared.task.records, result),
    inputs: analysisInputs(prepared.gathered),
  };
  const analysis = {
    selection: { ...prepared.request.selection, channel: prepared.gathered.channel },
    settings: { ...prepared.request, threshold: prepared.gathered.threshold, ...inputSettings(prepared.gathered) },
    result: stored,
  };
  const id = storeAnalysis(db, { kind: "comparison", ...analysis, engineVersion: ENGINE_VERSION, profileIds: prepared.gathered.profileIds });
  return comparisonResponse({ id, ...analysis });
}
