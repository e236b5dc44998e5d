import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { API_VERSION } from "../../server/api/createApp.ts";
import { COMMANDS } from "../../server/cli/commands.ts";
import { ENGINE_VERSION } from "../../server/version.ts";
import { runCliInProcess } from "../helpers/runCliInProcess.ts";

// Command-line conventions: --help everywhere, --json alone on stdout, non-zero exit on error (common practice, no source).
const tmp = () => mkdtempSync(join(tmpdir(), "mg-cli-"));

describe("morphogauge command line", () => {
  for (const c of COMMANDS) {
    it(`morphogauge ${c.name} --help prints its usage and exits 0`, async () => {
      const r = await runCliInProcess([c.name, "--help"]);
      expect(r.code).toBe(0);
      expect(r.stdout).toContain(`Usage: morphogauge ${c.name}`);
      expect(r.stdout).toContain("--db PATH");
      expect(r.stdout).toContain("--json");
    });
  }

  it("morphogauge demo fills the demo's own database (MORPHOGAUGE_DEMO_DB), and list --json on it gives the demo embryos", async () => {
    const dir = tmp();
    const env = { MORPHOGAUGE_DEMO_DB: join(dir, "demo.db"), MORPHOGAUGE_DB: join(dir, "demo.db") };
    const demo = await runCliInProcess(["demo", "--json"], { MORPHOGAUGE_DEMO_DB: env.MORPHOGAUGE_DEMO_DB }, dir);
    expect(demo.code).toBe(0);
    const out = JSON.parse(demo.stdout);
    expect(out.files.map((f: { status: string }) => f.status)).toEqual(["imported", "imported"]);
    const list = await runCliInProcess(["list", "--json", "--genotype", "tardy"], env, dir);
    const profiles = JSON.parse(list.stdout).profiles;
    expect(profiles).toHaveLength(30);
    expect(profiles[0]).toMatchObject({ genotype: "tardy", channel: "glm", position_unit: "um" });
  });

  it("morphogauge import --json reports embryos, profiles and warnings per file and refuses a broken file with exit 1", async () => {
    const dir = tmp();
    const good = join(dir, "good.csv");
    const bad = join(dir, "bad.csv");
    writeFileSync(good, "embryo,genotype,position [µm],intensity\n" + [0, 1, 2, 3, 4].map((i) => `A,wt,${i},${i * 10}`).join("\n"));
    writeFileSync(bad, "embryo,position [µm],intensity\n" + [0, 1, 2, 3, 4].map((i) => `B,${i},${i === 2 ? "x" : 5 - i}`).join("\n"));
    const r = await runCliInProcess(["import", good, bad, "--json", "--db", join(dir, "t.db")], {}, dir);
    expect(r.code).toBe(1);
    const out = JSON.parse(r.stdout);
    expect(out.files[0]).toMatchObject({ file: "good.csv", status: "imported", profilesAdded: 1, embryos: ["A"] });
    expect(out.files[0].warnings.map((w: { code: string }) => w.code)).toContain("rising");
    expect(out.files[1]).toMatchObject({ file: "bad.csv", status: "rejected" });
    expect(out.files[1].error.message).toContain('bad.csv, row 4, column "intensity": "x" is not a number');
  });

  it("morphogauge import names a missing file and a bad option value", async () => {
    const dir = tmp();
    const missing = await runCliInProcess(["import", "nope.csv", "--db", join(dir, "t.db")], {}, dir);
    expect(missing.code).toBe(1);
    expect(missing.stderr).toContain("nope.csv: no such file");
    const badOpt = await runCliInProcess(["import", "x.csv", "--pixel-size", "abc"], {}, dir);
    expect(badOpt.code).toBe(1);
    expect(badOpt.stderr).toContain('--pixel-size: "abc" is not a number');
    const unknown = await runCliInProcess(["import", "--frobnicate"], {}, dir);
    expect(unknown.code).toBe(2);
  });

  it("morphogauge --version prints package.json's version, the one the API reports", async () => {
    // common practice, no source: one version string, read from the package manifest.
    const manifest = JSON.parse(readFileSync("package.json", "utf8")) as { version: string };
    const r = await runCliInProcess(["--version"]);
    expect(r.stdout.trim()).toBe(manifest.version);
    expect(API_VERSION).toBe(manifest.version);
    expect(ENGINE_VERSION).toContain(manifest.version);
  });

  it("the installed morphogauge entry point runs as a separate process", () => {
    const r = spawnSync(process.execPath, ["server/cli/morphogauge.mjs", "--help"], { encoding: "utf8" });
    expect(r.status).toBe(0);
    expect(r.stdout).toContain("Commands:");
  });
});
