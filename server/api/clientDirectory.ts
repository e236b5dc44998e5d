import { fileURLToPath } from "node:url";

/**
 * The folder the browser page is served from. Compiled (dist/, built at install):
 * dist/client, bundled and minified once, no source maps. From the TypeScript
 * sources (development, tests): bundled now into client/dist by `buildClient`.
 */
export async function clientDirectory(): Promise<string> {
  // esbuild replaces this variable with "1" when it compiles the server (scripts/build.mjs).
  if (process.env.MORPHOGAUGE_COMPILED === "1") return fileURLToPath(new URL("../client/", import.meta.url));
  const { buildClient } = await import("./buildClient.ts");
  return buildClient();
}
