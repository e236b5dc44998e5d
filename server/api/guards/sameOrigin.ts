import type { RequestHandler } from "express";
import { UserError } from "../../userError.ts";

/**
 * Refuse requests a page of another site makes in the user's browser: an
 * Origin header that is not this server's own, or a Sec-Fetch-Site other than
 * same-origin (or none: typed into the address bar). API requests are always
 * checked; elsewhere only writes, so a link from another site still opens the page.
 */
export const sameOrigin: RequestHandler = (req, _res, next) => {
  const api = req.path.startsWith("/api/") || req.path === "/api";
  const write = req.method !== "GET" && req.method !== "HEAD";
  if (!api && !write) return next();
  const site = req.headers["sec-fetch-site"];
  if (typeof site === "string" && site !== "same-origin" && site !== "none") return next(refused(`the request came from another site (${site})`));
  const origin = req.headers.origin;
  if (typeof origin === "string") {
    let host: string | null = null;
    try {
      host = origin === "null" ? null : new URL(origin).host.toLowerCase();
    } catch {
      host = null;
    }
    if (host === null || host !== String(req.headers.host ?? "").toLowerCase()) return next(refused(`the request came from ${origin.slice(0, 100)}`));
  }
  next();
};

function refused(why: string): UserError {
  return new UserError("cross-site", `Refused: ${why}. Only the morphogauge page served from this address may use the API.`, { status: 403 });
}
