import { spawn, spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, readdirSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

// The install step compiles the CLI, the server, the job worker and the page (scripts/build.mjs,
// run by `npm ci` through `prepare`); the installed entry point then runs without compiling
// anything (common practice, no source).
const ROOT = join(import.meta.dirname, "../..");
const BIN = join(ROOT, "server/cli/morphogauge.mjs");
const dir = mkdtempSync(join(tmpdir(), "mg-build-"));
const db = join(dir, "compiled.db");
const env = { ...process.env, MORPHOGAUGE_FROM_SOURCE: "" };

function run(args: string[]) {
  return spawnSync(process.execPath, [BIN, ...args], { encoding: "utf8", env, cwd: dir });
}

describe("compiled build", () => {
  beforeAll(() => {
    const build = spawnSync(process.execPath, [join(ROOT, "scripts/build.mjs")], { encoding: "utf8" });
    expect(build.status, build.stderr).toBe(0);
  });

  it("build writes the CLI, the worker, the migrations and a minified page without source maps", () => {
    const server = readdirSync(join(ROOT, "dist/server"));
    expect(server).toContain("morphogauge.mjs");
    expect(server).toContain("jobWorker.mjs");
    // Every worker shim X.mjs of the sources has its compiled X.mjs beside the chunks.
    const shims = readdirSync(join(ROOT, "server"), { recursive: true, encoding: "utf8" }).filter((f) => f.endsWith(".mjs") && !f.endsWith("morphogauge.mjs"));
    for (const shim of shims) expect(server).toContain(shim.split("/").at(-1));
    expect(readdirSync(join(ROOT, "dist/server/migrations")).length).toBe(readdirSync(join(ROOT, "db/migrations")).length);
    const app = readFileSync(join(ROOT, "dist/client/app.js"), "utf8");
    expect(app).not.toContain("sourceMappingURL");
    expect(readdirSync(join(ROOT, "dist/client")).some((f) => f.endsWith(".map"))).toBe(false);
    // Minified: a few long lines, not one statement per line.
    expect(app.split("\n").length).toBeLessThan(app.length / 1000);
  });

  it("the entry point runs the compiled CLI: --help, demo, list and fit", () => {
    const help = run(["--help"]);
    expect(help.status, help.stderr).toBe(0);
    expect(help.stdout).toContain("Commands:");
    const demo = run(["demo", "--db", db]);
    expect(demo.status, demo.stderr).toBe(0);
    const list = run(["list", "--db", db, "--json"]);
    expect(list.status, list.stderr).toBe(0);
    expect(JSON.parse(list.stdout).profiles.length).toBeGreaterThan(10);
    const fit = run(["fit", "--db", db, "--genotype", "wt", "--json"]);
    expect(fit.status, fit.stderr).toBe(0);
    expect(JSON.parse(fit.stdout).fits.length).toBeGreaterThan(0);
  });

  describe("compiled server", () => {
    let url = "";
    let child: ReturnType<typeof spawn>;
    beforeAll(async () => {
      child = spawn(process.execPath, [BIN, "serve", "--port", "0", "--host", "127.0.0.1", "--json", "--db", join(dir, "served.db"), "--demo"], { env, cwd: dir, stdio: ["ignore", "pipe", "pipe"] });
      url = await new Promise<string>((resolve, reject) => {
        let out = "";
        child.stdout!.on("data", (d: Buffer) => {
          out += d.toString();
          const line = out.split("\n").find((l) => l.startsWith("{"));
          if (line) resolve(JSON.parse(line).url);
        });
        child.once("exit", (code) => reject(new Error(`serve exited with ${code}`)));
      });
    });
    afterAll(() => {
      child.kill("SIGTERM");
    });

    it("serves the prebuilt page and runs a fit job in the compiled worker thread", async () => {
      const page = await fetch(url);
      expect(page.status).toBe(200);
      const app = await fetch(url + "app.js");
      expect(app.status).toBe(200);
      expect(await app.text()).toBe(readFileSync(join(ROOT, "dist/client/app.js"), "utf8"));
      expect((await fetch(url + "app.js.map")).status).toBe(404);
      const submitted = await fetch(url + "api/fits", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ selection: { genotypes: ["wt"] }, models: ["exponential"] }) });
      expect(submitted.status).toBe(202);
      let job = await submitted.json();
      for (let i = 0; i < 200 && (job.status === "queued" || job.status === "running"); i++) {
        await new Promise((r) => setTimeout(r, 50));
        job = await (await fetch(url + `api/jobs/${job.id}`)).json();
      }
      expect(job.status, JSON.stringify(job.error)).toBe("done");
    });
  });
});
