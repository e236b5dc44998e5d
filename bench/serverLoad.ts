import { spawn, type ChildProcess } from "node:child_process";
import { join } from "node:path";
import { BIN, morphogauge } from "./cli.ts";
import { writeLongCsv } from "./longCsv.ts";
import { runProcess } from "./measure.ts";
import { timeRow, type BenchRow } from "./report.ts";

export interface LoadResult {
  requests: number;
  errors: number;
  perSecond: number;
  p50Ms: number;
  p99Ms: number;
  maxMs: number;
}

/**
 * A bounded load test on 127.0.0.1: `connections` clients each send one
 * request after another, alternating between the given paths, until
 * `seconds` have passed; then it stops by itself.
 */
export async function loadTest(baseUrl: string, paths: string[], connections: number, seconds: number): Promise<LoadResult> {
  const latencies: number[] = [];
  let errors = 0;
  const deadline = performance.now() + seconds * 1000;
  const client = async (k: number) => {
    for (let i = k; performance.now() < deadline; i++) {
      const t0 = performance.now();
      try {
        const res = await fetch(baseUrl + paths[i % paths.length]);
        await res.arrayBuffer();
        if (!res.ok) errors++;
      } catch {
        errors++;
      }
      latencies.push(performance.now() - t0);
    }
  };
  const start = performance.now();
  await Promise.all(Array.from({ length: connections }, (_, k) => client(k)));
  const elapsed = (performance.now() - start) / 1000;
  latencies.sort((a, b) => a - b);
  const q = (p: number) => latencies[Math.min(latencies.length - 1, Math.floor(p * latencies.length))] ?? NaN;
  return { requests: latencies.length, errors, perSecond: latencies.length / elapsed, p50Ms: q(0.5), p99Ms: q(0.99), maxMs: latencies.at(-1) ?? NaN };
}

async function startServer(db: string): Promise<{ url: string; child: ChildProcess }> {
  const child = spawn(process.execPath, [BIN, "serve", "--port", "0", "--host", "127.0.0.1", "--json", "--db", db], { stdio: ["ignore", "pipe", "inherit"] });
  const url = await new Promise<string>((resolve, reject) => {
    let out = "";
    child.stdout!.on("data", (d: Buffer) => {
      out += d.toString();
      const line = out.split("\n").find((l) => l.startsWith("{"));
      if (line) resolve(JSON.parse(line).url);
    });
    child.once("exit", (code) => reject(new Error(`serve exited with ${code}`)));
  });
  return { url, child };
}

/**
 * The server under load: the profile list (a page of 50) and one stored fit in
 * full, first with nothing else running (the reference), then while a long
 * fit job (1,000 profiles, every model, global fits) runs in a worker thread.
 */
export async function benchServer(dir: string, seconds: number, connections: number): Promise<BenchRow[]> {
  const csv = join(dir, "server-1000.csv");
  await writeLongCsv(csv, { embryos: 1000, points: 500, seed: 5 });
  const db = join(dir, "server.db");
  for (const step of [morphogauge("import", csv, "--db", db), morphogauge("fit", "--db", db, "--model", "exponential")]) runProcess(step.command, step.args);
  const { url, child } = await startServer(db);
  try {
    const fits = (await (await fetch(url + "api/fits?model=exponential")).json()) as { fits: { fitId: number }[] };
    const paths = ["api/profiles?limit=50", `api/fits/${fits.fits[Math.floor(fits.fits.length / 2)].fitId}`];
    await loadTest(url, paths, 2, 1);
    const idle = await loadTest(url, paths, connections, seconds);
    const submitted = await fetch(url + "api/fits", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ models: ["all"], global: true }),
    });
    if (submitted.status !== 202) throw new Error(`the long job was not accepted: ${submitted.status} ${await submitted.text()}`);
    const job = (await submitted.json()) as { id: string };
    const busy = await loadTest(url, paths, connections, seconds);
    const status = ((await (await fetch(url + `api/jobs/${job.id}`)).json()) as { status: string }).status;
    const stillRunning = status === "running" || status === "queued";
    if (stillRunning) await fetch(url + `api/jobs/${job.id}`, { method: "DELETE" });
    const ref = (v: number) => ({ label: "same load, no job running", value: v, peakMiB: null });
    const note = `${connections} connections × ${seconds} s; job ${stillRunning ? "still running at the end" : `ended (${status}) before the end`}`;
    return [
      timeRow("server", "requests/s while a long job runs", "req/s", busy.perSecond, null, ref(idle.perSecond), "", null, note),
      timeRow("server", "p50 latency while a long job runs", "ms", busy.p50Ms, null, ref(idle.p50Ms), "", null),
      timeRow("server", "p99 latency while a long job runs", "ms", busy.p99Ms, null, ref(idle.p99Ms), "< 50 ms", busy.p99Ms < 50, `max ${busy.maxMs.toFixed(0)} ms`),
      timeRow("server", "errors while a long job runs", "count", busy.errors, null, null, "0", busy.errors === 0 && idle.errors === 0, `${busy.requests} requests; ${idle.errors} errors without the job`),
    ];
  } finally {
    child.kill("SIGTERM");
  }
}
