import type { ProgressCallback } from "./jobTypes.ts";

/**
 * A pure computation that may run in a worker thread: structured-cloneable
 * input in, output back, progress reported along the way. No database here.
 */
export type ComputeTask<I = unknown, O = unknown> = (input: I, progress: ProgressCallback) => O | Promise<O>;
