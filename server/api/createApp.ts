import express from "express";
import type { Db } from "../../db/connection.ts";
import { errorHandler, notFoundHandler } from "./httpError.ts";

export interface AppOptions {
  db: Db;
  /** Folder with the built client (index.html, bundle); omitted in API-only tests. */
  clientDir?: string;
  log?: (message: string) => void;
}

/** The express application: JSON API under /api/, the client at /. */
export function createApp(options: AppOptions): express.Express {
  const app = express();
  app.disable("x-powered-by");
  app.use(express.json({ limit: "2mb" }));
  app.get("/api/health", (_req, res) => {
    res.json({ ok: true });
  });
  app.use("/api", notFoundHandler);
  if (options.clientDir) app.use(express.static(options.clientDir));
  app.use(errorHandler(options.log));
  return app;
}
