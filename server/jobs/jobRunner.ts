import { randomUUID } from "node:crypto";
import { UserError } from "../userError.ts";
import { BusyError } from "./busyError.ts";
import type { JobOrigin, JobProgress, JobStatus, JobStore, JobView, WorkerMessage } from "./jobTypes.ts";
import { WorkerPool, type PooledWorker } from "./workerPool.ts";

const WORKER_URL = new URL("./jobWorker.mjs", import.meta.url);

/** What an interrupted job says, after a restart or a stop of the server. */
export const INTERRUPTED_MESSAGE = "interrupted by a restart of the server before it finished; nothing was stored. Re-run it (POST /api/jobs/{id}/rerun, or the same request again).";

interface Job {
  id: string;
  kind: string;
  status: JobStatus;
  progress: JobProgress;
  createdAt: Date;
  startedAt: number | null;
  finishedAt: Date | null;
  result: unknown;
  error: { code: string; message: string } | null;
  input: unknown;
  finish: (output: unknown) => unknown;
  worker: PooledWorker | null;
  timer: NodeJS.Timeout | null;
  listeners: Set<(job: JobView) => void>;
}

export interface JobRunnerOptions {
  /** Worker threads running at once; the machine has 2 cores, so 1 keeps one free for requests. */
  maxConcurrent?: number;
  /** Jobs waiting for a worker; one more is refused with 429 and a retry hint. */
  maxQueued?: number;
  /** A running job is stopped after this long. */
  timeoutMs?: number;
  /** Finished jobs kept in memory for polling (the store keeps them longer). */
  keepFinished?: number;
  /** Durable job state (the database); jobs live only in memory without one. */
  store?: JobStore;
  log?: (message: string) => void;
  /** Clock for progress estimates; Date.now unless a test sets it. */
  now?: () => number;
}

/**
 * Runs long analyses off the request thread, on a fixed pool of worker
 * threads fed from a bounded queue. Each job's pure computation runs in a
 * worker; its `finish` step (storing results) runs back on the main thread,
 * where the database connection lives. Jobs report progress with an estimate
 * of the time left, can be cancelled, are stopped at a time limit, and, with a
 * store, keep their state in the database across restarts.
 */
export class JobRunner {
  private readonly jobs = new Map<string, Job>();
  private readonly queue: Job[] = [];
  private readonly pool: WorkerPool;
  private readonly maxQueued: number;
  private readonly timeoutMs: number;
  private readonly keepFinished: number;
  private readonly store: JobStore | null;
  private readonly log: (m: string) => void;
  private readonly now: () => number;
  private closed = false;

  constructor(options: JobRunnerOptions = {}) {
    this.pool = new WorkerPool(WORKER_URL, options.maxConcurrent ?? 1);
    this.maxQueued = options.maxQueued ?? 20;
    this.timeoutMs = options.timeoutMs ?? 30 * 60_000;
    this.keepFinished = options.keepFinished ?? 200;
    this.store = options.store ?? null;
    this.log = options.log ?? ((m) => process.stderr.write(m + "\n"));
    this.now = options.now ?? Date.now;
    // Jobs the store still shows as queued or running belonged to a process that has gone.
    const stale = this.store?.interruptUnfinished(INTERRUPTED_MESSAGE) ?? 0;
    if (stale > 0) this.log(`${stale} analysis job(s) were interrupted by the last stop of the server; they can be re-run.`);
  }

  /** Jobs waiting for a worker now. */
  get queued(): number {
    return this.queue.length;
  }

  /**
   * Queue a computation; `finish` turns its output into the job's result (e.g.
   * stores it). Refused with 429 when the queue is full or the runner is stopping.
   */
  submit(kind: string, input: unknown, finish: (output: unknown) => unknown, origin: JobOrigin = {}): JobView {
    if (this.closed) throw new UserError("shutting-down", "The server is stopping; start the analysis again once it is back.", { status: 503 });
    if (this.queue.length >= this.maxQueued) {
      const retryAfterS = Math.min(600, 30 * Math.ceil(this.queue.length / this.pool.size));
      throw new BusyError(
        `${this.queue.length} analyses are already waiting (the limit is ${this.maxQueued}). Try again in about ${retryAfterS} s, or cancel a waiting one.`,
        retryAfterS,
      );
    }
    const job: Job = {
      id: randomUUID(),
      kind,
      status: "queued",
      progress: { fraction: 0, stage: "queued" },
      createdAt: new Date(this.now()),
      startedAt: null,
      finishedAt: null,
      result: null,
      error: null,
      input,
      finish,
      worker: null,
      timer: null,
      listeners: new Set(),
    };
    this.jobs.set(job.id, job);
    this.queue.push(job);
    this.store?.insert(view(job), origin);
    this.pump();
    return view(job);
  }

