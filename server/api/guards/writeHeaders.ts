import type { RequestHandler } from "express";
import { UserError } from "../../userError.ts";

/**
 * A write to the API must carry either a JSON body (application/json) or the
 * header X-Requested-With. A plain form or a no-cors fetch from another site
 * can send neither without the browser first asking this server, which never
 * agrees; the page sends the header with every upload and delete.
 */
export const writeHeaders: RequestHandler = (req, _res, next) => {
  if (req.method === "GET" || req.method === "HEAD" || req.method === "OPTIONS") return next();
  if (req.is("application/json") || req.headers["x-requested-with"] !== undefined) return next();
  next(
    new UserError(
      "missing-header",
      "Refused: a write to the API needs a JSON body (Content-Type: application/json) or the header X-Requested-With (any value), e.g. curl -H 'X-Requested-With: curl' …",
      { status: 403 },
    ),
  );
};
