import { spawn } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openDatabaseSync } from "../../db/connection.ts";
import { ImportOptions } from "../../server/import/importOptions.ts";
import { ServerLimits } from "../../server/serverLimits.ts";
import { importFiles } from "../../server/services/importFiles.ts";
import { checkTableShape, shortenEchoes } from "../../server/services/uploadChecks.ts";
import { databaseSnapshot } from "../helpers/databaseSnapshot.ts";
import { PAGE_WRITE_HEADERS, startTestServer, type TestServer } from "../helpers/testServer.ts";

// A hostile upload must not stall the server or fill its memory (common practice, no source).
const MB = 1024 * 1024;
/** Extra resident memory an upload may cost while it is read, in bytes: the stated cap. */
const RSS_CAP = 600 * MB;

/**
 * The bound on /api/health's slowest answer during an upload: 100 ms, unless
 * the same server, idle, is already slow on this machine (a shared, loaded CI
 * runner: the slowest of a few seconds of idle answers reached 300 ms here);
 * then four times its idle slowest answer (on 2 cores at a load of ~20, idle
 * 100–150 ms and 300–460 ms during these uploads were measured: the process
 * waits for a core more often while its reading thread also runs). Before
 * uploads were read off the request thread, the server did not answer for
 * over 60 s; reading them on it, for 1–6 s.
 */
async function healthBound(url: string): Promise<number> {
  const idle = await slowestHealth(url, () => new Promise((r) => setTimeout(r, 5000)));
  return Math.max(100, 4 * idle.slowestMs);
}

/** Ask /api/health every 20 ms while `work` runs; returns the slowest answer in ms. */
async function slowestHealth(url: string, work: () => Promise<void>): Promise<{ slowestMs: number; answers: number }> {
  let running = true;
  let slowestMs = 0;
  let answers = 0;
  const poll = (async () => {
    while (running) {
      const t0 = performance.now();
      const r = await fetch(`${url}/api/health`);
      await r.arrayBuffer();
      slowestMs = Math.max(slowestMs, performance.now() - t0);
      answers++;
      await new Promise((res) => setTimeout(res, 20));
    }
  })();
  try {
    await work();
  } finally {
    running = false;
    await poll;
  }
  return { slowestMs, answers };
}

function upload(url: string, name: string, bytes: Uint8Array<ArrayBuffer>) {
  const form = new FormData();
  form.append("files", new Blob([bytes]), name);
  form.append("genotype", "wt");
  return fetch(`${url}/api/imports`, { method: "POST", headers: PAGE_WRITE_HEADERS, body: form });
}

/**
 * Upload from another process, as a colleague's browser would: the sending
 * side's work then does not run on the server's thread, whose answers are timed.
 */
async function uploadFromChild(url: string, file: string, name: string): Promise<{ status: number; body: any }> {
  const script = `const b = require("node:fs").readFileSync(${JSON.stringify(file)}); const f = new FormData(); f.append("files", new Blob([b]), ${JSON.stringify(name)}); f.append("genotype", "wt");
fetch(${JSON.stringify(`${url}/api/imports`)}, { method: "POST", headers: { "x-requested-with": "test" }, body: f }).then(async (r) => process.stdout.write(JSON.stringify({ status: r.status, body: await r.json() })));`;
  const out = await new Promise<string>((resolve, reject) => {
      let text = "";
      const child = spawn(process.execPath, ["-e", script], { stdio: ["ignore", "pipe", "inherit"] });
      child.stdout.on("data", (d) => (text += d));
      child.on("error", reject);
      child.on("exit", (code) => (code === 0 ? resolve(text) : reject(new Error(`upload process exited with ${code}`))));
    });
  return JSON.parse(out);
}

/** Write the upload to a file first (not while the server is being timed). */
function stage(name: string, bytes: Uint8Array): { file: string; remove(): void } {
  const dir = mkdtempSync(join(tmpdir(), "mg-upload-"));
  const file = join(dir, name);
  writeFileSync(file, bytes);
  return { file, remove: () => rmSync(dir, { recursive: true, force: true }) };
}

