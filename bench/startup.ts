import { join } from "node:path";
import { morphogauge } from "./cli.ts";
import { medianRun, runProcess } from "./measure.ts";
import { timeRow, type BenchRow } from "./report.ts";

/** Start-up: `--help` and `list` on the demo database, against python importing numpy and scipy.optimize. */
export function benchStartup(dir: string, repeats: number): BenchRow[] {
  const db = join(dir, "demo.db");
  const demo = morphogauge("demo", "--db", db);
  runProcess(demo.command, demo.args);
  const reference = medianRun(repeats, () => runProcess("python3", ["-c", "import numpy, scipy.optimize"]));
  const ref = { label: "python3 -c 'import numpy, scipy.optimize'", value: reference.seconds, peakMiB: reference.peakMiB };
  const help = morphogauge("--help");
  const list = morphogauge("list", "--db", db);
  const h = medianRun(repeats, () => runProcess(help.command, help.args));
  const l = medianRun(repeats, () => runProcess(list.command, list.args));
  return [
    timeRow("startup", "morphogauge --help", "s", h.seconds, h.peakMiB, ref, "< 0.3 s", h.seconds < 0.3, `median of ${repeats}`),
    timeRow("startup", "morphogauge list (demo database)", "s", l.seconds, l.peakMiB, ref, "< 0.5 s", l.seconds < 0.5, `median of ${repeats}`),
  ];
}
