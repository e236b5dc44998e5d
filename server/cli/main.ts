import { parseArgs } from "node:util";
import { isUserError } from "../userError.ts";
import type { Command, CommandIo } from "./command.ts";
import { COMMANDS } from "./commands.ts";
import { TOOL_VERSION } from "../version.ts";

const USAGE = () => `morphogauge — measure morphogen gradients across replicate embryos

Usage: morphogauge <command> [options]

Commands:
${COMMANDS.map((c) => `  ${c.name.padEnd(10)} ${c.summary}`).join("\n")}

Run "morphogauge <command> --help" for a command's options.
Every command takes --db PATH (default $MORPHOGAUGE_DB or ./morphogauge.db) and --json.
`;

/** Run the command line; returns the exit code (0 ok, 1 a user error, 2 bad usage, 70 an internal error). */
export async function runCli(argv: string[], io: CommandIo): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === "--help" || name === "-h" || name === "help") {
    io.stdout(USAGE());
    return name === undefined ? 2 : 0;
  }
  if (name === "--version") {
    io.stdout(`${TOOL_VERSION}\n`);
    return 0;
  }
  const command: Command | undefined = COMMANDS.find((c) => c.name === name);
  if (!command) {
    io.stderr(`morphogauge: unknown command "${name}"\n\n${USAGE()}`);
    return 2;
  }
  let parsed;
  try {
    parsed = parseArgs({ args: rest, options: command.options, allowPositionals: command.allowPositionals ?? false, strict: true });
  } catch (e) {
    io.stderr(`morphogauge ${name}: ${(e as Error).message.replace(/^TypeError \[[A-Z_]+\]: /, "")}\n\n${command.help}\n`);
    return 2;
  }
  if (parsed.values.help) {
    io.stdout(command.help + "\n");
    return 0;
  }
  try {
    return await command.run(parsed.values as Record<string, string | boolean | string[] | undefined>, parsed.positionals, io);
  } catch (e) {
    if (isUserError(e)) {
      if (parsed.values.json) io.stdout(JSON.stringify({ error: { code: e.code, message: e.message, issues: e.issues } }, null, 2) + "\n");
      io.stderr(`morphogauge ${name}: ${e.message}\n`);
      for (const i of e.issues.slice(1)) io.stderr(`  - ${i.path}: ${i.message}\n`);
      return 1;
    }
    io.stderr(`morphogauge ${name}: internal error — this is a bug in morphogauge, please report it.\n${(e as Error).stack ?? e}\n`);
    return 70;
  }
}

/** The process entry point. */
export async function main(): Promise<void> {
  const code = await runCli(process.argv.slice(2), {
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    stderrIsTty: Boolean(process.stderr.isTTY),
    env: process.env,
    cwd: process.cwd(),
  });
  if (code !== 0) process.exitCode = code;
}
