import express from "express";
import type { Db } from "../../db/connection.ts";
import { JobRunner } from "../jobs/jobRunner.ts";
import type { DataSets } from "../services/datasets/dataSets.ts";
import { apiReferencePage } from "./apiReferencePage.ts";
import { errorHandler, notFoundHandler } from "./httpError.ts";
import { mountRoutes } from "./mountRoutes.ts";
import { openApiDocument } from "./openApiDocument.ts";
import { ALL_ROUTES } from "./routes/allRoutes.ts";
import { TOOL_VERSION } from "../version.ts";

export const API_VERSION = TOOL_VERSION;

export interface AppOptions {
  /** The database, when the server has only one (tests); otherwise `datasets`. */
  db?: Db;
  /** The demo and the lab's data sets, switchable from the page; requests go to the open one. */
  datasets?: DataSets;
  /** Runs long analyses in worker threads; one is made if not given. */
  jobs?: JobRunner;
  /** Folder with the built client (index.html, bundle); omitted in API-only tests. */
  clientDir?: string;
  log?: (message: string) => void;
}

/** The express application: JSON API under /api/, its reference at /api/docs, the client at /. */
export function createApp(options: AppOptions): express.Express & { jobs: JobRunner } {
  const app = express();
  const jobs = options.jobs ?? new JobRunner({ log: options.log });
  app.disable("x-powered-by");
  app.use("/api", express.json({ limit: "2mb" }));
  app.get("/api/health", (_req, res) => {
    res.json({ ok: true, version: API_VERSION });
  });
  const doc = openApiDocument(ALL_ROUTES, API_VERSION);
  app.get("/api/openapi.json", (_req, res) => {
    res.json(doc);
  });
  const page = apiReferencePage(doc);
  app.get("/api/docs", (_req, res) => {
    res.type("html").send(page);
  });
  const datasets = options.datasets ?? null;
  const single = options.db;
  if (!datasets && !single) throw new Error("createApp needs a database or data sets");
  mountRoutes(app, ALL_ROUTES, { db: () => datasets?.db ?? single!, datasets, jobs });
  app.use("/api", notFoundHandler);
  if (options.clientDir) app.use(express.static(options.clientDir));
  app.use(errorHandler(options.log));
  return Object.assign(app, { jobs });
}
