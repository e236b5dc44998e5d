/** One line of the benchmark table: our figure beside a reference measured in the same run. */
export interface BenchRow {
  bench: string;
  what: string;
  unit: "s" | "ms" | "µs" | "req/s" | "count";
  ours: number;
  oursPeakMiB: number | null;
  /** What ours is compared with, measured in the same run (or a fixed target when no program is). */
  reference: { label: string; value: number; peakMiB: number | null } | null;
  /** How many times faster ours is than the reference (reference / ours for times, ours / reference for rates). */
  ratio: number | null;
  target: string;
  met: boolean | null;
  notes?: string;
}

export function timeRow(bench: string, what: string, unit: BenchRow["unit"], ours: number, oursPeakMiB: number | null, reference: BenchRow["reference"], target: string, met: boolean | null, notes?: string): BenchRow {
  const ratio = reference && ours > 0 ? (unit === "req/s" ? ours / reference.value : reference.value / ours) : null;
  return { bench, what, unit, ours, oursPeakMiB, reference, ratio, target, met, notes };
}

const fmt = (v: number, unit: string) => (unit === "s" ? `${v.toFixed(2)} s` : unit === "ms" ? `${v.toFixed(1)} ms` : unit === "µs" ? `${v.toFixed(1)} µs` : unit === "count" ? `${v}` : `${v.toFixed(0)} ${unit}`);
const mib = (v: number | null) => (v === null ? "—" : `${v.toFixed(0)} MiB`);

/** Print rows as they come, in a fixed-width table. */
export function printRow(r: BenchRow): void {
  const ref = r.reference ? `${fmt(r.reference.value, r.unit)} ${mib(r.reference.peakMiB)} (${r.reference.label})` : "—";
  const ratio = r.ratio === null ? "" : `${r.ratio.toFixed(2)}×`;
  const met = r.met === null ? "" : r.met ? "met" : "NOT met";
  console.log(`  ${r.what.padEnd(44)} ${fmt(r.ours, r.unit).padStart(11)} ${mib(r.oursPeakMiB).padStart(8)} | ${ref.padEnd(52)} ${ratio.padStart(7)}  ${r.target} ${met}${r.notes ? `  [${r.notes}]` : ""}`);
}

export function printHeader(title: string): void {
  console.log(`\n${title}`);
  console.log(`  ${"".padEnd(44)} ${"ours".padStart(11)} ${"peak".padStart(8)} | ${"reference (time, peak)".padEnd(52)} ${"faster".padStart(7)}  target`);
}
