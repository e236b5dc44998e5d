import { z } from "zod";
import { UserError } from "./userError.ts";

/**
 * Every limit that keeps one request or job from taking the server down, and
 * its default. Each can be raised with the environment variable named beside
 * it (read when the server starts); the refusal messages name them too.
 */
export const ServerLimits = z.object({
  /** Worker threads computing analyses at once (MORPHOGAUGE_WORKERS); 1 keeps a core free for requests on a 2-core machine. */
  workers: z.coerce.number().int().min(1).max(64).default(1),
  /** Analyses waiting for a worker before new ones are refused with 429 (MORPHOGAUGE_MAX_QUEUE). */
  maxQueue: z.coerce.number().int().min(1).max(100_000).default(20),
  /** Minutes an analysis may run before it is stopped (MORPHOGAUGE_JOB_TIMEOUT_MIN). */
  jobTimeoutMin: z.coerce.number().positive().max(24 * 60).default(30),
  /** Work units one analysis may ask for (MORPHOGAUGE_COMPUTE_BUDGET): resamples or permutations × embryos × grid points. */
  computeBudget: z.coerce.number().positive().default(2e8),
  /** Grid points of one precision analysis (MORPHOGAUGE_MAX_GRID_POINTS). */
  maxGridPoints: z.coerce.number().int().positive().default(20_000),
  /** Bytes of one upload request, all files together, in MB (MORPHOGAUGE_MAX_UPLOAD_MB). */
  maxUploadMb: z.coerce.number().positive().default(200),
  /** Columns of one table (MORPHOGAUGE_MAX_COLUMNS). */
  maxColumns: z.coerce.number().int().positive().default(10_000),
  /** Cells of one file (MORPHOGAUGE_MAX_CELLS). */
  maxCells: z.coerce.number().int().positive().default(20_000_000),
  /** Characters of one line of a file (MORPHOGAUGE_MAX_LINE_CHARS). */
  maxLineChars: z.coerce.number().int().positive().default(1_000_000),
  /** Seconds reading one uploaded file may take (MORPHOGAUGE_PARSE_TIMEOUT_S). */
  parseTimeoutS: z.coerce.number().positive().default(120),
  /** Memory of the thread that reads uploads, in MB (MORPHOGAUGE_PARSE_MEMORY_MB). */
  parseMemoryMb: z.coerce.number().int().min(64).default(1024),
  /** Uploads waiting to be read before new ones are refused with 429 (MORPHOGAUGE_MAX_UPLOAD_QUEUE). */
  maxUploadQueue: z.coerce.number().int().min(1).default(8),
});

export type ServerLimits = z.output<typeof ServerLimits>;

/** Environment variable of each limit. */
export const LIMIT_ENV: Record<keyof ServerLimits, string> = {
  workers: "MORPHOGAUGE_WORKERS",
  maxQueue: "MORPHOGAUGE_MAX_QUEUE",
  jobTimeoutMin: "MORPHOGAUGE_JOB_TIMEOUT_MIN",
  computeBudget: "MORPHOGAUGE_COMPUTE_BUDGET",
  maxGridPoints: "MORPHOGAUGE_MAX_GRID_POINTS",
  maxUploadMb: "MORPHOGAUGE_MAX_UPLOAD_MB",
  maxColumns: "MORPHOGAUGE_MAX_COLUMNS",
  maxCells: "MORPHOGAUGE_MAX_CELLS",
  maxLineChars: "MORPHOGAUGE_MAX_LINE_CHARS",
  parseTimeoutS: "MORPHOGAUGE_PARSE_TIMEOUT_S",
  parseMemoryMb: "MORPHOGAUGE_PARSE_MEMORY_MB",
  maxUploadQueue: "MORPHOGAUGE_MAX_UPLOAD_QUEUE",
};

/** The limits from the environment (unset variables take the defaults); a bad value is a startup error naming the variable. */
export function limitsFromEnv(env: NodeJS.ProcessEnv, overrides: Partial<ServerLimits> = {}): ServerLimits {
  const raw: Record<string, string> = {};
  for (const [key, name] of Object.entries(LIMIT_ENV)) if (env[name] !== undefined && env[name] !== "") raw[key] = env[name]!;
  const r = ServerLimits.safeParse(raw);
  if (!r.success) {
    const i = r.error.issues[0];
    const key = String(i.path[0]) as keyof ServerLimits;
    throw new UserError("bad-limit", `${LIMIT_ENV[key]}=${raw[key]}: ${i.message}`);
  }
  return { ...r.data, ...overrides };
}

/** "raise it with MORPHOGAUGE_X=…" for a refusal message. */
export function raiseHint(key: keyof ServerLimits): string {
  return `the limit can be raised with the environment variable ${LIMIT_ENV[key]} when the server starts`;
}
