import { parentPort } from "node:worker_threads";
import type { ResolvedImportOptions } from "../import/importOptions.ts";
import { parseProfileFile, type SourceFile } from "../import/parseProfileFile.ts";
import type { ParsedImport } from "../import/records.ts";
import type { ServerLimits } from "../serverLimits.ts";
import { isUserError } from "../userError.ts";
import { boundedUserError, checkParsedImport, checkTableShape } from "./uploadChecks.ts";

export interface UploadRequest {
  files: SourceFile[];
  meta?: SourceFile;
  options: ResolvedImportOptions;
  limits: Pick<ServerLimits, "maxColumns" | "maxCells" | "maxLineChars">;
}

export type ParseOutcome =
  | { ok: true; parsed: ParsedImport }
  | { ok: false; error: { code: string; message: string; status: number; issues: { path: string; message: string }[] } | null; internal?: string };

/** Parse each uploaded file, checking its shape first; user errors come back bounded, bugs as text for the log. */
export function parseUploads(request: UploadRequest): ParseOutcome[] {
  if (request.meta) {
    try {
      checkTableShape(request.meta.name, request.meta.bytes, request.limits);
    } catch (e) {
      if (!isUserError(e)) throw e;
      const b = boundedUserError(e);
      return request.files.map(() => ({ ok: false, error: { code: b.code, message: b.message, status: b.status, issues: b.issues } }));
    }
  }
  return request.files.map((file): ParseOutcome => {
    try {
      checkTableShape(file.name, file.bytes, request.limits);
      const parsed = parseProfileFile(file, request.options, request.meta);
      checkParsedImport(parsed);
      return { ok: true, parsed };
    } catch (e) {
      if (!isUserError(e)) return { ok: false, error: null, internal: e instanceof Error ? (e.stack ?? e.message) : String(e) };
      const b = boundedUserError(e);
      return { ok: false, error: { code: b.code, message: b.message, status: b.status, issues: b.issues } };
    }
  });
}

parentPort?.on("message", (request: UploadRequest) => {
  parentPort!.postMessage(parseUploads(request));
});
