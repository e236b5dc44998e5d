import { raiseHint, type ServerLimits } from "../serverLimits.ts";
import { UserError } from "../userError.ts";

const fmt = (n: number) => (n >= 1e6 ? n.toExponential(1).replace("e+", "e") : Math.round(n).toLocaleString("en-US"));

/** What one analysis asks for, before it is queued. */
export interface WorkEstimate {
  /** Resamples or permutations × embryos (× grid points), the work a job's loops do. */
  units: number;
  /** How the units were counted, for the refusal message. */
  description: string;
  /** Grid points of a precision analysis, checked against their own limit. */
  gridPoints?: number;
}

/**
 * Refuse an analysis up front when it asks for more work than one job may do,
 * naming the limit and how to stay under it or raise it, instead of letting it
 * sit in the queue for hours or exhaust memory.
 */
export function checkComputeBudget(estimate: WorkEstimate, limits: ServerLimits): void {
  if (estimate.gridPoints !== undefined && !(estimate.gridPoints <= limits.maxGridPoints)) {
    throw new UserError(
      "grid-too-fine",
      `The grid would have ${fmt(estimate.gridPoints)} points; at most ${fmt(limits.maxGridPoints)} are allowed per analysis. Choose a larger spacing or a shorter range (${raiseHint("maxGridPoints")}).`,
      { status: 422, issues: [{ path: "body.spacing", message: `${fmt(estimate.gridPoints)} grid points > ${fmt(limits.maxGridPoints)}` }] },
    );
  }
  if (!(estimate.units <= limits.computeBudget)) {
    throw new UserError(
      "over-compute-budget",
      `This analysis asks for ${fmt(estimate.units)} work units (${estimate.description}); one analysis may use at most ${fmt(limits.computeBudget)}. Ask for fewer resamples or permutations, or fewer embryos (${raiseHint("computeBudget")}).`,
      { status: 422 },
    );
  }
}

/** Grid points of a precision grid: span / spacing + 1 (Infinity when the spacing makes no grid). */
export function gridPointCount(span: number, spacing: number | undefined, nativePoints: number): number {
  if (spacing === undefined) return nativePoints;
  const n = Math.abs(span) / spacing + 1;
  return Number.isFinite(n) ? Math.ceil(n) : Infinity;
}
