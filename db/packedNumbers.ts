import { fromBlob, toBlob } from "./floatBlob.ts";

/**
 * Stored JSON results carry long arrays of numbers (a fit's positions, fitted
 * curve and residuals: three × n per fit). Written as decimal text they cost
 * more to format and parse than the fit costs to compute; written as
 * `{"$f64": "<base64 of little-endian Float64>"}` they are exact and copied in
 * one block. Only arrays of at least PACK_MIN_LENGTH finite numbers are packed
 * (JSON would turn NaN into null; such arrays stay as they were), so short
 * arrays and everything else remain readable JSON. `unpackNumbers` turns the
 * packed form back into plain number arrays, and leaves plain JSON (results
 * stored before packing) as it is.
 */
export const PACK_MIN_LENGTH = 32;
const MARK = "$f64";

export function packNumbers(value: unknown): unknown {
  if (Array.isArray(value)) {
    if (value.length >= PACK_MIN_LENGTH && value.every((v) => typeof v === "number" && Number.isFinite(v))) return { [MARK]: toBlob(value as number[]).toString("base64") };
    return value.some((v) => typeof v === "object" && v !== null) ? value.map(packNumbers) : value;
  }
  if (isPlainObject(value)) {
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(value)) out[key] = packNumbers(value[key]);
    return out;
  }
  return value;
}

export function unpackNumbers(value: unknown): unknown {
  if (Array.isArray(value)) return value.some((v) => typeof v === "object" && v !== null) ? value.map(unpackNumbers) : value;
  if (isPlainObject(value)) {
    const keys = Object.keys(value);
    if (keys.length === 1 && keys[0] === MARK && typeof value[MARK] === "string") return Array.from(fromBlob(Buffer.from(value[MARK], "base64")));
    const out: Record<string, unknown> = {};
    for (const key of keys) out[key] = unpackNumbers(value[key]);
    return out;
  }
  return value;
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  if (typeof v !== "object" || v === null) return false;
  const proto = Object.getPrototypeOf(v);
  return proto === Object.prototype || proto === null;
}
