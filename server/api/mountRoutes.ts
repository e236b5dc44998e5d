import type { Express, NextFunction, Request, Response } from "express";
import type { Db } from "../../db/connection.ts";
import type { JobRunner } from "../jobs/jobRunner.ts";
import type { DataSets } from "../services/datasets/dataSets.ts";
import { requestValidationError } from "./httpError.ts";
import type { RouteDefinition } from "./route.ts";

/** Attach each route with zod validation of params, query and body before its handler runs. */
export function mountRoutes(app: Express, routes: RouteDefinition[], services: { db: () => Db; datasets: DataSets | null; jobs: JobRunner }): void {
  for (const route of routes) {
    app[route.method](route.path, async (req: Request, res: Response, next: NextFunction) => {
      try {
        const parse = (schema: RouteDefinition["query"], value: unknown, part: "query" | "body" | "params") => {
          if (!schema) return value;
          const r = schema.safeParse(value ?? {});
          if (!r.success) throw requestValidationError(r.error, part);
          return r.data;
        };
        const params = parse(route.params, req.params, "params");
        const query = parse(route.query, req.query, "query");
        const body = route.multipart ? undefined : parse(route.body, req.body, "body");
        const result = await route.handler({ query, body, params, db: services.db(), datasets: services.datasets, jobs: services.jobs, req, res });
        if (result === undefined || res.headersSent) return;
        if (route.status && res.statusCode === 200) res.status(route.status);
        res.json(result);
      } catch (e) {
        next(e);
      }
    });
  }
}
