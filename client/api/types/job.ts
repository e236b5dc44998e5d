/** A background analysis as GET /api/jobs/:id returns it. */
export interface JobView<R = unknown> {
  id: string;
  kind: string;
  status: "queued" | "running" | "done" | "failed" | "cancelled" | "interrupted";
  /** etaS: estimated seconds left, once there is a pace to go by. */
  progress: { fraction: number; stage: string; etaS?: number };
  createdAt: string;
  finishedAt: string | null;
  result: R | null;
  error: { code: string; message: string } | null;
}

export function isEnded(job: JobView): boolean {
  return job.status !== "queued" && job.status !== "running";
}
