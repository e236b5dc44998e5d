import { rmSync } from "node:fs";
import { join } from "node:path";
import { morphogauge, python } from "./cli.ts";
import { writeLongCsv } from "./longCsv.ts";
import { pairedRuns, runProcess, runSequence } from "./measure.ts";
import { timeRow, type BenchRow } from "./report.ts";

/**
 * End to end: `morphogauge import` then `morphogauge fit --model exponential`
 * (two whole processes, as typed) against a notebook-style python script that
 * reads the same file with the csv module and calls scipy's curve_fit per
 * embryo. Ours also stores every profile and every fit with its settings; the
 * script keeps only λ and its SE.
 */
export async function benchEndToEnd(dir: string, embryos: number, repeats: number): Promise<BenchRow> {
  const csv = join(dir, `long-${embryos}.csv`);
  const bytes = await writeLongCsv(csv, { embryos, points: 500, seed: 20261202 });
  const db = join(dir, `e2e-${embryos}.db`);
  const limits = ["--max-bytes", String(Math.max(bytes + 1, 52428800)), "--max-embryos", String(Math.max(embryos, 5000))];
  const baseline = python("notebookBaseline.py", csv, join(dir, "baseline-out.json"));
  const { ours, reference } = pairedRuns(
    repeats,
    () => runSequence([morphogauge("import", csv, "--db", db, ...limits), morphogauge("fit", "--db", db, "--model", "exponential")]),
    () => runProcess(baseline.command, baseline.args),
    () => rmSync(db, { force: true }),
  );
  const faster = reference.seconds / ours.seconds;
  const memoryOk = ours.peakMiB !== null && reference.peakMiB !== null && ours.peakMiB <= reference.peakMiB;
  const fitted = /(\d+) fits stored/.exec(ours.stdout)?.[1] ?? "?";
  rmSync(db, { force: true });
  rmSync(csv, { force: true });
  return timeRow(
    "end-to-end",
    `import + fit, ${embryos} embryos × 500 points (${(bytes / 1e6).toFixed(0)} MB)`,
    "s",
    ours.seconds,
    ours.peakMiB,
    { label: "python csv + curve_fit", value: reference.seconds, peakMiB: reference.peakMiB },
    "≥ 3× faster, peak ≤ python",
    faster >= 3 && memoryOk,
    `${fitted} fits stored; median of ${repeats}`,
  );
}
