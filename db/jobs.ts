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

/** Job state in the `jobs` table, so that it outlives the process. */
export function databaseJobStore(db: Db, keep = 1000): JobStore {
  const insert = db.prepare(
    `INSERT INTO jobs (id, kind, status, request_json, inputs_json, progress_json, error_json, result_json, created_at, finished_at)
     VALUES (@id, @kind, @status, @request, @inputs, @progress, @error, NULL, @createdAt, @finishedAt)`,
  );
  const update = db.prepare(
    "UPDATE jobs SET status = @status, progress_json = @progress, error_json = @error, result_json = @result, finished_at = @finishedAt WHERE id = @id",
  );
  const trim = db.prepare("DELETE FROM jobs WHERE status NOT IN ('queued', 'running') AND id NOT IN (SELECT id FROM jobs ORDER BY created_at DESC LIMIT ?)");
  return {
    insert(v: JobView, origin: JobOrigin) {
      insert.run({
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
      trim.run(keep);
    },
    update(v: JobView) {
      update.run({ id: v.id, status: v.status, progress: JSON.stringify(v.progress), error: v.error ? JSON.stringify(v.error) : null, result: resultJson(v), finishedAt: v.finishedAt });
    },
    get(id: string) {
      const r = db.prepare("SELECT * FROM jobs WHERE id = ?").get(id) as Record<string, unknown> | undefined;
      return r ? toView(r) : null;
    },
    list(limit: number) {
      return (db.prepare("SELECT * FROM jobs ORDER BY created_at DESC, rowid DESC LIMIT ?").all(limit) as Record<string, unknown>[]).map((r) => {
        const { request: _r, inputs: _i, ...rest } = toView({ ...r, result_json: null });
        return rest;
      });
    },
    interruptUnfinished(message: string) {
      return db
        .prepare("UPDATE jobs SET status = 'interrupted', error_json = ?, finished_at = COALESCE(finished_at, ?) WHERE status IN ('queued', 'running')")
        .run(JSON.stringify({ code: "interrupted", message }), new Date().toISOString()).changes;
    },
  };
}
