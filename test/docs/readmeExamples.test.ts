import { readFileSync, mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, isAbsolute } from "node:path";
import { describe, expect, it } from "vitest";
import { runCliInProcess } from "../helpers/runCliInProcess.ts";

// Keep docs and code from drifting: every `npx morphogauge …` line in the README's
// shell blocks runs, in order, against a fresh database (common practice, no source).
const README = readFileSync(new URL("../../README.md", import.meta.url), "utf8");
const REPO = new URL("../../", import.meta.url).pathname;

function exampleCommands(): string[][] {
  const blocks = [...README.matchAll(/```sh\n([\s\S]*?)```/g)].map((m) => m[1]);
  return blocks
    .flatMap((b) => b.split("\n"))
    .map((l) => l.replace(/\s+#.*$/, "").trim())
    .filter((l) => l.startsWith("npx morphogauge "))
    .map((l) => l.slice("npx morphogauge ".length).split(/\s+/));
}

describe("README examples", () => {
  const commands = exampleCommands();
  it("the README shows the demo, import, fit, precision, compare, track and plan commands", () => {
    const names = new Set(commands.map((c) => c[0]));
    for (const n of ["demo", "list", "import", "fit", "precision", "compare", "track", "plan"]) expect(names).toContain(n);
  });

  it("every README command line runs and exits 0", async () => {
    const dir = mkdtempSync(join(tmpdir(), "mg-readme-"));
    // The tour runs `demo` and then works on the demo database (README: export MORPHOGAUGE_DB=morphogauge-demo.db).
    const env = { MORPHOGAUGE_DB: join(dir, "readme.db"), MORPHOGAUGE_DEMO_DB: join(dir, "readme.db") };
    for (const args of commands) {
      if (args[0] === "serve") continue;
      const fixed = args.map((a, i) => (args[i - 1] === "--db" && !isAbsolute(a) ? join(dir, a) : a));
      const r = await runCliInProcess(fixed, env, REPO);
      expect(r.code, `morphogauge ${args.join(" ")}\n${r.stderr}`).toBe(0);
      expect(r.stdout.length).toBeGreaterThan(0);
    }
  }, 180_000);
});
