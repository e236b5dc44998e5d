import { z } from "zod";
import { storedJobRequest } from "../../../db/jobs.ts";
import { UserError } from "../../userError.ts";
import { defineRoute, type RouteDefinition } from "../route.ts";

const JobParams = z.object({ id: z.string().uuid() });

export const jobRoutes = [
  defineRoute({
    method: "get",
    path: "/api/jobs",
    tag: "jobs",
    summary: "Recent and running analysis jobs",
    handler: ({ jobs }) => ({ jobs: jobs.list() }),
  }),
  defineRoute({
    method: "get",
    path: "/api/jobs/:id",
    tag: "jobs",
    summary: "A job's status, progress (fraction and stage) and, once done, its result",
    params: JobParams,
    handler: ({ jobs, params }) => jobs.get(params.id),
  }),
  defineRoute({
    method: "get",
    path: "/api/jobs/:id/events",
    tag: "jobs",
    summary: "Server-sent events with the job's progress until it ends",
    params: JobParams,
    produces: "text/event-stream",
    handler({ jobs, params, res, req }) {
      const first = jobs.get(params.id);
      res.writeHead(200, { "content-type": "text/event-stream", "cache-control": "no-cache", connection: "keep-alive" });
      const send = (v: unknown) => res.write(`data: ${JSON.stringify(v)}\n\n`);
      send(first);
      if (first.status !== "queued" && first.status !== "running") {
        res.end();
        return undefined;
      }
      const off = jobs.subscribe(params.id, (v) => {
        send(v);
        if (v.status !== "queued" && v.status !== "running") {
          off();
          res.end();
        }
      });
      req.on("close", off);
      return undefined;
    },
  }),
  defineRoute({
    method: "delete",
    path: "/api/jobs/:id",
    tag: "jobs",
    summary: "Cancel a queued or running job",
    params: JobParams,
    handler: ({ jobs, params }) => jobs.cancel(params.id),
  }),
  defineRoute({
    method: "post",
    path: "/api/jobs/:id/rerun",
    tag: "jobs",
    summary: "Start a job again from the request that started it (e.g. one interrupted by a restart), on the data as stored now",
    params: JobParams,
    status: 202,
    async handler(ctx) {
      const stored = storedJobRequest(ctx.db, ctx.params.id);
      if (!stored) throw new UserError("unknown-job", `No job with id ${ctx.params.id} in the open data set.`, { status: 404 });
      const request = stored.request;
      if (!request) throw new UserError("cannot-rerun", `Job ${ctx.params.id} (${stored.kind}) kept no request to start it from; start the analysis again from its page.`, { status: 409 });
      // Imported here, not at the top: the list of all routes includes this one.
      const { ALL_ROUTES } = await import("./allRoutes.ts");
      const route = ALL_ROUTES.find((r: RouteDefinition) => r.method === "post" && r.path === request.path);
      if (!route || !route.body) throw new UserError("cannot-rerun", `Job ${ctx.params.id} was started by ${request.path}, which cannot be re-run.`, { status: 409 });
      const parsed = route.body.safeParse(request.body ?? {});
      if (!parsed.success) throw new UserError("cannot-rerun", `The request of job ${ctx.params.id} is no longer valid: ${parsed.error.issues[0]?.message}. Start the analysis again from its page.`, { status: 409 });
      const fakeReq = Object.create(ctx.req, { path: { value: request.path }, body: { value: request.body } });
      return route.handler({ ...ctx, req: fakeReq, body: parsed.data, params: {}, query: {} });
    },
  }),
  defineRoute({
    method: "post",
    path: "/api/jobs/self-test",
    tag: "jobs",
    summary: "Start a short job that only counts, to check that background jobs work",
    body: z.object({ n: z.number().int().min(1).max(1000).default(5), delayMs: z.number().int().min(0).max(1000).default(20) }),
    status: 202,
    handler: ({ jobs, body, req }) => jobs.submit("self-test", body, (out) => out, { request: { path: req.path, body: req.body } }),
  }),
];
