import { fileURLToPath } from "node:url";

/** The installed command, run as a user runs it (compiled JavaScript from dist/ when built). */
export const BIN = fileURLToPath(new URL("../server/cli/morphogauge.mjs", import.meta.url));
export const PYTHON_DIR = fileURLToPath(new URL("./python/", import.meta.url));

export const morphogauge = (...args: string[]) => ({ command: process.execPath, args: [BIN, ...args] });
export const python = (script: string, ...args: string[]) => ({ command: "python3", args: [PYTHON_DIR + script, ...args] });