describe("uploads are read off the request thread, within limits", () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer({ limits: ServerLimits.parse({ maxUploadMb: 60 }) });
    // Start the reading thread once, so its start-up is not counted against the first test.
    await upload(s.url, "warm.csv", new TextEncoder().encode("position [µm],W1\n0,5\n1,4\n2,3\n3,2\n4,1\n"));
  });
  afterAll(async () => s.close());

  it("a 10⁶-column upload is refused while /api/health answers within 100 ms (or its idle pace) throughout", async () => {
    // Written straight into bytes (no giant strings whose collection would pause this process, which is also the server's).
    const bytes = Buffer.alloc(12 * MB);
    let at = 0;
    for (let i = 0; i < 1_000_000; i++) at += bytes.write(i === 0 ? `e${i}` : `,e${i}`, at, "latin1");
    at += bytes.write("\n", at, "latin1");
    for (let i = 0; i < 1_000_000; i++) at += bytes.write(i === 0 ? "1" : ",1", at, "latin1");
    at += bytes.write("\n", at, "latin1");
    expect(at).toBeGreaterThan(5 * MB);
    const staged = stage("wide.csv", bytes.subarray(0, at));
    const bound = await healthBound(s.url);
    const before = databaseSnapshot(s.db);
    const rss0 = process.memoryUsage().rss;
    let peak = rss0;
    const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 10);
    let answer: { status: number; body: any } | null = null;
    const { slowestMs, answers } = await slowestHealth(s.url, async () => {
      answer = await uploadFromChild(s.url, staged.file, "wide.csv");
    });
    clearInterval(sampler);
    staged.remove();
    expect(answer!.status).toBe(422);
    expect(answer!.body.files[0].error.code).toBe("line-too-long");
    expect(answer!.body.files[0].error.message.length).toBeLessThan(600);
    expect(answers).toBeGreaterThan(0);
    expect(slowestMs).toBeLessThan(bound);
    expect(peak - rss0).toBeLessThan(RSS_CAP);
    expect(databaseSnapshot(s.db)).toEqual(before);
  }, 120_000);

  it("a 49 MB single-line upload is refused while /api/health answers within 100 ms (or its idle pace) throughout", async () => {
    const staged = stage("one-line.csv", new Uint8Array(49 * MB).fill(0x31));
    const bound = await healthBound(s.url);
    const before = databaseSnapshot(s.db);
    const rss0 = process.memoryUsage().rss;
    let peak = rss0;
    const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 10);
    let answer: { status: number; body: any } | null = null;
    const { slowestMs } = await slowestHealth(s.url, async () => {
      answer = await uploadFromChild(s.url, staged.file, "one-line.csv");
    });
    clearInterval(sampler);
    staged.remove();
    expect(answer!.body.files[0].error.message).toMatch(/line 1 is 51,380,224 characters long; at most 1,000,000/);
    expect(slowestMs).toBeLessThan(bound);
    expect(peak - rss0).toBeLessThan(RSS_CAP);
    expect(databaseSnapshot(s.db)).toEqual(before);
  }, 120_000);

  it("a request over the total upload limit is refused with 413 before it is all read", async () => {
    const form = new FormData();
    for (let i = 0; i < 4; i++) form.append("files", new Blob([new Uint8Array(20 * MB).fill(0x32)]), `f${i}.csv`);
    const r = await fetch(`${s.url}/api/imports`, { method: "POST", headers: PAGE_WRITE_HEADERS, body: form });
    expect(r.status).toBe(413);
    expect((await r.json()).error.message).toContain("MORPHOGAUGE_MAX_UPLOAD_MB");
  }, 120_000);
});

describe("checks on a file's shape and values", () => {
  const limits = ServerLimits.parse({});
  const enc = (s: string) => new TextEncoder().encode(s);

  it("checkTableShape refuses more columns than the limit, and more cells, naming both numbers", () => {
    const header = Array.from({ length: 10_001 }, (_, i) => `c${i}`).join(",");
    expect(() => checkTableShape("w.csv", enc(`${header}\n`), limits)).toThrow(/the first line has 10,001 columns; at most 10,000/);
    expect(() => checkTableShape("c.csv", enc("a,b\n1,2\n3,4\n"), { ...limits, maxCells: 5 })).toThrow(/3 lines × 2 columns is more than the 5 cells/);
    expect(() => checkTableShape("ok.csv", enc("a,b\r\n1,2\r\n"), limits)).not.toThrow();
  });

  it("a bad cell is echoed as a short excerpt, never whole", () => {
    const huge = "9".repeat(5_000) + "x";
    const db = openDatabaseSync(":memory:");
    const [r] = importFiles(db, [{ name: "h.csv", bytes: enc(`position [µm],E1\n0,1\n1,${huge}\n2,3\n3,4\n4,5\n5,6\n`) }], ImportOptions.parse({ genotype: "wt" }));
    expect(r.status).toBe("rejected");
    if (r.status === "rejected") {
      expect(r.error.message.length).toBeLessThan(700);
      expect(JSON.stringify(r.error).length).toBeLessThan(8000);
      expect(JSON.stringify(r.error)).not.toContain("9".repeat(100));
      expect(r.error.message).toContain("more characters");
    }
    expect(shortenEchoes(`cell "${"a".repeat(500)}" is bad`)).toBe(`cell "${"a".repeat(40)}… (460 more characters)" is bad`);
  });

  it("positions that overflow to Infinity on conversion to µm are refused, not stored", () => {
    const db = openDatabaseSync(":memory:");
    const before = databaseSnapshot(db);
    const px = importFiles(db, [{ name: "px.csv", bytes: enc("x (px),E1\n0,5\n1e10,4\n2e10,3\n3e10,2\n4e10,1\n") }], ImportOptions.parse({ genotype: "wt", pixelSizeUm: 1e300 }));
    expect(px[0].status).toBe("rejected");
    if (px[0].status === "rejected") expect(px[0].error.message).toMatch(/too large to convert to µm.*pixel size/);
    const mm = importFiles(db, [{ name: "mm.csv", bytes: enc("position [mm],E1\n0,5\n1e306,4\n2e306,3\n3e306,2\n4e306,1\n") }], ImportOptions.parse({ genotype: "wt" }));
    expect(mm[0].status).toBe("rejected");
    expect(databaseSnapshot(db)).toEqual(before);
  });

  it("a second position column is refused instead of ignored", () => {
    const db = openDatabaseSync(":memory:");
    const long = "embryo,position [µm],x (px),intensity\n" + [0, 1, 2, 3, 4, 5].map((i) => `E1,${i * 10},${i * 20},${100 - i}`).join("\n") + "\n";
    const [r] = importFiles(db, [{ name: "two.csv", bytes: enc(long) }], ImportOptions.parse({ genotype: "wt", pixelSizeUm: 0.5 }));
    expect(r.status).toBe("rejected");
    if (r.status === "rejected") expect(r.error.message).toMatch(/2 columns are recognised as positions \("position \[µm\]", "x \(px\)"\)/);
  });
});
