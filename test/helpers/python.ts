import { spawn, type ChildProcessWithoutNullStreams } from "node:child_process";

/**
 * scipy/numpy as an outside reference, through one long-lived python3 process per test file.
 * Reference code only: nothing in server/ ever calls python.
 *
 * Why a long-lived process: starting python and importing numpy/scipy costs seconds on a loaded
 * machine, and a synchronous spawn blocked the event loop of the test process, which also hosts
 * the in-process test servers (their keep-alive timers then fired while a request was on its way).
 */

/** The snippet reads the JSON value `data` and must assign its answer to `result`; both travel as JSON. */
const SERVER = String.raw`
import json, sys, traceback
import numpy as np
def _default(o):
    if isinstance(o, np.ndarray): return o.tolist()
    if isinstance(o, np.generic): return o.item()
    raise TypeError(type(o))
for line in sys.stdin:
    request = json.loads(line)
    scope = {"np": np, "json": json, "sys": sys, "data": request["data"]}
    try:
        exec(request["snippet"], scope)
        answer = {"ok": True, "result": scope["result"]}
    except BaseException:
        answer = {"ok": False, "error": traceback.format_exc()}
    sys.stdout.write(json.dumps(answer, default=_default) + "\n")
    sys.stdout.flush()
`;

interface Pending {
  resolve(value: unknown): void;
  reject(error: Error): void;
}

let worker: { proc: ChildProcessWithoutNullStreams; pending: Pending[]; stderr: string } | undefined;

function startWorker(): NonNullable<typeof worker> {
  const proc = spawn("python3", ["-u", "-c", SERVER], { stdio: ["pipe", "pipe", "pipe"] });
  const state = { proc, pending: [] as Pending[], stderr: "" };
  let buffered = "";
  proc.stdout.setEncoding("utf8");
  proc.stdout.on("data", (chunk: string) => {
    buffered += chunk;
    let newline = buffered.indexOf("\n");
    while (newline >= 0) {
      const line = buffered.slice(0, newline);
      buffered = buffered.slice(newline + 1);
      const waiting = state.pending.shift();
      if (waiting) {
        const answer = JSON.parse(line) as { ok: boolean; result?: unknown; error?: string };
        if (answer.ok) waiting.resolve(answer.result);
        else waiting.reject(new Error(`python3 reference failed:\n${answer.error}`));
      }
      newline = buffered.indexOf("\n");
    }
  });
  proc.stderr.setEncoding("utf8");
  proc.stderr.on("data", (chunk: string) => {
    state.stderr = (state.stderr + chunk).slice(-20_000);
  });
  proc.on("exit", (code) => {
    for (const waiting of state.pending.splice(0)) {
      waiting.reject(new Error(`python3 reference exited (code ${code}):\n${state.stderr}`));
    }
    if (worker === state) worker = undefined;
  });
  // The test runner must be able to exit while python idles.
  proc.unref();
  (proc.stdin as unknown as { unref?: () => void }).unref?.();
  (proc.stdout as unknown as { unref?: () => void }).unref?.();
  (proc.stderr as unknown as { unref?: () => void }).unref?.();
  return state;
}

/**
 * Run a python3 snippet as an outside reference. The snippet reads `data` (numpy is `np`) and assigns
 * its answer to `result`. Calls run one after another in the same interpreter, each in a fresh scope.
 */
export function runPython<T = unknown>(snippet: string, data: unknown): Promise<T> {
  worker ??= startWorker();
  const state = worker;
  return new Promise<T>((resolve, reject) => {
    state.pending.push({ resolve: resolve as (value: unknown) => void, reject });
    state.proc.stdin.write(`${JSON.stringify({ snippet, data })}\n`);
  });
}

/** Relative difference |a − b| / max(|b|, tiny). */
export function relativeDifference(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
}
