import type { ComputeTask } from "../jobs/computeTask.ts";
import { runFitTask, type FitTaskInput } from "./fits/fitTask.ts";
import { runPrecisionTask, type PrecisionTaskInput } from "./precision/precisionTask.ts";
import { runCompareTask, type CompareTaskInput } from "./groups/compareTask.ts";
import { runPlanTask, runTrackTask, type TrackTaskInput } from "./groups/trackTask.ts";
import type { PlanOptionsInput } from "../analysis/compare/planning/planOptions.ts";
import { runTimeCourseTask, type TimeCourseTaskInput } from "./dynamics/timeCourseService.ts";
import { runFrapTask, type FrapTaskInput } from "./dynamics/frapService.ts";

/**
 * Every computation a job may run in a worker thread, by name. Each is pure:
 * its input was read from the database on the main thread, and its output is
 * stored there again.
 */
export const COMPUTE_TASKS: Record<string, ComputeTask> = {
  fit: (input, progress) => runFitTask(input as FitTaskInput, progress),
  precision: (input, progress) => runPrecisionTask(input as PrecisionTaskInput, progress),
  compare: (input, progress) => runCompareTask(input as CompareTaskInput, progress),
  track: (input, progress) => runTrackTask(input as TrackTaskInput, progress),
  plan: (input, progress) => runPlanTask(input as PlanOptionsInput, progress),
  dynamics: (input) => runTimeCourseTask(input as TimeCourseTaskInput),
  frap: (input) => runFrapTask(input as FrapTaskInput),
  /** A small self-check used by the job runner's tests: counts to n, reporting progress. */
  "self-test": async (input, progress) => {
    const { n, delayMs, fail } = input as { n: number; delayMs: number; fail?: "user" | "internal" };
    for (let i = 1; i <= n; i++) {
      await new Promise((r) => setTimeout(r, delayMs));
      progress(i / n, `step ${i}/${n}`);
    }
    if (fail === "internal") throw new Error("deliberate failure");
    if (fail === "user") {
      const { UserError } = await import("../userError.ts");
      throw new UserError("too-few-embryos", "Only 2 embryos; at least 3 are needed.", { status: 422 });
    }
    return { counted: n };
  },
};
