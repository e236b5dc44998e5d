import { spawnSync } from "node:child_process";

/**
 * Run a python3 snippet as an outside reference (numpy/scipy are on every
 * machine that runs these tests). The snippet reads the JSON value `data`
 * and must assign its answer to `result`; both travel as JSON.
 * Reference code only: nothing in server/ ever calls python.
 */
export function runPython<T = unknown>(snippet: string, data: unknown): T {
  const program = [
    "import json, sys",
    "import numpy as np",
    "data = json.loads(sys.stdin.read())",
    snippet,
    "def _default(o):",
    "    if isinstance(o, np.ndarray): return o.tolist()",
    "    if isinstance(o, np.generic): return o.item()",
    "    raise TypeError(type(o))",
    "sys.stdout.write(json.dumps(result, default=_default))",
  ].join("\n");
  const proc = spawnSync("python3", ["-c", program], {
    input: JSON.stringify(data),
    encoding: "utf8",
    maxBuffer: 256 * 1024 * 1024,
  });
  if (proc.status !== 0) {
    throw new Error(`python3 reference failed (exit ${proc.status}):\n${proc.stderr}`);
  }
  return JSON.parse(proc.stdout) as T;
}

/** Relative difference |a − b| / max(|b|, tiny). */
export function relativeDifference(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
}
