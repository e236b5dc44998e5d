import { UserError } from "../userError.ts";
import { numberOption } from "./cliNumbers.ts";

/** "1,2.5,10" as a list of numbers, naming the option in the error. */
export function numberListOption(name: string, value: string | undefined): number[] | undefined {
  if (value === undefined) return undefined;
  return value
    .split(",")
    .filter((s) => s.trim() !== "")
    .map((s) => numberOption(name, s)!);
}

const DURATION_UNITS: Record<string, number> = { s: 1, sec: 1, min: 60, m: 60, h: 3600, hr: 3600, d: 86_400 };

/** "3h", "90min", "600s" or "600" (seconds) as seconds. */
export function durationOption(name: string, value: string | undefined): number | undefined {
  if (value === undefined) return undefined;
  const m = /^\s*([0-9.eE+-]+)\s*([a-z]*)\s*$/.exec(value);
  const unit = m ? (m[2] === "" ? 1 : DURATION_UNITS[m[2]]) : undefined;
  const v = m ? Number(m[1]) : NaN;
  if (!m || unit === undefined || !Number.isFinite(v)) throw new UserError("bad-option", `--${name}: "${value}" is not a duration; write e.g. 3h, 90min or 600s`);
  return v * unit;
}

/** Text output: "name  value ± se unit [lo, hi]" lines for the shared dynamics quantities. */
export function quantityLines(q: Record<string, unknown>, format: (e: { value: number; se: number | null; ci95: [number, number] | null } | null, unit: string) => string): string[] {
  const rows: [string, string, string][] = [
    ["D_um2_per_s", "D", "µm²/s"],
    ["k_per_s", "k", "1/s"],
    ["lambda_um", "λ", "µm"],
    ["half_life_s", "half-life", "s"],
    ["mobile_fraction", "mobile fraction", ""],
    ["half_time_s", "FRAP half-time", "s"],
  ];
  const out: string[] = [];
  for (const [key, label, unit] of rows) {
    const e = q[key] as { value: number; se: number | null; ci95: [number, number] | null } | null;
    if (e) out.push(`  ${label.padEnd(16)} ${format(e, unit)}`);
  }
  const tau = q.accumulation_time_s as { x_um: number; value: number; se: number | null; ci95: [number, number] | null }[];
  for (const t of tau ?? []) out.push(`  ${`τ(${Number(t.x_um.toPrecision(4))} µm)`.padEnd(16)} ${format(t, "s")}`);
  return out;
}
