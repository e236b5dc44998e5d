-- Data sets kept apart, and imports that can be undone exactly.

-- What this file holds: the invented demo or the lab's own data. No row: the lab's own data
-- (every database written before this migration).
CREATE TABLE dataset (
  id   INTEGER PRIMARY KEY CHECK (id = 1),
  kind TEXT    NOT NULL CHECK (kind IN ('demo', 'user'))
);

-- The same bytes may be imported again with other options (another channel, a label prefix,
-- a corrected side file): an import is identified by its bytes, side file and options together,
-- which the import service compares, so the file hash is no longer unique on its own.
CREATE TABLE imports_v3 (
  id            INTEGER PRIMARY KEY,
  file_name     TEXT    NOT NULL,
  sha256        TEXT    NOT NULL,                 -- of the data file's bytes
  byte_size     INTEGER NOT NULL,
  format        TEXT    NOT NULL CHECK (format IN ('long', 'wide')),
  delimiter     TEXT    NOT NULL,
  decimal_mark  TEXT    NOT NULL,
  meta_file_name TEXT,
  meta_sha256   TEXT,
  settings_json TEXT    NOT NULL,                 -- the resolved import options and the conflict choice
  warnings_json TEXT    NOT NULL DEFAULT '[]',
  imported_at   TEXT    NOT NULL
);
INSERT INTO imports_v3 (id, file_name, sha256, byte_size, format, delimiter, decimal_mark, meta_file_name, meta_sha256, settings_json, warnings_json, imported_at)
  SELECT id, file_name, sha256, byte_size, format, delimiter, decimal_mark, meta_file_name, meta_sha256, settings_json, warnings_json, imported_at FROM imports;
DROP TABLE imports;
ALTER TABLE imports_v3 RENAME TO imports;
CREATE INDEX imports_sha256 ON imports (sha256);

-- Every value an import changed on an embryo that was already stored (a genotype filled in,
-- a length replaced by the file's), so that deleting the import puts back exactly the old value.
CREATE TABLE import_changes (
  id        INTEGER PRIMARY KEY AUTOINCREMENT,
  import_id INTEGER NOT NULL REFERENCES imports(id) ON DELETE CASCADE,
  embryo_id INTEGER NOT NULL REFERENCES embryos(id) ON DELETE CASCADE,
  field     TEXT    NOT NULL,                     -- genotype, stage, age_s, length_um, dosage, session or meta:<key>
  old_json  TEXT    NOT NULL,                     -- JSON value before the import (null: empty)
  new_json  TEXT    NOT NULL,
  kind      TEXT    NOT NULL CHECK (kind IN ('filled', 'replaced'))
);
CREATE INDEX import_changes_import ON import_changes (import_id);
CREATE INDEX import_changes_embryo ON import_changes (embryo_id, field);
