-- Ids are never reused, and background jobs survive a restart as records.
--
-- Before this migration a deleted row's id could be handed to the next row
-- (INTEGER PRIMARY KEY takes max(id) + 1), so a job queued for profile 7 could
-- store its result on a different embryo that later received id 7. Every table
-- with an integer id is rebuilt with AUTOINCREMENT by db/rebuildWithAutoincrement.ts,
-- which db/migrate.ts runs before this file; it copies every row, keeps any
-- column and index other migrations added, and checks every foreign key.

-- One row per background job: what was asked, on which inputs, and how it ended.
CREATE TABLE jobs (
  id            TEXT    PRIMARY KEY,              -- UUID, as the API shows it
  kind          TEXT    NOT NULL,
  status        TEXT    NOT NULL CHECK (status IN ('queued', 'running', 'done', 'failed', 'cancelled', 'interrupted')),
  request_json  TEXT,                             -- the API request that started it, for a re-run: {"path", "body"}
  inputs_json   TEXT    NOT NULL DEFAULT '[]',    -- [{profileId, hash}] the job was computed from
  progress_json TEXT    NOT NULL DEFAULT '{}',
  error_json    TEXT,
  result_json   TEXT,
  created_at    TEXT    NOT NULL,
  finished_at   TEXT
);
CREATE INDEX jobs_created ON jobs (created_at);
