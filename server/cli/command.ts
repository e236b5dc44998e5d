import type { ParseArgsConfig } from "node:util";

/** Where a command writes: results on stdout, messages and progress on stderr. */
export interface CommandIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** True when stderr is a terminal, so progress may be drawn there. */
  stderrIsTty: boolean;
  env: NodeJS.ProcessEnv;
  cwd: string;
}

export type OptionSpec = NonNullable<ParseArgsConfig["options"]>;

export interface Command {
  name: string;
  /** One line for the command list. */
  summary: string;
  /** Usage line and option descriptions, shown by --help. */
  help: string;
  options: OptionSpec;
  allowPositionals?: boolean;
  run(values: Record<string, string | boolean | string[] | undefined>, positionals: string[], io: CommandIo): Promise<number>;
}

/** A command as the registry lists it: enough for the command list, the rest loaded on use. */
export interface CommandEntry {
  name: string;
  summary: string;
  load(): Promise<Command>;
}

/** Options every sub-command takes. */
export const COMMON_OPTIONS: OptionSpec = {
  db: { type: "string" },
  json: { type: "boolean", default: false },
  help: { type: "boolean", short: "h", default: false },
};

export const COMMON_HELP = `  --db PATH      database file (default: $MORPHOGAUGE_DB or ./morphogauge.db)
  --json         machine-readable output on stdout
  -h, --help     this help`;
