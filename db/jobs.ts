import type { JobOrigin, JobStore, JobView, StoredJob } from "../server/jobs/jobTypes.ts";
import type { Db } from "./connection.ts";

/** Results larger than this are not copied into the job row (the analysis itself is stored in full). */
const MAX_RESULT_CHARS = 2_000_000;

function toView(r: Record<string, unknown>): StoredJob {
  const result = r.result_json === null ? null : JSON.parse(r.result_json as string);
  return {
    id: r.id as string,
    kind: r.kind as string,
    status: r.status as JobView["status"],
    progress: JSON.parse(r.progress_json as string),
    createdAt: r.created_at as string,
    finishedAt: (r.finished_at as string | null) ?? null,
    result,
    error: r.error_json === null ? null : JSON.parse(r.error_json as string),
    request: r.request_json === null ? null : JSON.parse(r.request_json as string),
    inputs: JSON.parse(r.inputs_json as string),
  };
}

function resultJson(v: JobView): string | null {
  if (v.result === null || v.result === undefined) return null;
  const text = JSON.stringify(v.result);
  return text.length <= MAX_RESULT_CHARS ? text : JSON.stringify({ note: "The result was too large to keep with the job; it is stored with the analysis (GET /api/analyses, /api/fits)." });
}

/**
 * Job state in the `jobs` table, so that it outlives the process. `currentDb`
 * gives the open data set's database: a job's row lives in the database it was
 * started on (and is updated there even after the page switched to another),
 * and reads look in the open one. The first time a database is seen, its jobs
 * still marked queued or running (left by a process that has gone) are marked
 * interrupted.
 */
export function databaseJobStore(currentDb: () => Db, keep = 1000): JobStore {
  const home = new Map<string, Db>();
  const swept = new WeakSet<Db>();
  let sweepMessage: string | null = null;
  const sweep = (db: Db) => {
    if (swept.has(db)) return;
    swept.add(db);
    if (sweepMessage !== null) interrupt(db, sweepMessage);
  };
  const interrupt = (db: Db, message: string) =>
    db
      .prepare("UPDATE jobs SET status = 'interrupted', error_json = ?, finished_at = COALESCE(finished_at, ?) WHERE status IN ('queued', 'running')")
      .run(JSON.stringify({ code: "interrupted", message }), new Date().toISOString()).changes;
  const open = () => {
    const db = currentDb();
    sweep(db);
    return db;
  };
  return {
    insert(v: JobView, origin: JobOrigin) {
      const db = open();
      home.set(v.id, db);
      db.prepare(
        `INSERT INTO jobs (id, kind, status, request_json, inputs_json, progress_json, error_json, result_json, created_at, finished_at)
         VALUES (@id, @kind, @status, @request, @inputs, @progress, @error, NULL, @createdAt, @finishedAt)`,
      ).run({
        id: v.id,
        kind: v.kind,
        status: v.status,
        request: origin.request ? JSON.stringify(origin.request) : null,
        inputs: JSON.stringify(origin.inputs ?? []),
        progress: JSON.stringify(v.progress),
        error: v.error ? JSON.stringify(v.error) : null,
        createdAt: v.createdAt,
        finishedAt: v.finishedAt,
      });
      db.prepare("DELETE FROM jobs WHERE status NOT IN ('queued', 'running') AND id NOT IN (SELECT id FROM jobs ORDER BY created_at DESC LIMIT ?)").run(keep);
    },
    update(v: JobView) {
      const db = home.get(v.id) ?? open();
      if (!db.open) return;
      db.prepare("UPDATE jobs SET status = @status, progress_json = @progress, error_json = @error, result_json = @result, finished_at = @finishedAt WHERE id = @id").run({
        id: v.id,
        status: v.status,
        progress: JSON.stringify(v.progress),
        error: v.error ? JSON.stringify(v.error) : null,
        result: resultJson(v),
        finishedAt: v.finishedAt,
      });
      if (v.status !== "queued" && v.status !== "running") home.delete(v.id);
    },
    get(id: string) {
      const r = (home.get(id) ?? open()).prepare("SELECT * FROM jobs WHERE id = ?").get(id) as Record<string, unknown> | undefined;
      return r ? toView(r) : null;
    },
    list(limit: number) {
      return (open().prepare("SELECT * FROM jobs ORDER BY created_at DESC, rowid DESC LIMIT ?").all(limit) as Record<string, unknown>[]).map((r) => {
        const { request: _r, inputs: _i, ...rest } = toView({ ...r, result_json: null });
        return rest;
      });
    },
    interruptUnfinished(message: string) {
      sweepMessage = message;
      const db = currentDb();
      swept.add(db);
      return interrupt(db, message);
    },
  };
}

/** The kind and the API request a stored job was started from (null: no such job). */
export function storedJobRequest(db: Db, id: string): { kind: string; request: { path: string; body: unknown } | null } | null {
  const r = db.prepare("SELECT kind, request_json FROM jobs WHERE id = ?").get(id) as { kind: string; request_json: string | null } | undefined;
  return r ? { kind: r.kind, request: r.request_json ? JSON.parse(r.request_json) : null } : null;
}
