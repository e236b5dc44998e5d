/** A background analysis as GET /api/jobs/:id returns it. */
export interface JobView<R = unknown> {
  id: string;
  kind: string;
  status: "queued" | "running" | "done" | "failed" | "cancelled";
  progress: { fraction: number; stage: string };
  createdAt: string;
  finishedAt: string | null;
  result: R | null;
  error: { code: string; message: string } | null;
}

export function isEnded(job: JobView): boolean {
  return job.status === "done" || job.status === "failed" || job.status === "cancelled";
}
