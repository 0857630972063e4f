-- RideLedger schema 4: each vehicle's scenario — the random road, the bump and the curb its
-- figures are taken on — as SI JSON, and when it was last set. A vehicle without one (every
-- vehicle stored before this step) is judged on the program's starting scenario.

ALTER TABLE vehicle ADD COLUMN scenario_json TEXT CHECK (scenario_json IS NULL OR json_valid(scenario_json));
ALTER TABLE vehicle ADD COLUMN scenario_updated_at TEXT;
