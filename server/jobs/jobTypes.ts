/** Messages between the job runner and its worker threads. */

export interface JobProgress {
  /** 0 to 1. */
  fraction: number;
  /** What the job is doing now, e.g. "bootstrap 300/1000". */
  stage: string;
}

export type ProgressCallback = (fraction: number, stage: string) => void;

export type WorkerRequest = { kind: string; input: unknown };

export type WorkerMessage =
  | { type: "progress"; fraction: number; stage: string }
  | { type: "done"; output: unknown }
  | { type: "failed"; userError: { code: string; message: string; status: number; issues: { path: string; message: string }[] } | null; message: string };

export type JobStatus = "queued" | "running" | "done" | "failed" | "cancelled";

export interface JobView {
  id: string;
  kind: string;
  status: JobStatus;
  progress: JobProgress;
  createdAt: string;
  finishedAt: string | null;
  /** What the job produced once done (e.g. the stored analysis), as the API returns it. */
  result: unknown;
  error: { code: string; message: string } | null;
}
