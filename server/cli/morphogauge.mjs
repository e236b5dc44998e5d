#!/usr/bin/env node
// Entry point of the `morphogauge` command: registers the TypeScript loader, then runs the CLI.
import { register } from "tsx/esm/api";

register();
const { main } = await import("./main.ts");
await main();
