import { createHash } from "node:crypto";

/** JSON with object keys sorted, so equal settings give equal text whatever their key order. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(value, (_k, v) =>
    v && typeof v === "object" && !Array.isArray(v) ? Object.fromEntries(Object.keys(v).sort().map((k) => [k, (v as Record<string, unknown>)[k]])) : v,
  );
}

/** Short SHA-256 of the canonical JSON: the identity of a set of options. */
export function stableHash(value: unknown): string {
  return createHash("sha256").update(canonicalJson(value)).digest("hex").slice(0, 16);
}
