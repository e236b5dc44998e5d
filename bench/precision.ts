import { join } from "node:path";
import { openDatabaseSync } from "../db/connection.ts";
import { PrecisionRequest } from "../server/services/precision/precisionRequest.ts";
import { preparePrecisionInput } from "../server/services/precision/precisionService.ts";
import { runPrecisionTask } from "../server/services/precision/precisionTask.ts";
import { morphogauge } from "./cli.ts";
import { writeLongCsv } from "./longCsv.ts";
import { medianRun, runProcess } from "./measure.ts";
import { timeRow, type BenchRow } from "./report.ts";

/**
 * Precision for 200 embryos with 1,000 bootstrap resamples: the computation
 * alone (in this process, after one warm-up run), its cost per resample (the
 * difference to a run without resamples), and the whole `morphogauge
 * precision` command. No outside program computes the same analysis, so the
 * reference is the target.
 */
export async function benchPrecision(dir: string, repeats: number): Promise<BenchRow[]> {
  const csv = join(dir, "precision-200.csv");
  await writeLongCsv(csv, { embryos: 200, points: 500, seed: 3, genotypes: ["wt"] });
  const dbPath = join(dir, "precision.db");
  const imp = morphogauge("import", csv, "--db", dbPath);
  runProcess(imp.command, imp.args);
  const db = openDatabaseSync(dbPath);
  const time = (bootstrap: number) => {
    const input = preparePrecisionInput(db, PrecisionRequest.parse({ selection: { genotype: "wt" }, bootstrap }));
    const t0 = performance.now();
    runPrecisionTask(input);
    return (performance.now() - t0) / 1000;
  };
  time(1000);
  const sorted = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor((xs.length - 1) / 2)];
  const withResamples = sorted(Array.from({ length: repeats }, () => time(1000)));
  const without = sorted(Array.from({ length: repeats }, () => time(0)));
  db.close();
  const command = morphogauge("precision", "--db", dbPath, "--genotype", "wt", "--bootstrap", "1000", "--json");
  const cli = medianRun(repeats, () => runProcess(command.command, command.args));
  const target = { label: "target 1 s", value: 1, peakMiB: null };
  return [
    timeRow("precision", "precision 200 embryos × 1,000 resamples", "s", withResamples, null, target, "< 1 s", withResamples < 1, `computation only, median of ${repeats}`),
    timeRow("precision", "  per bootstrap resample", "µs", (1e6 * (withResamples - without)) / 1000, null, null, "", null, `${(without * 1000).toFixed(0)} ms without resamples`),
    timeRow("precision", "  whole `morphogauge precision` command", "s", cli.seconds, cli.peakMiB, target, "< 1 s", cli.seconds < 1, "reads, computes, stores"),
  ];
}
