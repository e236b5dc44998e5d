import { browserWording } from "../format/browserWording.ts";

/** One problem the API named, with where it was found. */
export interface ApiIssue {
  path: string;
  message: string;
}

/** An error answer of the API (`{ error: { code, message, issues } }`), or a failed connection. */
export class ApiError extends Error {
  readonly code: string;
  readonly status: number;
  readonly issues: ApiIssue[];

  constructor(code: string, message: string, status: number, issues: ApiIssue[] = []) {
    super(message);
    this.name = "ApiError";
    this.code = code;
    this.status = status;
    this.issues = issues;
  }
}

/** Read an error body; anything that is not the API's error shape becomes a plain sentence. */
export function apiErrorFrom(status: number, body: unknown): ApiError {
  const error = (body as { error?: { code?: unknown; message?: unknown; issues?: unknown } } | null)?.error;
  if (error && typeof error.message === "string") {
    const issues = Array.isArray(error.issues) ? (error.issues as ApiIssue[]).filter((i) => typeof i?.message === "string") : [];
    return new ApiError(typeof error.code === "string" ? error.code : "error", error.message, status, issues);
  }
  return new ApiError("http", `The server answered with status ${status} and no explanation.`, status);
}

/**
 * What to tell the user about an error, in plain words: the API's message
 * (with command-line options reworded as the page's fields), never a stack trace.
 */
export function plainMessage(error: unknown): { message: string; details: string[] } {
  if (error instanceof ApiError) {
    // The message usually lists the issues already; show them separately only when it does not.
    const details = error.issues.map((i) => browserWording(i.path ? `${i.path}: ${i.message}` : i.message)).filter((d) => !error.message.includes(d));
    return { message: browserWording(error.message), details };
  }
  if (error instanceof TypeError) return { message: "The morphogauge server did not answer. Is it still running?", details: [] };
  return { message: "Something went wrong in the page. Reload it and try again; if it happens again, please report it.", details: [] };
}
