import { Worker, type ResourceLimits } from "node:worker_threads";

/** A worker thread of a pool, with the handlers of the task it runs now. */
export interface PooledWorker {
  worker: Worker;
  onMessage: ((m: unknown) => void) | null;
  /** Called when the thread dies (an error, an out-of-memory stop, or exit) while it had a task. */
  onDeath: ((e: Error) => void) | null;
}

/**
 * A fixed number of worker threads, started on demand and reused from task to
 * task. A thread that is stopped (cancel, time-out) or dies is replaced by a
 * new one the next time a slot is needed, so at most `size` threads ever run.
 */
export class WorkerPool {
  private readonly idle: PooledWorker[] = [];
  private alive = 0;
  private closed = false;

  constructor(
    private readonly url: URL,
    readonly size: number,
    private readonly resourceLimits?: ResourceLimits,
  ) {}

  /** An idle thread, a new one if a slot is free, or null when all are busy. */
  take(): PooledWorker | null {
    if (this.closed) return null;
    const w = this.idle.pop();
    if (w) return w;
    if (this.alive >= this.size) return null;
    this.alive++;
    const pooled: PooledWorker = { worker: new Worker(this.url, { resourceLimits: this.resourceLimits }), onMessage: null, onDeath: null };
    let dead = false;
    const die = (e: Error) => {
      if (dead) return;
      dead = true;
      this.alive--;
      const i = this.idle.indexOf(pooled);
      if (i >= 0) this.idle.splice(i, 1);
      const onDeath = pooled.onDeath;
      pooled.onDeath = pooled.onMessage = null;
      onDeath?.(e);
    };
    pooled.worker.on("message", (m) => pooled.onMessage?.(m));
    pooled.worker.on("error", (e) => die(e));
    pooled.worker.on("exit", (code) => die(new Error(`worker thread exited (code ${code})`)));
    return pooled;
  }

  /** Hand a thread back after its task ended normally. */
  give(w: PooledWorker): void {
    w.onMessage = w.onDeath = null;
    if (this.closed) void w.worker.terminate();
    else this.idle.push(w);
  }

  /** Stop a thread now (cancel, time-out); its slot is refilled on demand. */
  discard(w: PooledWorker): Promise<number> {
    w.onMessage = w.onDeath = null;
    return w.worker.terminate();
  }

  /** Stop every idle thread and refuse new ones; busy threads are stopped by their owner. */
  async close(): Promise<void> {
    this.closed = true;
    await Promise.all(this.idle.splice(0).map((w) => w.worker.terminate()));
  }
}
