/** Messages between the job runner and its worker threads. */

export interface JobProgress {
  /** 0 to 1. */
  fraction: number;
  /** What the job is doing now, e.g. "bootstrap 300/1000". */
  stage: string;
  /** Estimated seconds left, from the pace so far; absent until there is a pace to go by. */
  etaS?: number;
}

export type ProgressCallback = (fraction: number, stage: string) => void;

export type WorkerRequest = { kind: string; input: unknown };

export type WorkerMessage =
  | { type: "progress"; fraction: number; stage: string }
  | { type: "done"; output: unknown }
  | { type: "failed"; userError: { code: string; message: string; status: number; issues: { path: string; message: string }[] } | null; message: string };

/** "interrupted": the server stopped while the job was queued or running; it can be re-run. */
export type JobStatus = "queued" | "running" | "done" | "failed" | "cancelled" | "interrupted";

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

/** What a job was started from: the API request (for a re-run) and the profiles it read. */
export interface JobOrigin {
  request?: { path: string; body: unknown };
  inputs?: { profileId: number; hash: string }[];
}

/** A job as kept in the database, so that its state outlives the process. */
export interface StoredJob extends JobView {
  request: { path: string; body: unknown } | null;
  inputs: { profileId: number; hash: string }[];
}

/** Where the job runner keeps job state (the database in the server; nothing in bare tests). */
export interface JobStore {
  insert(job: JobView, origin: JobOrigin): void;
  update(job: JobView): void;
  get(id: string): StoredJob | null;
  list(limit: number): JobView[];
  /** Mark every queued or running job as interrupted with this message; returns how many. */
  interruptUnfinished(message: string): number;
}
