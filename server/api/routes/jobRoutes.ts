import { z } from "zod";
import { defineRoute } from "../route.ts";

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
    path: "/api/jobs/self-test",
    tag: "jobs",
    summary: "Start a short job that only counts, to check that background jobs work",
    body: z.object({ n: z.number().int().min(1).max(1000).default(5), delayMs: z.number().int().min(0).max(1000).default(20) }),
    status: 202,
    handler: ({ jobs, body }) => jobs.submit("self-test", body, (out) => out),
  }),
];
