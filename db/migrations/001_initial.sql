-- Profiles as imported, with the provenance of every file.

CREATE TABLE imports (
  id            INTEGER PRIMARY KEY,
  file_name     TEXT    NOT NULL,
  sha256        TEXT    NOT NULL UNIQUE,          -- of the data file's bytes: the same bytes import once
  byte_size     INTEGER NOT NULL,
  format        TEXT    NOT NULL CHECK (format IN ('long', 'wide')),
  delimiter     TEXT    NOT NULL,
  decimal_mark  TEXT    NOT NULL,
  meta_file_name TEXT,
  meta_sha256   TEXT,
  settings_json TEXT    NOT NULL,                 -- the resolved import options
  warnings_json TEXT    NOT NULL DEFAULT '[]',
  imported_at   TEXT    NOT NULL
);

CREATE TABLE embryos (
  id            INTEGER PRIMARY KEY,
  label         TEXT    NOT NULL,
  genotype      TEXT    NOT NULL,
  stage         TEXT,
  age_s         REAL,
  length_um     REAL CHECK (length_um IS NULL OR length_um > 0),
  dosage        REAL CHECK (dosage IS NULL OR dosage > 0),
  session       TEXT,
  metadata_json TEXT    NOT NULL DEFAULT '{}',
  first_import_id INTEGER NOT NULL REFERENCES imports(id),
  UNIQUE (label)
);

CREATE TABLE profiles (
  id             INTEGER PRIMARY KEY,
  embryo_id      INTEGER NOT NULL REFERENCES embryos(id),
  import_id      INTEGER NOT NULL REFERENCES imports(id),
  channel        TEXT    NOT NULL,
  time_s         REAL,                            -- NULL: not part of a time course
  position_unit  TEXT    NOT NULL CHECK (position_unit IN ('um', 'px', 'fraction')),
  pixel_size_um  REAL,
  n_points       INTEGER NOT NULL CHECK (n_points >= 5),
  positions_raw  BLOB    NOT NULL,                -- Float64 little-endian, in position_unit
  positions_um   BLOB    NOT NULL,                -- Float64 little-endian, µm from the source end
  intensities    BLOB    NOT NULL,                -- Float64 little-endian, a.u.
  dropped_points INTEGER NOT NULL DEFAULT 0,      -- missing cells removed at import
  flipped        INTEGER NOT NULL DEFAULT 0 CHECK (flipped IN (0, 1))
);
CREATE UNIQUE INDEX profiles_identity ON profiles (embryo_id, channel, IFNULL(time_s, -1e300));
CREATE INDEX profiles_import ON profiles (import_id);

-- Fits of single profiles (one row per profile, model and option set).
CREATE TABLE fits (
  id             INTEGER PRIMARY KEY,
  profile_id     INTEGER NOT NULL REFERENCES profiles(id) ON DELETE CASCADE,
  model          TEXT    NOT NULL,
  options_hash   TEXT    NOT NULL,
  options_json   TEXT    NOT NULL,
  engine_version TEXT    NOT NULL,
  status         TEXT    NOT NULL,
  lambda_um      REAL,
  lambda_se_um   REAL,
  aicc           REAL,
  result_json    TEXT    NOT NULL,
  created_at     TEXT    NOT NULL,
  UNIQUE (profile_id, model, options_hash)
);

-- Group analyses (global fits, precision, comparisons, tracking, plans) with their inputs.
CREATE TABLE analyses (
  id             INTEGER PRIMARY KEY,
  kind           TEXT    NOT NULL,
  selection_json TEXT    NOT NULL,
  settings_hash  TEXT    NOT NULL,
  settings_json  TEXT    NOT NULL,
  engine_version TEXT    NOT NULL,
  result_json    TEXT    NOT NULL,
  created_at     TEXT    NOT NULL
);
CREATE INDEX analyses_kind ON analyses (kind, settings_hash);

CREATE TABLE analysis_inputs (
  analysis_id INTEGER NOT NULL REFERENCES analyses(id) ON DELETE CASCADE,
  profile_id  INTEGER NOT NULL,                   -- kept after a profile is deleted, for provenance
  PRIMARY KEY (analysis_id, profile_id)
);
