import { getAnalysis, type AnalysisKind } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import { UserError } from "../../userError.ts";
import { comparisonResponse, type ComparisonResponse } from "../groups/comparisonResponse.ts";
import { planResponse, type PlanResponse } from "../groups/planResponse.ts";
import { trackingResponse, type TrackingResponse } from "../groups/trackingResponse.ts";
import { storedPrecisionResponse, type PrecisionGroupResponse } from "../precision/precisionResponse.ts";

/** The kinds of stored analysis whose job answer can be rebuilt, and that answer's type. */
export interface AnalysisResponses {
  precision: PrecisionGroupResponse;
  comparison: ComparisonResponse;
  tracking: TrackingResponse;
  plan: PlanResponse;
}
export type ResponseKind = keyof AnalysisResponses;

const BUILDERS: { [K in ResponseKind]: (a: NonNullable<ReturnType<typeof getAnalysis>>) => AnalysisResponses[K] } = {
  precision: storedPrecisionResponse,
  comparison: comparisonResponse,
  tracking: trackingResponse,
  plan: planResponse,
};

const ARTICLE: Record<AnalysisKind, string> = { "global-fit": "a global fit", precision: "a precision analysis", comparison: "a comparison", tracking: "a tracking analysis", plan: "a sample-size plan", dynamics: "a build-up fit", frap: "a FRAP analysis", combine: "a FRAP–gradient combination", simulation: "a simulation" };

/**
 * The answer the job gave for stored analysis `id`, rebuilt by the same
 * function the job used. 404 for an unknown id; 400 when the analysis is not
 * of the kind `use` needs (e.g. a comparison where σ_x is asked for).
 */
export function analysisResponse<K extends ResponseKind>(db: Db, id: number, kind: K, use: string): AnalysisResponses[K] {
  const a = getAnalysis(db, id);
  if (!a) throw new UserError("unknown-analysis", `No analysis with id ${id}.`, { status: 404 });
  if (a.kind !== kind) {
    throw new UserError("wrong-source", `Analysis ${id} is ${ARTICLE[a.kind]}; ${use} needs ${ARTICLE[kind]}.`, { status: 400, issues: [{ path: "query.analysis", message: `expected ${ARTICLE[kind]}, got ${ARTICLE[a.kind]}` }] });
  }
  return BUILDERS[kind](a) as AnalysisResponses[K];
}
