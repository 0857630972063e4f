/**
 * Rows exactly as the schema (db/migrations/) holds them, one type per table, snake_case as
 * in SQL. Domain types (core/) are built from these by the modules that read them.
 */

export type VehicleRow = {
  id: number;
  name: string;
  name_key: string;
  kind: string;
  notes: string;
  created_at: string;
  deleting: 0 | 1;
  /** The vehicle's scenario as SI JSON (schema 4); null: none stored. */
  scenario_json: string | null;
  scenario_updated_at: string | null;
};

export type DamperUnitRow = {
  id: number;
  label: string;
  label_key: string;
  kind: string;
  serial: string;
  notes: string;
  created_at: string;
};

export type SetupRevisionRow = {
  id: number;
  vehicle_id: number;
  number: number;
  parent_id: number | null;
  name: string;
  event: string;
  track: string;
  driver: string;
  setup_date: string | null;
  fuel_load: number | null;
  anti_roll_bar_front: string;
  anti_roll_bar_rear: string;
  notes: string;
  summary: string;
  saved_at: string;
};

/** A setup_corner row without its generated columns (corner_mass, spring_rate), as inserted. */
export type SetupCornerRow = {
  revision_id: number;
  position: 'FL' | 'FR' | 'RL' | 'RR';
  analysis_json: string;
  damper_unit_id: number | null;
  clicks_bump: number | null;
  clicks_rebound: number | null;
  clicks_bump_high_speed: number | null;
  clicks_rebound_high_speed: number | null;
  spring_label: string;
  ride_height: number | null;
  tire_pressure_cold: number | null;
  camber: number | null;
  toe: number | null;
  toe_kind: 'angle' | 'length' | null;
  notes: string;
};

export type BenchRunRow = {
  id: number;
  damper_unit_id: number;
  run_date: string | null;
  clicks_bump: number | null;
  clicks_rebound: number | null;
  clicks_bump_high_speed: number | null;
  clicks_rebound_high_speed: number | null;
  stroke: number | null;
  test_frequency: number | null;
  temperature: number | null;
  source_kind: 'points' | 'trace';
  source_name: string;
  source_column: string;
  source_sha256: string;
  point_count: number;
  points: Buffer;
  points_sha256: string;
  trace_count: number | null;
  trace: Buffer | null;
  fit_json: string;
  notes: string;
  imported_at: string;
};

/** A bench_run row without its blobs, for listings. */
export type BenchRunSummaryRow = Omit<BenchRunRow, 'points' | 'trace'>;

export type StoreEventRow = { id: number; at: string; kind: string; detail: string };

/** A row of `app_setting` (schema 3): one setting or draft of the desktop app, its value JSON text. */
export type AppSettingRow = { key: string; value: string; updated_at: string };
