import type { z } from "zod";
import { UserError } from "../userError.ts";

/** A zod validation failure of command-line options, named by their option names. */
export function zodToUserError(error: z.ZodError, optionNames: Record<string, string> = {}): UserError {
  const issues = error.issues.map((i) => {
    const key = String(i.path[0] ?? "");
    const option = `--${optionNames[key] ?? key}`;
    return { path: option, message: i.message };
  });
  return new UserError("bad-option", issues.map((i) => `${i.path}: ${i.message}`).join("; "), { issues });
}
