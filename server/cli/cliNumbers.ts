import { UserError } from "../userError.ts";

/** Parse a numeric command-line value, naming the option in the error. */
export function numberOption(name: string, value: string | undefined): number | undefined {
  if (value === undefined) return undefined;
  const v = Number(value.trim().replace(/,/, "."));
  if (value.trim() === "" || !Number.isFinite(v)) throw new UserError("bad-option", `--${name}: "${value}" is not a number`);
  return v;
}

/** "a:b", "a:" or ":b" as a range, either end open. */
export function rangeOption(name: string, value: string | undefined): { min?: number; max?: number } | undefined {
  if (value === undefined) return undefined;
  const m = /^\s*([^:]*):([^:]*)\s*$/.exec(value);
  if (!m) throw new UserError("bad-option", `--${name}: "${value}" is not a range; write FROM:TO, FROM: or :TO (µm)`);
  const min = m[1].trim() === "" ? undefined : numberOption(name, m[1]);
  const max = m[2].trim() === "" ? undefined : numberOption(name, m[2]);
  if (min !== undefined && max !== undefined && !(max > min)) throw new UserError("bad-option", `--${name}: the end (${max}) must be greater than the start (${min})`);
  return { min, max };
}

/** "0.25±0.05" or "0.25+-0.05" or "0.25" as value and optional standard error. */
export function valueWithErrorOption(name: string, value: string | undefined): { value: number; se: number | null } | undefined {
  if (value === undefined) return undefined;
  const parts = value.split(/±|\+-|\+\/-/);
  const v = numberOption(name, parts[0]);
  const se = parts.length > 1 ? numberOption(name, parts[1]) : undefined;
  if (v === undefined || parts.length > 2) throw new UserError("bad-option", `--${name}: "${value}" should look like 0.25±0.05`);
  if (!(v > 0)) throw new UserError("bad-option", `--${name}: must be greater than 0`);
  if (se !== undefined && !(se >= 0)) throw new UserError("bad-option", `--${name}: the standard error must be ≥ 0`);
  return { value: v, se: se ?? null };
}
