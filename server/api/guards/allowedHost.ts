import type { RequestHandler } from "express";
import { UserError } from "../../userError.ts";
import { hostName, isLoopbackName } from "./requestHost.ts";

/**
 * Answer only requests addressed to this server by a name it was given: a
 * loopback name, the bound address, or a name allowed with --allow-host.
 * A page on another site that re-points its own domain at this machine (DNS
 * rebinding) sends its own name as Host and is refused here.
 */
export function allowedHost(allowed: readonly string[]): RequestHandler {
  const names = new Set(allowed.map((h) => hostName(h.includes(":") && !h.startsWith("[") && h.split(":").length > 2 ? `[${h}]` : h)));
  return (req, _res, next) => {
    const raw = req.headers.host ?? "";
    const name = hostName(raw);
    if (name !== "" && (isLoopbackName(name) || names.has(name))) return next();
    next(
      new UserError(
        "host-not-allowed",
        `This server does not answer to the host name "${raw.slice(0, 80)}". Open it by the address it was started on, or start it with --allow-host NAME to accept this name.`,
        { status: 421 },
      ),
    );
  };
}
