import { rmSync } from "node:fs";
import { join } from "node:path";
import { morphogauge, python } from "./cli.ts";
import { writeLongCsv } from "./longCsv.ts";
import { pairedRuns, runProcess } from "./measure.ts";
import { timeRow, type BenchRow } from "./report.ts";

/**
 * Import alone of a ~50 MB long CSV (just under the default size limit):
 * ours parses, validates and stores every profile; the reference only reads
 * the file with python's csv module into numpy arrays.
 */
export async function benchImport(dir: string, repeats: number): Promise<BenchRow> {
  const csv = join(dir, "long-50MB.csv");
  const embryos = 4150;
  const bytes = await writeLongCsv(csv, { embryos, points: 500, seed: 7 });
  const db = join(dir, "import.db");
  const ours = morphogauge("import", csv, "--db", db);
  const ref = python("readCsvNumpy.py", csv);
  const runs = pairedRuns(repeats, () => runProcess(ours.command, ours.args), () => runProcess(ref.command, ref.args), () => rmSync(db, { force: true }));
  rmSync(db, { force: true });
  rmSync(csv, { force: true });
  return timeRow(
    "import",
    `import ${(bytes / 1e6).toFixed(1)} MB long CSV (${embryos} embryos)`,
    "s",
    runs.ours.seconds,
    runs.ours.peakMiB,
    { label: "python csv → numpy", value: runs.reference.seconds, peakMiB: runs.reference.peakMiB },
    "faster than python",
    runs.ours.seconds < runs.reference.seconds,
    `median of ${repeats}; ours validates and stores`,
  );
}
