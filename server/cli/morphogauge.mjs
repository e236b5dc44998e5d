#!/usr/bin/env node
// Entry point of the `morphogauge` command. Runs the JavaScript compiled at install
// (`npm run build`, run by `npm ci` through `prepare`, writes dist/); without a build,
// or with MORPHOGAUGE_FROM_SOURCE=1 (development), runs the TypeScript sources through tsx.
import { existsSync } from "node:fs";

const compiled = new URL("../../dist/server/morphogauge.mjs", import.meta.url);
let main;
if (process.env.MORPHOGAUGE_FROM_SOURCE !== "1" && existsSync(compiled)) {
  ({ main } = await import(compiled.href));
} else {
  const { register } = await import("tsx/esm/api");
  register();
  ({ main } = await import("./main.ts"));
}
await main();
