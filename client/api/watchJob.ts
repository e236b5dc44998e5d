import { ApiError } from "./apiError.ts";
import { apiDelete, apiGet } from "./http.ts";
import { isEnded, type JobView } from "./types/job.ts";

/** How often to ask when the event stream is not available. */
const POLL_MS = 400;

export interface JobWatch<R> {
  /** Resolves with the job's result when done; rejects with an ApiError when it fails or is cancelled. */
  result: Promise<R>;
  /** Ask the server to stop the job. */
  cancel(): Promise<void>;
}

/**
 * Follow a background job: server-sent events while the stream works, polling
 * when it does not, calling `onUpdate` with each new state until it ends.
 */
export function watchJob<R>(start: JobView, onUpdate: (job: JobView) => void): JobWatch<R> {
  let ended = false;
  let source: EventSource | null = null;
  let resolve!: (r: R) => void;
  let reject!: (e: unknown) => void;
  const result = new Promise<R>((res, rej) => {
    resolve = res;
    reject = rej;
  });

  const settle = (job: JobView) => {
    if (ended) return;
    onUpdate(job);
    if (!isEnded(job)) return;
    ended = true;
    source?.close();
    if (job.status === "done") resolve(job.result as R);
    else if (job.status === "cancelled") reject(new ApiError("cancelled", "The analysis was cancelled; nothing was stored.", 0));
    else reject(new ApiError(job.error?.code ?? "failed", job.error?.message ?? "The analysis failed.", 0));
  };

  const poll = async () => {
    while (!ended) {
      try {
        settle(await apiGet<JobView>(`api/jobs/${start.id}`));
      } catch (e) {
        ended = true;
        reject(e);
        return;
      }
      if (!ended) await new Promise((r) => setTimeout(r, POLL_MS));
    }
  };

  settle(start);
  if (!ended) {
    if (typeof EventSource === "undefined") void poll();
    else {
      source = new EventSource(`api/jobs/${start.id}/events`);
      source.onmessage = (event) => settle(JSON.parse(event.data as string) as JobView);
      source.onerror = () => {
        // The stream closes after the last state or broke off: either way, ask directly from here on.
        source?.close();
        if (!ended) void poll();
      };
    }
  }

  return {
    result,
    async cancel() {
      settle(await apiDelete<JobView>(`api/jobs/${start.id}`));
    },
  };
}
