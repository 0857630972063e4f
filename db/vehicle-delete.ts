import { InputError } from '../core/units/input-error';
import { storeBackup } from './backup';
import { setupCornerDeleteOfVehicle } from './queries/setup-corner';
import { setupRevisionDeleteOfVehicle, setupRevisionList } from './queries/setup-revision';
import { storeEventInsert } from './queries/store-event';
import { vehicleDelete, vehicleMarkDeleting } from './queries/vehicle';
import type { VehicleRow } from './rows';
import { storeBackupFileName, storeTransaction, type Store } from './store';

export type VehicleDeleteResult = { vehicle: string; revisionsDeleted: number; backupPath: string };

/**
 * Deletes a vehicle and all its revisions — after a full backup of the database to the
 * backup folder, so the deletion can be undone from it. Damper units and bench runs stay in
 * the library. If the vehicle gains a revision between the backup and the deletion (the
 * other program saving), nothing is deleted.
 * @throws InputError when no backup can be made (nothing is deleted then).
 */
export async function vehicleDeleteWithBackup(
  store: Store,
  vehicle: VehicleRow,
  now = new Date(),
): Promise<VehicleDeleteResult> {
  const before = setupRevisionList(store.db, vehicle.id);
  const backup = await storeBackup(
    store,
    storeBackupFileName(store, `before-deleting-${vehicle.name}`, now),
    { now },
  );
  return storeTransaction(store, () => {
    const current = setupRevisionList(store.db, vehicle.id);
    if (current.length !== before.length || current.at(-1)?.id !== before.at(-1)?.id)
      throw new InputError(
        'vehicle',
        `"${vehicle.name}" gained a revision while the backup was made; nothing was deleted — try again`,
      );
    vehicleMarkDeleting(store.db, vehicle.id);
    setupCornerDeleteOfVehicle(store.db, vehicle.id);
    const revisionsDeleted = setupRevisionDeleteOfVehicle(store.db, vehicle.id);
    vehicleDelete(store.db, vehicle.id);
    storeEventInsert(store.db, {
      at: now.toISOString(),
      kind: 'vehicle-deleted',
      detail: `vehicle "${vehicle.name}" with ${revisionsDeleted} revisions; backup at ${backup.path}`,
    });
    return { vehicle: vehicle.name, revisionsDeleted, backupPath: backup.path };
  });
}
