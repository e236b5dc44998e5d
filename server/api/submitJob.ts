import type { JobView } from "../jobs/jobTypes.ts";
import { bindToInputs } from "../services/bindToInputs.ts";
import { checkComputeBudget, type WorkEstimate } from "../services/computeBudget.ts";
import type { RouteContext } from "./route.ts";

/**
 * Queue an analysis started by an API request: refuse it up front when it is
 * over the compute budget, bind its result to the profiles it reads (stored
 * only if they are unchanged when it ends), and record the request so that the
 * job can be re-run after a restart.
 */
export function submitJob<O>(
  ctx: Pick<RouteContext<unknown, unknown, unknown>, "db" | "jobs" | "req" | "limits">,
  kind: string,
  input: unknown,
  job: { profileIds: readonly number[]; work?: WorkEstimate; store: (output: O) => unknown },
): JobView {
  if (job.work) checkComputeBudget(job.work, ctx.limits);
  const bound = bindToInputs(ctx.db, job.profileIds, job.store);
  return ctx.jobs.submit(kind, input, (output) => bound.finish(output as O), {
    request: { path: ctx.req.path, body: ctx.req.body },
    inputs: bound.inputs,
  });
}
