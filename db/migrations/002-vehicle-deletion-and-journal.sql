-- RideLedger schema 2: a vehicle may be deleted (after a backup), taking its revisions with
-- it and nothing else; a journal records deletions, imports and backups.

ALTER TABLE vehicle ADD COLUMN deleting INTEGER NOT NULL DEFAULT 0 CHECK (deleting IN (0, 1));

DROP TRIGGER setup_revision_kept;
DROP TRIGGER setup_corner_kept;

-- Revisions go only with their vehicle: the deletion first marks the vehicle.
CREATE TRIGGER setup_revision_kept BEFORE DELETE ON setup_revision
WHEN (SELECT deleting FROM vehicle WHERE id = OLD.vehicle_id) IS NOT 1
BEGIN
  SELECT RAISE(ABORT, 'setup revisions are deleted only with their vehicle');
END;

CREATE TRIGGER setup_corner_kept BEFORE DELETE ON setup_corner
WHEN (SELECT v.deleting FROM setup_revision r JOIN vehicle v ON v.id = r.vehicle_id
      WHERE r.id = OLD.revision_id) IS NOT 1
BEGIN
  SELECT RAISE(ABORT, 'setup revisions are deleted only with their vehicle');
END;

-- The mark may only be set, and only by a deletion that then removes the row.
CREATE TRIGGER vehicle_deleting_final BEFORE UPDATE OF deleting ON vehicle
WHEN OLD.deleting = 1 AND NEW.deleting = 0
BEGIN
  SELECT RAISE(ABORT, 'a vehicle being deleted cannot be restored; restore from the backup');
END;

CREATE TABLE store_event (
  id INTEGER PRIMARY KEY,
  at TEXT NOT NULL,
  kind TEXT NOT NULL,
  -- One line for people: what was done, to what, and where a backup went.
  detail TEXT NOT NULL
) STRICT;
