import busboy from "busboy";
import type { Request } from "express";
import type { SourceFile } from "../import/parseProfileFile.ts";
import { UserError } from "../userError.ts";

export interface MultipartBody {
  /** Uploaded files by form field name (a field may carry several files). */
  files: Record<string, SourceFile[]>;
  fields: Record<string, string>;
}

/** Read a multipart/form-data upload into memory, refusing any file over `maxFileBytes`. */
export function readMultipart(req: Request, limits: { maxFileBytes: number; maxFiles: number; maxTotalBytes?: number }): Promise<MultipartBody> {
  const type = req.headers["content-type"] ?? "";
  if (!type.startsWith("multipart/form-data")) {
    return Promise.reject(new UserError("not-multipart", "Send the files as multipart/form-data (a form with file fields).", { status: 415 }));
  }
  const declared = Number(req.headers["content-length"] ?? 0);
  if (limits.maxTotalBytes !== undefined && declared > limits.maxTotalBytes) {
    req.resume();
    return Promise.reject(tooLarge(limits.maxTotalBytes));
  }
  return new Promise((resolve, reject) => {
    const out: MultipartBody = { files: {}, fields: {} };
    let failed: UserError | null = null;
    let total = 0;
    // Stop reading as soon as the whole request is over the limit, rather than buffering it all first.
    const onData = (c: Buffer) => {
      total += c.length;
      if (limits.maxTotalBytes !== undefined && total > limits.maxTotalBytes && !failed) {
        failed = tooLarge(limits.maxTotalBytes);
        req.unpipe(bb);
        req.off("data", onData);
        req.resume();
        reject(failed);
      }
    };
    req.on("data", onData);
    const bb = busboy({ headers: req.headers, limits: { fileSize: limits.maxFileBytes, files: limits.maxFiles, fields: 50 } });
    bb.on("file", (field, stream, info) => {
      const chunks: Uint8Array[] = [];
      stream.on("data", (c: Buffer) => {
        if (failed) return;
        // A copy of each chunk as it arrives, in memory of its own: the copies can be handed to the
        // reading thread without copying again, and no large copy ever blocks this thread at once.
        const own = new Uint8Array(c.length);
        own.set(c);
        chunks.push(own);
      });
      stream.on("limit", () => {
        failed ??= new UserError("file-too-large", `${info.filename}: the file is over the ${limits.maxFileBytes}-byte limit. Nothing was imported.`, { status: 413 });
      });
      stream.on("end", () => {
        (out.files[field] ??= []).push(uploadedFile(info.filename || field, chunks));
      });
    });
    bb.on("field", (name, value) => {
      out.fields[name] = value;
    });
    bb.on("filesLimit", () => {
      failed ??= new UserError("too-many-files", `At most ${limits.maxFiles} files per upload.`, { status: 413 });
    });
    bb.on("error", (e) => reject(new UserError("bad-upload", `The upload could not be read: ${(e as Error).message}`, { status: 400 })));
    bb.on("close", () => (failed ? reject(failed) : resolve(out)));
    req.pipe(bb);
  });
}

function tooLarge(maxBytes: number): UserError {
  return new UserError(
    "upload-too-large",
    `The upload is over ${Math.round(maxBytes / 1024 / 1024)} MB in all; nothing was imported. Send fewer files at once (the limit can be raised with the environment variable MORPHOGAUGE_MAX_UPLOAD_MB when the server starts).`,
    { status: 413 },
  );
}

/** An uploaded file: its chunks as received, and `bytes` joined from them only if something on this thread asks. */
export type UploadedFile = SourceFile & { chunks: Uint8Array[] };

function uploadedFile(name: string, chunks: Uint8Array[]): UploadedFile {
  const file = { name, chunks } as UploadedFile;
  let joined: Uint8Array | null = null;
  // Not enumerable: sending the file to a worker thread sends the chunks, not a joined copy.
  Object.defineProperty(file, "bytes", { enumerable: false, get: () => (joined ??= joinChunks(chunks)) });
  return file;
}

/** The chunks in one buffer. */
export function joinChunks(chunks: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(chunks.reduce((n, c) => n + c.length, 0));
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.length;
  }
  return out;
}
