import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

/** One timed run of a separate process. */
export interface ProcessRun {
  seconds: number;
  /** Peak resident memory of the process in MiB (GNU time), or null where it cannot be read. */
  peakMiB: number | null;
  stdout: string;
  stderr: string;
}

const GNU_TIME = "/usr/bin/time";
const HAS_GNU_TIME = existsSync(GNU_TIME);

/** Run a command to completion, timing it from outside and reading its peak memory; throws if it fails. */
export function runProcess(command: string, args: string[], options: { cwd?: string; env?: NodeJS.ProcessEnv } = {}): ProcessRun {
  const dir = mkdtempSync(join(tmpdir(), "mg-bench-time-"));
  const memFile = join(dir, "mem");
  try {
    const argv = HAS_GNU_TIME ? [GNU_TIME, "-f", "%M", "-o", memFile, command, ...args] : [command, ...args];
    const t0 = performance.now();
    const proc = spawnSync(argv[0], argv.slice(1), { cwd: options.cwd, env: options.env ?? process.env, encoding: "utf8", maxBuffer: 256 * 1024 * 1024 });
    const seconds = (performance.now() - t0) / 1000;
    if (proc.status !== 0) throw new Error(`${command} ${args.join(" ")} failed (${proc.status}):\n${proc.stderr}`);
    const kb = HAS_GNU_TIME ? Number(readFileSync(memFile, "utf8").trim().split("\n").at(-1)) : NaN;
    return { seconds, peakMiB: Number.isFinite(kb) ? kb / 1024 : null, stdout: proc.stdout, stderr: proc.stderr };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Several commands one after the other, as a user would type them: summed time, highest peak. */
export function runSequence(steps: { command: string; args: string[] }[], options: { cwd?: string; env?: NodeJS.ProcessEnv } = {}): ProcessRun {
  const runs = steps.map((s) => runProcess(s.command, s.args, options));
  const peaks = runs.map((r) => r.peakMiB).filter((p): p is number => p !== null);
  return {
    seconds: runs.reduce((a, r) => a + r.seconds, 0),
    peakMiB: peaks.length === runs.length ? Math.max(...peaks) : null,
    stdout: runs.map((r) => r.stdout).join(""),
    stderr: runs.map((r) => r.stderr).join(""),
  };
}

/** The run with the median time of `n` (prepare runs before each, untimed). */
export function medianRun(n: number, run: () => ProcessRun, prepare: () => void = () => {}): ProcessRun & { all: number[] } {
  const runs: ProcessRun[] = [];
  for (let i = 0; i < n; i++) {
    prepare();
    runs.push(run());
  }
  const sorted = [...runs].sort((a, b) => a.seconds - b.seconds);
  return { ...sorted[Math.floor((n - 1) / 2)], all: runs.map((r) => r.seconds) };
}

/**
 * Alternate runs of ours and the reference `n` times (so a change in the
 * machine's load hits both alike) and return the median run of each.
 */
export function pairedRuns(n: number, ours: () => ProcessRun, reference: () => ProcessRun, prepare: () => void = () => {}): { ours: ProcessRun; reference: ProcessRun } {
  const a: ProcessRun[] = [];
  const b: ProcessRun[] = [];
  for (let i = 0; i < n; i++) {
    prepare();
    a.push(ours());
    b.push(reference());
  }
  const median = (runs: ProcessRun[]) => [...runs].sort((x, y) => x.seconds - y.seconds)[Math.floor((runs.length - 1) / 2)];
  return { ours: median(a), reference: median(b) };
}
