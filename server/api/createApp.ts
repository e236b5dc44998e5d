import express from "express";
import type { Db } from "../../db/connection.ts";
import { databaseJobStore } from "../../db/jobs.ts";
import { JobRunner } from "../jobs/jobRunner.ts";
import { ServerLimits } from "../serverLimits.ts";
import type { DataSets } from "../services/datasets/dataSets.ts";
import { UploadReader } from "../services/uploadReader.ts";
import { apiReferencePage, apiReferencePolicy } from "./apiReferencePage.ts";
import { accessToken } from "./guards/accessToken.ts";
import { allowedHost } from "./guards/allowedHost.ts";
import { sameOrigin } from "./guards/sameOrigin.ts";
import { securityHeaders } from "./guards/securityHeaders.ts";
import { writeHeaders } from "./guards/writeHeaders.ts";
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
  /** Runs long analyses in worker threads; one is made (keeping each job's state in its data set's database) if not given. */
  jobs?: JobRunner;
  /** Folder with the built client (index.html, bundle); omitted in API-only tests. */
  clientDir?: string;
  /** Limits on uploads and analyses; the defaults of ServerLimits if not given. */
  limits?: ServerLimits;
  /** Host names besides the loopback ones that requests may be addressed to (the bound address, --allow-host). */
  allowedHosts?: string[];
  /** When set, every /api/ request must carry this token (serving beyond this machine). */
  token?: string | null;
  log?: (message: string) => void;
}

export type App = express.Express & { jobs: JobRunner; uploads: UploadReader; close(): Promise<void> };

/** The express application: JSON API under /api/, its reference at /api/docs, the client at /. */
export function createApp(options: AppOptions): App {
  const app = express();
  const datasets = options.datasets ?? null;
  const single = options.db;
  if (!datasets && !single) throw new Error("createApp needs a database or data sets");
  const currentDb = () => datasets?.db ?? single!;
  const limits = options.limits ?? ServerLimits.parse({});
  const jobs =
    options.jobs ??
    new JobRunner({ log: options.log, store: databaseJobStore(currentDb), maxConcurrent: limits.workers, maxQueued: limits.maxQueue, timeoutMs: limits.jobTimeoutMin * 60_000 });
  const uploads = new UploadReader(limits);
  app.disable("x-powered-by");
  app.use((req, _res, next) => {
    req.app.set("database path", currentDb().name);
    next();
  });
  app.use(securityHeaders);
  app.use(allowedHost(options.allowedHosts ?? []));
  app.use(sameOrigin);
  if (options.token) app.use("/api", accessToken(options.token));
  app.use("/api", writeHeaders);
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
    res.set("Content-Security-Policy", apiReferencePolicy(page)).type("html").send(page);
  });
  mountRoutes(app, ALL_ROUTES, { db: currentDb, datasets, jobs, limits, uploads });
  app.use("/api", notFoundHandler);
  // Source maps are never served: the bundle is built without them, and a stray one stays private.
  if (options.clientDir) {
    app.use((req, res, next) => (req.path.endsWith(".map") ? res.status(404).type("text").send("Not found") : next()));
    app.use(express.static(options.clientDir));
  }
  app.use(errorHandler(options.log));
  return Object.assign(app, {
    jobs,
    uploads,
    async close() {
      await Promise.all([jobs.close(), uploads.close()]);
    },
  });
}
