-- RideLedger schema 1: vehicles, their setup revisions corner by corner, and the damper bench
-- library. All quantities SI. Revisions and bench runs are written once and never changed.

CREATE TABLE vehicle (
  id INTEGER PRIMARY KEY,
  name TEXT NOT NULL CHECK (length(name) BETWEEN 1 AND 120),
  -- NFC, case-folded, spaces collapsed: two vehicles may not share it.
  name_key TEXT NOT NULL UNIQUE,
  kind TEXT NOT NULL DEFAULT '',
  notes TEXT NOT NULL DEFAULT '',
  created_at TEXT NOT NULL
) STRICT;

CREATE TABLE damper_unit (
  id INTEGER PRIMARY KEY,
  label TEXT NOT NULL CHECK (length(label) BETWEEN 1 AND 120),
  label_key TEXT NOT NULL UNIQUE,
  kind TEXT NOT NULL DEFAULT '',
  serial TEXT NOT NULL DEFAULT '',
  notes TEXT NOT NULL DEFAULT '',
  created_at TEXT NOT NULL
) STRICT;

CREATE TABLE setup_revision (
  id INTEGER PRIMARY KEY,
  vehicle_id INTEGER NOT NULL REFERENCES vehicle (id),
  -- 1, 2, 3 … per vehicle, in the order saved.
  number INTEGER NOT NULL CHECK (number >= 1),
  parent_id INTEGER REFERENCES setup_revision (id),
  name TEXT NOT NULL,
  event TEXT NOT NULL DEFAULT '',
  track TEXT NOT NULL DEFAULT '',
  driver TEXT NOT NULL DEFAULT '',
  setup_date TEXT CHECK (setup_date IS NULL OR setup_date GLOB '[0-9][0-9][0-9][0-9]-[0-9][0-9]-[0-9][0-9]'),
  fuel_load REAL,
  anti_roll_bar_front TEXT NOT NULL DEFAULT '',
  anti_roll_bar_rear TEXT NOT NULL DEFAULT '',
  notes TEXT NOT NULL DEFAULT '',
  -- One line of what changed from the parent, written when saved.
  summary TEXT NOT NULL,
  saved_at TEXT NOT NULL,
  UNIQUE (vehicle_id, number)
) STRICT;

CREATE INDEX setup_revision_parent ON setup_revision (parent_id);

CREATE TABLE setup_corner (
  revision_id INTEGER NOT NULL REFERENCES setup_revision (id),
  position TEXT NOT NULL CHECK (position IN ('FL', 'FR', 'RL', 'RR')),
  -- The corner's analysis input (CornerInput) as canonical SI JSON: carries fields added later.
  analysis_json TEXT NOT NULL CHECK (json_valid(analysis_json)),
  corner_mass REAL GENERATED ALWAYS AS (json_extract(analysis_json, '$.cornerMass')) VIRTUAL,
  spring_rate REAL GENERATED ALWAYS AS (json_extract(analysis_json, '$.springRate')) VIRTUAL,
  damper_unit_id INTEGER REFERENCES damper_unit (id),
  clicks_bump INTEGER CHECK (clicks_bump >= 0),
  clicks_rebound INTEGER CHECK (clicks_rebound >= 0),
  clicks_bump_high_speed INTEGER CHECK (clicks_bump_high_speed >= 0),
  clicks_rebound_high_speed INTEGER CHECK (clicks_rebound_high_speed >= 0),
  spring_label TEXT NOT NULL DEFAULT '',
  ride_height REAL,
  tire_pressure_cold REAL,
  camber REAL,
  toe REAL,
  toe_kind TEXT CHECK (toe_kind IN ('angle', 'length')),
  notes TEXT NOT NULL DEFAULT '',
  PRIMARY KEY (revision_id, position),
  CHECK ((toe IS NULL) = (toe_kind IS NULL))
) STRICT;

CREATE INDEX setup_corner_damper ON setup_corner (damper_unit_id);

CREATE TABLE bench_run (
  id INTEGER PRIMARY KEY,
  damper_unit_id INTEGER NOT NULL REFERENCES damper_unit (id),
  run_date TEXT,
  clicks_bump INTEGER CHECK (clicks_bump >= 0),
  clicks_rebound INTEGER CHECK (clicks_rebound >= 0),
  clicks_bump_high_speed INTEGER CHECK (clicks_bump_high_speed >= 0),
  clicks_rebound_high_speed INTEGER CHECK (clicks_rebound_high_speed >= 0),
  stroke REAL,
  test_frequency REAL,
  temperature REAL,
  source_kind TEXT NOT NULL CHECK (source_kind IN ('points', 'trace')),
  source_name TEXT NOT NULL DEFAULT '',
  -- The clicker setting of the file's column pair this run came from ('' for a one-run file).
  source_column TEXT NOT NULL DEFAULT '',
  source_sha256 TEXT NOT NULL,
  -- Signed points, compression positive: float64 little-endian pairs (velocity m/s, force N).
  point_count INTEGER NOT NULL CHECK (point_count >= 0),
  points BLOB NOT NULL CHECK (length(points) = 16 * point_count),
  points_sha256 TEXT NOT NULL,
  -- The raw trace of a trace import: float64 little-endian triples (time s, displacement m, force N).
  trace_count INTEGER CHECK (trace_count >= 0),
  trace BLOB CHECK (trace IS NULL OR length(trace) = 24 * trace_count),
  fit_json TEXT NOT NULL CHECK (json_valid(fit_json)),
  notes TEXT NOT NULL DEFAULT '',
  imported_at TEXT NOT NULL,
  CHECK ((trace IS NULL) = (trace_count IS NULL))
) STRICT;

CREATE INDEX bench_run_damper ON bench_run (damper_unit_id);
CREATE INDEX bench_run_source ON bench_run (source_sha256);

-- A parent is an earlier revision of the same vehicle.
CREATE TRIGGER setup_revision_parent_check BEFORE INSERT ON setup_revision
WHEN NEW.parent_id IS NOT NULL AND NOT EXISTS (
  SELECT 1 FROM setup_revision p
  WHERE p.id = NEW.parent_id AND p.vehicle_id = NEW.vehicle_id AND p.number < NEW.number)
BEGIN
  SELECT RAISE(ABORT, 'a revision''s parent must be an earlier revision of the same vehicle');
END;

CREATE TRIGGER setup_revision_immutable BEFORE UPDATE ON setup_revision
BEGIN
  SELECT RAISE(ABORT, 'setup revisions are never changed: save a new revision');
END;

CREATE TRIGGER setup_corner_immutable BEFORE UPDATE ON setup_corner
BEGIN
  SELECT RAISE(ABORT, 'setup revisions are never changed: save a new revision');
END;

CREATE TRIGGER setup_revision_kept BEFORE DELETE ON setup_revision
BEGIN
  SELECT RAISE(ABORT, 'setup revisions are never deleted');
END;

CREATE TRIGGER setup_corner_kept BEFORE DELETE ON setup_corner
BEGIN
  SELECT RAISE(ABORT, 'setup revisions are never deleted');
END;

CREATE TRIGGER bench_run_immutable BEFORE UPDATE ON bench_run
BEGIN
  SELECT RAISE(ABORT, 'bench runs are never changed: import a new run');
END;