  get(id: string): JobView {
    const job = this.jobs.get(id);
    if (job) return view(job);
    const stored = this.store?.get(id);
    if (stored) {
      const { request: _r, inputs: _i, ...rest } = stored;
      return rest;
    }
    throw unknownJob(id);
  }

  list(): JobView[] {
    const live = [...this.jobs.values()].map(view);
    if (!this.store) return live;
    const ids = new Set(live.map((j) => j.id));
    return [...this.store.list(this.keepFinished).filter((j) => !ids.has(j.id)).reverse(), ...live];
  }

  /** Stop a queued or running job. Finished jobs are left as they are. */
  cancel(id: string): JobView {
    const job = this.jobs.get(id);
    if (!job) return this.get(id);
    if (job.status === "queued") {
      this.queue.splice(this.queue.indexOf(job), 1);
      this.end(job, "cancelled");
    } else if (job.status === "running") {
      this.end(job, "cancelled");
    }
    return view(job);
  }

  /** Call `listener` on every change of the job until it ends; returns an unsubscribe function. */
  subscribe(id: string, listener: (job: JobView) => void): () => void {
    const job = this.jobs.get(id);
    if (!job) throw unknownJob(id);
    job.listeners.add(listener);
    return () => job.listeners.delete(listener);
  }

  /** Resolves when the job has ended (done, failed, cancelled or interrupted). */
  async wait(id: string): Promise<JobView> {
    const job = this.jobs.get(id);
    if (!job || isEnded(job.status)) return this.get(id);
    return new Promise((resolve) => {
      const off = this.subscribe(id, (v) => {
        if (isEnded(v.status)) {
          off();
          resolve(v);
        }
      });
    });
  }

  /**
   * Stop for good (server shutdown, tests): refuse new jobs, mark every queued
   * or running job as interrupted (it can be re-run after a restart), and stop
   * every worker thread.
   */
  async close(): Promise<void> {
    this.closed = true;
    const stops: Promise<unknown>[] = [];
    for (const job of [...this.queue]) this.end(job, "interrupted", { code: "interrupted", message: INTERRUPTED_MESSAGE });
    this.queue.length = 0;
    for (const job of this.jobs.values()) {
      if (job.status !== "running") continue;
      if (job.worker) stops.push(this.pool.discard(job.worker));
      job.worker = null;
      this.end(job, "interrupted", { code: "interrupted", message: INTERRUPTED_MESSAGE });
    }
    stops.push(this.pool.close());
    await Promise.all(stops);
  }

  private pump(): void {
    while (!this.closed && this.queue.length > 0) {
      const worker = this.pool.take();
      if (!worker) return;
      this.start(this.queue.shift()!, worker);
    }
  }

  private start(job: Job, worker: PooledWorker): void {
    job.status = "running";
    job.startedAt = this.now();
    job.progress = { fraction: 0, stage: "starting" };
    job.worker = worker;
    this.notify(job, true);
    job.timer = setTimeout(() => {
      if (job.status !== "running") return;
      this.end(job, "failed", {
        code: "timed-out",
        message: `The analysis was stopped after ${formatMinutes(this.timeoutMs)}, the time limit of one analysis; nothing was stored. Ask for fewer resamples or profiles, or raise the limit with MORPHOGAUGE_JOB_TIMEOUT_MIN when the server starts.`,
      });
    }, this.timeoutMs);
    job.timer.unref();
    worker.onDeath = (e) => {
      job.worker = null;
      if (job.status === "running") this.fail(job, e);
    };
    worker.onMessage = (raw) => {
      const m = raw as WorkerMessage;
      if (job.status !== "running") return;
      if (m.type === "progress") {
        job.progress = this.withEstimate(job, Math.max(0, Math.min(1, m.fraction)), m.stage);
        this.notify(job, false);
        return;
      }
      this.release(job);
      if (m.type === "done") {
        try {
          job.result = job.finish(m.output);
          job.progress = { fraction: 1, stage: "done" };
          this.end(job, "done");
        } catch (e) {
          this.fail(job, e);
        }
      } else if (m.userError) {
        this.end(job, "failed", { code: m.userError.code, message: m.userError.message });
      } else {
        this.log(`job ${job.id} (${job.kind}) failed: ${m.message}`);
        this.end(job, "failed", internalError());
      }
    };
    worker.worker.postMessage({ kind: job.kind, input: job.input });
  }

