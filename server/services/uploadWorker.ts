import { parentPort } from "node:worker_threads";
import type { ResolvedImportOptions } from "../import/importOptions.ts";
import type { SourceFile } from "../import/parseProfileFile.ts";
import { parseForImport } from "./imports/parseForImport.ts";
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
      const parsed = parseForImport(file, request.options, request.meta);
      checkParsedImport(parsed);
      return { ok: true, parsed };
    } catch (e) {
      if (!isUserError(e)) return { ok: false, error: null, internal: e instanceof Error ? (e.stack ?? e.message) : String(e) };
      const b = boundedUserError(e);
      return { ok: false, error: { code: b.code, message: b.message, status: b.status, issues: b.issues } };
    }
  });
}

/** An uploaded file as it arrives from the request thread: its chunks, joined here. */
type ChunkedFile = { name: string; chunks: Uint8Array[] };

function join(f: ChunkedFile): SourceFile {
  const bytes = new Uint8Array(f.chunks.reduce((n, c) => n + c.length, 0));
  let at = 0;
  for (const c of f.chunks) {
    bytes.set(c, at);
    at += c.length;
  }
  return { name: f.name, bytes };
}

parentPort?.on("message", (m: Omit<UploadRequest, "files" | "meta"> & { files: ChunkedFile[]; meta?: ChunkedFile }) => {
  parentPort!.postMessage(parseUploads({ ...m, files: m.files.map(join), meta: m.meta ? join(m.meta) : undefined }));
});
