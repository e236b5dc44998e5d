import { createHash, randomBytes, timingSafeEqual } from "node:crypto";
import type { RequestHandler } from "express";
import { UserError } from "../../userError.ts";

/** Cookie the page may also carry the token in, for links and event streams that cannot set a header (GET only). */
export const TOKEN_COOKIE = "morphogauge_token";

/** A new random access token: 32 bytes, URL-safe. */
export function generateToken(): string {
  return randomBytes(32).toString("base64url");
}

const digest = (s: string) => createHash("sha256").update(s).digest();

/** Compare in time independent of where the two differ (hash first, so lengths never leak either). */
export function tokensEqual(given: string, expected: string): boolean {
  return timingSafeEqual(digest(given), digest(expected));
}

function cookieToken(header: string | undefined): string | null {
  for (const part of (header ?? "").split(";")) {
    const [k, ...v] = part.trim().split("=");
    if (k === TOKEN_COOKIE) return decodeURIComponent(v.join("="));
  }
  return null;
}

/**
 * Every /api/ request must carry the access token as `Authorization: Bearer
 * TOKEN`; reads (GET) may carry it in the page's cookie instead, so that
 * download links and progress streams work. Anything else is 401.
 */
export function accessToken(token: string): RequestHandler {
  return (req, res, next) => {
    const auth = req.headers.authorization;
    const bearer = typeof auth === "string" && /^Bearer\s+/i.test(auth) ? auth.replace(/^Bearer\s+/i, "").trim() : null;
    const given = bearer ?? (req.method === "GET" || req.method === "HEAD" ? cookieToken(req.headers.cookie) : null);
    if (given !== null && tokensEqual(given, token)) return next();
    res.set("WWW-Authenticate", 'Bearer realm="morphogauge"');
    next(
      new UserError(
        given === null ? "token-required" : "token-wrong",
        given === null
          ? "This server needs its access token: send it as the header Authorization: Bearer TOKEN (the page asks for it once). The person who started the server has it."
          : "The access token is not the one this server was started with.",
        { status: 401 },
      ),
    );
  };
}
