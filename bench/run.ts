import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { cpus, loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import { benchEndToEnd } from "./endToEnd.ts";
import { runFitBench } from "./fitKernel.ts";
import { benchImport } from "./importOnly.ts";
import { benchPrecision } from "./precision.ts";
import { printHeader, printRow, timeRow, type BenchRow } from "./report.ts";
import { benchServer } from "./serverLoad.ts";
import { benchStartup } from "./startup.ts";

// Benchmarks of what a user runs, each beside a reference measured in the same run.
// Not tests: they use the clock. `npm run bench` (full) or `npm run bench -- --quick`
// (one run each, no 10,000-embryo case, short load test). Commands are timed as
// installed: run `npm run build` first after changing the sources.
const quick = process.argv.includes("--quick");
const only = process.argv.find((a) => a.startsWith("--only="))?.slice(7).split(",");
const want = (name: string) => !only || only.includes(name);
const repeats = quick ? 1 : 3;

const dir = mkdtempSync(join(tmpdir(), "morphogauge-bench-"));
const rows: BenchRow[] = [];
const add = (...r: BenchRow[]) => {
  for (const row of r) {
    printRow(row);
    rows.push(row);
  }
};
const load = () => loadavg().map((l) => l.toFixed(2)).join(" ");
const loadBefore = load();
console.log(`morphogauge benchmarks — ${cpus().length} cores, load average ${loadBefore}${quick ? " (quick)" : ""}`);

try {
  // First, so that the "cold" figure is this process's first fits.
  if (want("kernel")) {
    printHeader("4. fit kernel (one process, exponential, 1,000 × 500 points)");
    const k = runFitBench({ quiet: true });
    const ref = (us: number) => ({ label: "scipy curve_fit (defaults)", value: us, peakMiB: null });
    add(
      timeRow("kernel", "per fit, warm", "µs", k.oursMicroseconds, null, ref(k.scipyDefaultMicroseconds), "", null, `λ agrees with scipy to ${k.worstRelativeLambdaDisagreement.toExponential(1)}`),
      timeRow("kernel", "per fit, cold (first 1,000 of the process)", "µs", k.oursColdMicroseconds, null, ref(k.scipyDefaultMicroseconds), "", null),
      timeRow("kernel", "per fit, warm, vs scipy with analytic Jacobian", "µs", k.oursMicroseconds, null, { label: "scipy curve_fit (analytic J, tol 1e-12)", value: k.scipyTightMicroseconds, peakMiB: null }, "", null),
    );
  }
  if (want("startup")) {
    printHeader("2. start-up");
    add(...benchStartup(dir, quick ? 3 : 5));
  }
  if (want("e2e")) {
    printHeader("1. end to end (import, then fit --model exponential; two processes)");
    add(await benchEndToEnd(dir, 1000, repeats));
    if (!quick) add(await benchEndToEnd(dir, 10000, 1));
  }
  if (want("import")) {
    printHeader("3. import alone");
    add(await benchImport(dir, repeats));
  }
  if (want("precision")) {
    printHeader("5. precision");
    add(...(await benchPrecision(dir, repeats)));
  }
  if (want("server")) {
    printHeader("6. server on 127.0.0.1 (profile list + one fit, while a long fit job runs)");
    add(...(await benchServer(dir, quick ? 3 : 10, 8)));
  }
} finally {
  rmSync(dir, { recursive: true, force: true });
}

const out = new URL("./results/", import.meta.url);
mkdirSync(out, { recursive: true });
const summary = { machine: { cores: cpus().length, loadBefore, loadAfter: load(), node: process.version }, quick, rows };
writeFileSync(new URL("latest.json", out), JSON.stringify(summary, null, 2) + "\n");
console.log(`\nload average after: ${summary.machine.loadAfter}; written to bench/results/latest.json`);