  /** The worker finished its task normally: it goes back to the pool. */
  private release(job: Job): void {
    if (job.worker) this.pool.give(job.worker);
    job.worker = null;
  }

  /** Time left from the pace so far; only once a few per cent are done, so the first guess is not wild. */
  private withEstimate(job: Job, fraction: number, stage: string): JobProgress {
    const elapsedS = (this.now() - (job.startedAt ?? this.now())) / 1000;
    if (fraction < 0.02 || fraction >= 1 || elapsedS <= 0) return { fraction, stage };
    return { fraction, stage, etaS: Math.round((elapsedS * (1 - fraction)) / fraction) };
  }

  private fail(job: Job, e: unknown): void {
    if (e instanceof UserError) {
      this.end(job, "failed", { code: e.code, message: e.message });
      return;
    }
    const message = e instanceof Error ? (e.stack ?? e.message) : String(e);
    if (e && typeof e === "object" && (e as { code?: string }).code === "ERR_WORKER_OUT_OF_MEMORY") {
      this.end(job, "failed", { code: "out-of-memory", message: "The analysis needed more memory than a worker may use; nothing was stored. Ask for fewer resamples, a coarser grid or fewer profiles." });
      return;
    }
    this.log(`job ${job.id} (${job.kind}) failed: ${message}`);
    this.end(job, "failed", internalError());
  }

  private end(job: Job, status: JobStatus, error: { code: string; message: string } | null = job.error): void {
    if (job.timer) clearTimeout(job.timer);
    job.timer = null;
    if (job.worker) {
      // A job that ends while its worker still computes (cancel, time-out): stop that thread.
      void this.pool.discard(job.worker);
      job.worker = null;
    }
    job.status = status;
    job.error = error;
    job.finishedAt = new Date(this.now());
    job.input = null;
    this.notify(job, true);
    job.listeners.clear();
    this.trim();
    this.pump();
  }

  private notify(job: Job, persist: boolean): void {
    const v = view(job);
    if (persist) {
      try {
        this.store?.update(v);
      } catch (e) {
        // The database may be closed or full; the in-memory state still answers.
        this.log(`could not record the state of job ${job.id}: ${(e as Error).message}`);
      }
    }
    for (const l of job.listeners) l(v);
  }

  private trim(): void {
    const ended = [...this.jobs.values()].filter((j) => isEnded(j.status));
    for (const j of ended.slice(0, Math.max(0, ended.length - this.keepFinished))) this.jobs.delete(j.id);
  }
}

function isEnded(s: JobStatus): boolean {
  return s !== "queued" && s !== "running";
}

function unknownJob(id: string): UserError {
  return new UserError("unknown-job", `No job with id ${id}.`, { status: 404 });
}

function internalError() {
  return { code: "internal", message: "The analysis failed with an internal error. It has been logged; please report it." };
}

function formatMinutes(ms: number): string {
  const min = ms / 60_000;
  return min >= 1 ? `${Number(min.toFixed(1))} min` : `${Math.round(ms / 1000)} s`;
}

function view(job: Job): JobView {
  return {
    id: job.id,
    kind: job.kind,
    status: job.status,
    progress: job.progress,
    createdAt: job.createdAt.toISOString(),
    finishedAt: job.finishedAt?.toISOString() ?? null,
    result: job.result,
    error: job.error,
  };
}
