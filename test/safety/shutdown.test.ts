import { spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

// A stopped server must not keep computing, and must say what it interrupted (common practice, no source).
const CLI = new URL("../../server/cli/morphogauge.mjs", import.meta.url).pathname;

interface Running {
  child: ChildProcess;
  url: string;
  stderr: () => string;
}

async function serve(db: string): Promise<Running> {
  const child = spawn(process.execPath, [CLI, "serve", "--port", "0", "--db", db, "--json"], { stdio: ["ignore", "pipe", "pipe"], env: { ...process.env, MORPHOGAUGE_TOKEN: "" } });
  let out = "";
  let err = "";
  child.stderr!.on("data", (d) => (err += d));
  const url = await new Promise<string>((resolve, reject) => {
    child.stdout!.on("data", (d) => {
      out += d;
      const line = out.split("\n").find((l) => l.startsWith("{"));
      if (line) resolve((JSON.parse(line) as { url: string }).url.replace(/\/$/, ""));
    });
    child.on("exit", (code) => reject(new Error(`serve exited with ${code}: ${err}`)));
  });
  return { child, url, stderr: () => err };
}

const post = async (url: string, body: unknown) =>
  (await fetch(url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) })).json() as Promise<{ id: string; status: string; error: { code: string; message: string } | null }>;

describe("stopping the server", () => {
  it("SIGTERM with a running and a queued job exits within 5 s; after a restart both say they were interrupted and can be re-run", async () => {
    const db = join(mkdtempSync(join(tmpdir(), "mg-stop-")), "lab.db");
    const first = await serve(db);
    const running = await post(`${first.url}/api/jobs/self-test`, { n: 1000, delayMs: 50 });
    const queued = await post(`${first.url}/api/jobs/self-test`, { n: 1000, delayMs: 50 });
    for (let i = 0; i < 200; i++) {
      const j = (await (await fetch(`${first.url}/api/jobs/${running.id}`)).json()) as { status: string };
      if (j.status === "running") break;
      await new Promise((r) => setTimeout(r, 50));
    }
    expect(((await (await fetch(`${first.url}/api/jobs/${queued.id}`)).json()) as { status: string }).status).toBe("queued");
    const t0 = performance.now();
    const exited = new Promise<number | null>((r) => first.child.on("exit", (code) => r(code)));
    first.child.kill("SIGTERM");
    const code = await exited;
    const stopMs = performance.now() - t0;
    expect(code).toBe(0);
    expect(stopMs).toBeLessThan(5000);
    expect(first.stderr()).toContain("SIGTERM: stopping");

    const second = await serve(db);
    try {
      for (const id of [running.id, queued.id]) {
        const j = (await (await fetch(`${second.url}/api/jobs/${id}`)).json()) as { status: string; error: { code: string; message: string } };
        expect(j.status).toBe("interrupted");
        expect(j.error.message).toContain("interrupted by a restart");
      }
      const again = await post(`${second.url}/api/jobs/${running.id}/rerun`, {});
      expect(again.status).toMatch(/queued|running/);
      expect(again.id).not.toBe(running.id);
      await fetch(`${second.url}/api/jobs/${again.id}`, { method: "DELETE", headers: { "x-requested-with": "test" } });
    } finally {
      second.child.kill("SIGTERM");
      await new Promise((r) => second.child.on("exit", r));
    }
  }, 120_000);
});
