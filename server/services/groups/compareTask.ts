import { compareGroups, type CompareResult } from "../../analysis/compare/compareGroups.ts";
import type { CompareOptionsInput } from "../../analysis/compare/compareOptions.ts";
import type { EmbryoRecord } from "../../analysis/compare/embryoRecord.ts";
import type { ProgressCallback } from "../../jobs/jobTypes.ts";
import { UserError } from "../../userError.ts";

export interface CompareTaskInput {
  records: EmbryoRecord[];
  options: Omit<CompareOptionsInput, "progress">;
}

/** Group summaries and contrasts. Pure: runs in a worker thread or in-process. */
export function runCompareTask(input: CompareTaskInput, progress: ProgressCallback = () => {}): CompareResult {
  try {
    return compareGroups(input.records, { ...input.options, progress });
  } catch (e) {
    // The comparison reports unusable choices (an unknown reference group, …) as RangeError: the user's to fix.
    if (e instanceof RangeError) throw new UserError("compare-input", e.message, { status: 422 });
    throw e;
  }
}
