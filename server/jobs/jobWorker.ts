import { parentPort } from "node:worker_threads";
import { COMPUTE_TASKS } from "../services/computeTasks.ts";
import { isUserError } from "../userError.ts";
import type { WorkerMessage, WorkerRequest } from "./jobTypes.ts";

/** Runs one compute task per message and posts progress and the outcome back. */
parentPort!.on("message", async (request: WorkerRequest) => {
  const post = (m: WorkerMessage) => parentPort!.postMessage(m);
  const task = COMPUTE_TASKS[request.kind];
  if (!task) {
    post({ type: "failed", userError: null, message: `no compute task named "${request.kind}"` });
    return;
  }
  try {
    let last = 0;
    const output = await task(request.input, (fraction, stage) => {
      // At most ~20 progress messages a second: enough for a progress bar, cheap for the thread.
      const now = Date.now();
      if (now - last < 50 && fraction < 1) return;
      last = now;
      post({ type: "progress", fraction, stage });
    });
    post({ type: "done", output });
  } catch (e) {
    if (isUserError(e)) post({ type: "failed", userError: { code: e.code, message: e.message, status: e.status, issues: e.issues }, message: e.message });
    else post({ type: "failed", userError: null, message: e instanceof Error ? (e.stack ?? e.message) : String(e) });
  }
});
