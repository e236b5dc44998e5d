import { randomUUID } from "node:crypto";
import { Worker } from "node:worker_threads";
import { UserError } from "../userError.ts";
import type { JobProgress, JobStatus, JobView, WorkerMessage } from "./jobTypes.ts";

const WORKER_URL = new URL("./jobWorker.mjs", import.meta.url);

interface Job {
  id: string;
  kind: string;
  status: JobStatus;
  progress: JobProgress;
  createdAt: Date;
  finishedAt: Date | null;
  result: unknown;
  error: { code: string; message: string } | null;
  input: unknown;
  finish: (output: unknown) => unknown;
  worker: Worker | null;
  listeners: Set<(job: JobView) => void>;
}

export interface JobRunnerOptions {
  /** Worker threads running at once; the machine has 2 cores, so 1 keeps one free for requests. */
  maxConcurrent?: number;
  /** Finished jobs kept for polling. */
  keepFinished?: number;
  log?: (message: string) => void;
}

/**
 * Runs long analyses off the request thread. Each job's pure computation runs
 * in a worker thread; its `finish` step (storing results) runs back on the main
 * thread, where the database connection lives. Jobs report progress, can be
 * cancelled, and stay readable for a while after they end.
 */
export class JobRunner {
  private readonly jobs = new Map<string, Job>();
  private readonly queue: Job[] = [];
  private running = 0;
  private readonly maxConcurrent: number;
  private readonly keepFinished: number;
  private readonly log: (m: string) => void;

  constructor(options: JobRunnerOptions = {}) {
    this.maxConcurrent = options.maxConcurrent ?? 1;
    this.keepFinished = options.keepFinished ?? 200;
    this.log = options.log ?? ((m) => process.stderr.write(m + "\n"));
  }

  /** Queue a computation; `finish` turns its output into the job's result (e.g. stores it). */
  submit(kind: string, input: unknown, finish: (output: unknown) => unknown): JobView {
    const job: Job = {
      id: randomUUID(),
      kind,
      status: "queued",
      progress: { fraction: 0, stage: "queued" },
      createdAt: new Date(),
      finishedAt: null,
      result: null,
      error: null,
      input,
      finish,
      worker: null,
      listeners: new Set(),
    };
    this.jobs.set(job.id, job);
    this.queue.push(job);
    this.pump();
    return view(job);
  }

  get(id: string): JobView {
    return view(this.find(id));
  }

  list(): JobView[] {
    return [...this.jobs.values()].map(view);
  }

  /** Stop a queued or running job. Finished jobs are left as they are. */
  cancel(id: string): JobView {
    const job = this.find(id);
    if (job.status === "queued") {
      this.queue.splice(this.queue.indexOf(job), 1);
      this.end(job, "cancelled");
    } else if (job.status === "running") {
      void job.worker?.terminate();
      this.end(job, "cancelled");
    }
    return view(job);
  }

  /** Call `listener` on every change of the job until it ends; returns an unsubscribe function. */
  subscribe(id: string, listener: (job: JobView) => void): () => void {
    const job = this.find(id);
    job.listeners.add(listener);
    return () => job.listeners.delete(listener);
  }

  /** Resolves when the job has ended (done, failed or cancelled). */
  async wait(id: string): Promise<JobView> {
    const job = this.find(id);
    if (isEnded(job.status)) return view(job);
    return new Promise((resolve) => {
      const off = this.subscribe(id, (v) => {
        if (isEnded(v.status)) {
          off();
          resolve(v);
        }
      });
    });
  }

  /** Terminate every worker (server shutdown, tests). */
  async close(): Promise<void> {
    for (const job of this.jobs.values()) if (job.status === "running" || job.status === "queued") this.cancel(job.id);
  }

  private find(id: string): Job {
    const job = this.jobs.get(id);
    if (!job) throw new UserError("unknown-job", `No job with id ${id}; finished jobs are kept only for a while.`, { status: 404 });
    return job;
  }

  private pump(): void {
    while (this.running < this.maxConcurrent && this.queue.length > 0) this.start(this.queue.shift()!);
  }

  private start(job: Job): void {
    this.running++;
    job.status = "running";
    job.progress = { fraction: 0, stage: "starting" };
    this.notify(job);
    const worker = new Worker(WORKER_URL);
    job.worker = worker;
    worker.on("message", (m: WorkerMessage) => {
      if (job.status !== "running") return;
      if (m.type === "progress") {
        job.progress = { fraction: Math.max(0, Math.min(1, m.fraction)), stage: m.stage };
        this.notify(job);
      } else if (m.type === "done") {
        try {
          job.result = job.finish(m.output);
          job.progress = { fraction: 1, stage: "done" };
          this.end(job, "done");
        } catch (e) {
          this.fail(job, e);
        }
        void worker.terminate();
      } else {
        if (m.userError) job.error = { code: m.userError.code, message: m.userError.message };
        else {
          this.log(`job ${job.id} (${job.kind}) failed: ${m.message}`);
          job.error = { code: "internal", message: "The analysis failed with an internal error. It has been logged; please report it." };
        }
        this.end(job, "failed");
        void worker.terminate();
      }
    });
    worker.on("error", (e) => {
      if (job.status === "running") this.fail(job, e);
    });
    worker.on("exit", () => {
      if (job.status === "running") this.fail(job, new Error("worker thread exited without an answer"));
    });
    worker.postMessage({ kind: job.kind, input: job.input });
  }

  private fail(job: Job, e: unknown): void {
    if (e instanceof UserError) job.error = { code: e.code, message: e.message };
    else {
      this.log(`job ${job.id} (${job.kind}) failed: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
      job.error = { code: "internal", message: "The analysis failed with an internal error. It has been logged; please report it." };
    }
    this.end(job, "failed");
  }

  private end(job: Job, status: JobStatus): void {
    const wasRunning = job.status === "running";
    job.status = status;
    job.finishedAt = new Date();
    job.worker = null;
    job.input = null;
    this.notify(job);
    job.listeners.clear();
    if (wasRunning) this.running--;
    this.trim();
    this.pump();
  }

  private notify(job: Job): void {
    const v = view(job);
    for (const l of job.listeners) l(v);
  }

  private trim(): void {
    const ended = [...this.jobs.values()].filter((j) => isEnded(j.status));
    for (const j of ended.slice(0, Math.max(0, ended.length - this.keepFinished))) this.jobs.delete(j.id);
  }
}

function isEnded(s: JobStatus): boolean {
  return s === "done" || s === "failed" || s === "cancelled";
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
