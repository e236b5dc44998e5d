-- Named fit settings: a model with its window, weights, background and fixed
-- parameters (the resolved fit options). Every stored fit belongs to one, so a
-- group analysis can take one setting for all its groups and never mix them.
CREATE TABLE fit_settings (
  id            INTEGER PRIMARY KEY,
  name          TEXT    NOT NULL UNIQUE,
  options_hash  TEXT    NOT NULL UNIQUE,          -- of the resolved fit options (model included)
  model         TEXT    NOT NULL,
  options_json  TEXT    NOT NULL,
  created_at    TEXT    NOT NULL
);

-- NULL for fits stored before this migration: they are given their setting the
-- first time settings are read (the options hash needs the application).
ALTER TABLE fits ADD COLUMN setting_id INTEGER REFERENCES fit_settings(id);
CREATE INDEX fits_setting ON fits (setting_id, profile_id);

-- Exclusion history: each row excludes or re-includes an embryo (profile_id
-- NULL) or one of its profiles, with the reason. The newest row per embryo and
-- profile is the current state; nothing is ever deleted, so the history stays.
CREATE TABLE exclusion_events (
  id          INTEGER PRIMARY KEY,
  embryo_id   INTEGER NOT NULL REFERENCES embryos(id) ON DELETE CASCADE,
  profile_id  INTEGER REFERENCES profiles(id) ON DELETE CASCADE,
  action      TEXT    NOT NULL CHECK (action IN ('exclude', 'include')),
  reason      TEXT    NOT NULL,
  at          TEXT    NOT NULL
);
CREATE INDEX exclusion_events_embryo ON exclusion_events (embryo_id, profile_id, id);
