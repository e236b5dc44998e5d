import type { ErrorRequestHandler, RequestHandler } from "express";
import { z } from "zod";
import { BusyError } from "../jobs/busyError.ts";
import { isUserError, UserError } from "../userError.ts";
import { databaseUserError } from "../../db/databaseError.ts";

/** The API's error body: `{ error: { code, message, issues[] } }`. */
export interface ErrorBody {
  error: { code: string; message: string; issues: { path: string; message: string }[] };
}

/** Turn a zod failure on a request part into a 400 naming each bad field. */
export function requestValidationError(error: z.ZodError, part: "query" | "body" | "params"): UserError {
  const issues = error.issues.map((i) => ({ path: [part, ...i.path].join("."), message: i.message }));
  return new UserError("invalid-request", `Invalid ${part}: ${issues.map((i) => `${i.path}: ${i.message}`).join("; ")}`, { status: 400, issues });
}

export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new UserError("not-found", `No such API route: ${req.method} ${req.path}`, { status: 404 }));
};

/**
 * The one final handler: known user errors become their 4xx with a readable
 * message; anything else is logged and answered with a plain 500, never a stack trace.
 */
export function errorHandler(log: (message: string) => void = (m) => process.stderr.write(m + "\n")): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) {
      req.socket.destroy();
      return;
    }
    const environment = isUserError(err) ? null : databaseUserError(err, (req.app.get("database path") as string | undefined) ?? "in use");
    if (environment) {
      log(`database error: ${(err as Error).message}`);
      err = environment;
    }
    if (err instanceof BusyError) res.set("Retry-After", String(err.retryAfterS));
    if (isUserError(err)) {
      const body: ErrorBody = { error: { code: err.code, message: err.message, issues: err.issues } };
      res.status(err.status).json(body);
      return;
    }
    if (err && typeof err === "object" && "type" in err && (err as { type: string }).type === "entity.parse.failed") {
      res.status(400).json({ error: { code: "invalid-json", message: "The request body is not valid JSON.", issues: [] } } satisfies ErrorBody);
      return;
    }
    if (err && typeof err === "object" && "type" in err && (err as { type: string }).type === "entity.too.large") {
      res.status(413).json({ error: { code: "too-large", message: "The request body is too large.", issues: [] } } satisfies ErrorBody);
      return;
    }
    log(`internal error: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
    res.status(500).json({ error: { code: "internal", message: "Internal error. It has been logged; please report it.", issues: [] } } satisfies ErrorBody);
  };
}
