import { WorkerPool } from "../jobs/workerPool.ts";
import { BusyError } from "../jobs/busyError.ts";
import type { ResolvedImportOptions } from "../import/importOptions.ts";
import type { SourceFile } from "../import/parseProfileFile.ts";
import { raiseHint, type ServerLimits } from "../serverLimits.ts";
import { UserError } from "../userError.ts";
import type { ParseOutcome } from "./uploadWorker.ts";

const WORKER_URL = new URL("./uploadWorker.mjs", import.meta.url);

interface Pending {
  files: SourceFile[];
  meta?: SourceFile;
  options: ResolvedImportOptions;
  resolve: (r: ParseOutcome[]) => void;
  reject: (e: unknown) => void;
}

/**
 * Reads uploaded files off the request thread: one worker thread with a
 * memory cap, a time limit per upload and a bounded queue (429 when full), so
 * a hostile or huge file never stalls the other requests.
 */
export class UploadReader {
  private readonly pool: WorkerPool;
  private readonly queue: Pending[] = [];
  private busy = false;
  private closed = false;

  constructor(private readonly limits: ServerLimits) {
    this.pool = new WorkerPool(WORKER_URL, 1, { maxOldGenerationSizeMb: limits.parseMemoryMb, maxYoungGenerationSizeMb: 64 });
  }

  /** Parse each file (with the optional side file); per file, the parsed import or the reason it was refused. */
  read(files: SourceFile[], options: ResolvedImportOptions, meta?: SourceFile): Promise<ParseOutcome[]> {
    if (this.closed) return Promise.reject(new UserError("shutting-down", "The server is stopping; upload again once it is back.", { status: 503 }));
    if (this.queue.length >= this.limits.maxUploadQueue) {
      return Promise.reject(new BusyError(`${this.queue.length} uploads are already waiting to be read. Try again in a minute.`, 60));
    }
    return new Promise((resolve, reject) => {
      this.queue.push({ files, meta, options, resolve, reject });
      this.next();
    });
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const p of this.queue.splice(0)) p.reject(new UserError("shutting-down", "The server is stopping; upload again once it is back.", { status: 503 }));
    await this.pool.close();
  }

  private next(): void {
    if (this.busy || this.closed || this.queue.length === 0) return;
    const worker = this.pool.take();
    if (!worker) return;
    const job = this.queue.shift()!;
    this.busy = true;
    const done = (keep: boolean) => {
      clearTimeout(timer);
      if (keep) this.pool.give(worker);
      else void this.pool.discard(worker);
      this.busy = false;
      this.next();
    };
    const timer = setTimeout(() => {
      done(false);
      job.reject(
        new UserError(
          "upload-timed-out",
          `Reading the upload took longer than ${this.limits.parseTimeoutS} s and was stopped; nothing was imported. Split the file (${raiseHint("parseTimeoutS")}).`,
          { status: 413 },
        ),
      );
    }, this.limits.parseTimeoutS * 1000);
    worker.onMessage = (m) => {
      done(true);
      job.resolve(m as ParseOutcome[]);
    };
    worker.onDeath = (e) => {
      done(false);
      const oom = (e as { code?: string }).code === "ERR_WORKER_OUT_OF_MEMORY";
      job.reject(
        oom
          ? new UserError("upload-too-large", `Reading the upload needed more than the ${this.limits.parseMemoryMb} MB of memory allowed; nothing was imported. Split the file (${raiseHint("parseMemoryMb")}).`, { status: 413 })
          : e,
      );
    };
    // Hand the uploaded chunks over instead of copying them: a copy of a 50 MB file would stall this thread.
    const asChunks = (f: SourceFile) => ({ name: f.name, chunks: "chunks" in f ? (f as SourceFile & { chunks: Uint8Array[] }).chunks : [f.bytes] });
    const files = job.files.map(asChunks);
    const meta = job.meta ? asChunks(job.meta) : undefined;
    // Only buffers that hold exactly one chunk of ours are handed over (never a shared pool).
    const transferable = [...files, ...(meta ? [meta] : [])]
      .flatMap((f) => f.chunks)
      .filter((c) => c.buffer instanceof ArrayBuffer && c.byteOffset === 0 && c.byteLength === c.buffer.byteLength && c.byteLength > 0)
      .map((c) => c.buffer as ArrayBuffer);
    worker.worker.postMessage({ files, meta, options: job.options, limits: this.limits }, [...new Set(transferable)]);
  }
}
