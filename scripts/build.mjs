#!/usr/bin/env node
// Compiles the TypeScript sources once, at install (`npm ci` runs `prepare`), so no
// command pays for compiling at start-up:
//   dist/server/   the CLI (one small entry, one chunk per sub-command, loaded on demand),
//                  the job worker and the SQL migrations, as plain ES modules;
//   dist/client/   the browser page, bundled and minified, without source maps.
// The layout keeps every path the code resolves from `import.meta.url` valid:
// dist/server/x.mjs → ../../fixtures is the repository's fixtures folder,
// ./jobWorker.mjs and ./migrations/ sit beside the chunks.
import { build } from "esbuild";
import { cpSync, copyFileSync, existsSync, mkdirSync, renameSync, rmSync } from "node:fs";
import { fileURLToPath } from "node:url";

const ROOT = fileURLToPath(new URL("../", import.meta.url));
const FINAL = ROOT + "dist/";
// Built beside dist/ and swapped in at the end, so a command starting meanwhile
// finds either the old build, none (it then runs from source), or the new one.
const DIST = ROOT + `dist.building-${process.pid}/`;
const started = performance.now();

await build({
  absWorkingDir: ROOT,
  entryPoints: { morphogauge: "server/cli/main.ts", jobWorker: "server/jobs/jobWorker.ts" },
  outdir: DIST + "server",
  bundle: true,
  splitting: true,
  format: "esm",
  platform: "node",
  target: "node20",
  // Packages stay in node_modules (better-sqlite3 and the canvas are native addons).
  packages: "external",
  entryNames: "[name]",
  chunkNames: "[name]-[hash]",
  outExtension: { ".js": ".mjs" },
  define: { "process.env.MORPHOGAUGE_COMPILED": '"1"' },
  logLevel: "warning",
});
cpSync(ROOT + "db/migrations", DIST + "server/migrations", { recursive: true });

await build({
  absWorkingDir: ROOT,
  entryPoints: ["client/main.ts"],
  outfile: DIST + "client/app.js",
  bundle: true,
  format: "esm",
  target: "es2022",
  minify: true,
  sourcemap: false,
  logLevel: "warning",
});
mkdirSync(DIST + "client", { recursive: true });
copyFileSync(ROOT + "client/index.html", DIST + "client/index.html");
copyFileSync(ROOT + "client/styles.css", DIST + "client/styles.css");

const OLD = ROOT + `dist.old-${process.pid}/`;
if (existsSync(FINAL)) renameSync(FINAL, OLD);
renameSync(DIST, FINAL);
rmSync(OLD, { recursive: true, force: true });

process.stderr.write(`morphogauge: built dist/ in ${Math.round(performance.now() - started)} ms\n`);
