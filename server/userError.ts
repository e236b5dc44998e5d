/**
 * A mistake in what the user gave us (a file, an option, a request), as
 * opposed to a bug. The API answers it with `status` and the message; the
 * command line prints it and exits non-zero. Anything else is a programmer
 * error and is reported as such.
 */
export interface UserIssue {
  /** Where: a file/row/column, an option name, or a request field path. */
  path: string;
  message: string;
}

export class UserError extends Error {
  readonly code: string;
  readonly status: number;
  readonly issues: UserIssue[];

  constructor(code: string, message: string, options: { status?: number; issues?: UserIssue[] } = {}) {
    super(message);
    this.name = "UserError";
    this.code = code;
    this.status = options.status ?? 400;
    this.issues = options.issues ?? [];
  }
}

export function isUserError(e: unknown): e is UserError {
  return e instanceof UserError;
}
