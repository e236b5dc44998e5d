import { build } from "esbuild";
import { copyFileSync, mkdirSync, rmSync } from "node:fs";
import { fileURLToPath } from "node:url";

const CLIENT = fileURLToPath(new URL("../../client/", import.meta.url));

/** Bundle the browser client into client/dist (esbuild, a fraction of a second) and return that folder. */
export async function buildClient(): Promise<string> {
  const out = CLIENT + "dist/";
  mkdirSync(out, { recursive: true });
  rmSync(out + "app.js.map", { force: true });
  await build({
    entryPoints: [CLIENT + "main.ts"],
    bundle: true,
    format: "esm",
    target: "es2022",
    outfile: out + "app.js",
    // No source map: it would publish the whole source tree next to the page.
    sourcemap: false,
    logLevel: "silent",
  });
  copyFileSync(CLIENT + "index.html", out + "index.html");
  copyFileSync(CLIENT + "styles.css", out + "styles.css");
  return out;
}
