-- RideLedger schema 3: the desktop app's own settings (the caution notice acknowledged, the
-- unit system) and its unsaved setup drafts, kept with the shop's data so that they survive
-- a restart; the page's own storage is tied to an address that changes every start.

CREATE TABLE app_setting (
  key TEXT PRIMARY KEY CHECK (length(key) BETWEEN 1 AND 200),
  value TEXT NOT NULL CHECK (json_valid(value)),
  updated_at TEXT NOT NULL
) STRICT;
