#!/usr/bin/env node
// Compiles the TypeScript sources once, at install (`npm ci` runs `prepare`), so no
// command pays for compiling at start-up:
//   dist/server/   the CLI (one small entry, one chunk per sub-command, loaded on demand),
//                  every worker thread and the SQL migrations, as plain ES modules;
//   dist/client/   the browser page, bundled and minified, without source maps.
// The layout keeps every path the code resolves from `import.meta.url` valid:
// dist/server/x.mjs → ../../fixtures is the repository's fixtures folder,
// ./jobWorker.mjs (any worker shim X.mjs) and ./migrations/ sit beside the chunks.
import { build } from "esbuild";
import { cpSync, copyFileSync, existsSync, mkdirSync, readdirSync, renameSync, rmSync } from "node:fs";
import { fileURLToPath } from "node:url";

const ROOT = fileURLToPath(new URL("../", import.meta.url));
const FINAL = ROOT + "dist/";
// Built beside dist/ and swapped in at the end, so a command starting meanwhile
// finds either the old build, none (it then runs from source), or the new one.
const DIST = ROOT + `dist.building-${process.pid}/`;
const started = performance.now();

// A worker thread is started from a shim `X.mjs` (it registers tsx, then imports `X.ts`);
// each shim with a TypeScript twin becomes an entry `X`, compiled, so that
// `new URL("./X.mjs", import.meta.url)` finds it beside the chunks.
const shims = readdirSync(ROOT + "server", { recursive: true }).filter(
  (f) => f.endsWith(".mjs") && !f.endsWith("cli/morphogauge.mjs") && existsSync(ROOT + "server/" + f.replace(/\.mjs$/, ".ts")),
);
const workers = Object.fromEntries(shims.map((f) => [f.split("/").at(-1).replace(/\.mjs$/, ""), "server/" + f.replace(/\.mjs$/, ".ts")]));
if (Object.keys(workers).length !== shims.length) throw new Error(`build: two worker shims share a file name (${shims.join(", ")}); they would overwrite each other in dist/server/`);

await build({
  absWorkingDir: ROOT,
  entryPoints: { morphogauge: "server/cli/main.ts", ...workers },
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
