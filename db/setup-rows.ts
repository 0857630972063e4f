import type { ClickSettings } from '../core/damper/click-settings';
import { canonicalJson } from '../core/setup/canonical-json';
import type { CornerInput } from '../core/corner/corner';
import {
  CORNER_POSITIONS,
  type CornerPosition,
  type SetupCorner,
  type SetupSheet,
} from '../core/setup/setup-sheet';
import type { SetupCornerReadRow } from './queries/setup-corner';
import type { SetupRevisionInsert } from './queries/setup-revision';
import type { SetupCornerRow, SetupRevisionRow } from './rows';

/** Clicker columns of setup_corner and bench_run, by adjuster. */
export type ClickColumns = Pick<
  SetupCornerRow,
  'clicks_bump' | 'clicks_rebound' | 'clicks_bump_high_speed' | 'clicks_rebound_high_speed'
>;

export function clickColumnsOf(c: ClickSettings): ClickColumns {
  return {
    clicks_bump: c.bump ?? null,
    clicks_rebound: c.rebound ?? null,
    clicks_bump_high_speed: c.bumpHighSpeed ?? null,
    clicks_rebound_high_speed: c.reboundHighSpeed ?? null,
  };
}

export function clickSettingsOfColumns(r: ClickColumns): ClickSettings {
  const c: ClickSettings = {};
  if (r.clicks_bump !== null) c.bump = r.clicks_bump;
  if (r.clicks_rebound !== null) c.rebound = r.clicks_rebound;
  if (r.clicks_bump_high_speed !== null) c.bumpHighSpeed = r.clicks_bump_high_speed;
  if (r.clicks_rebound_high_speed !== null) c.reboundHighSpeed = r.clicks_rebound_high_speed;
  return c;
}

/** The setup_corner row of one corner of a sheet. */
export function setupCornerRowOf(
  revisionId: number,
  position: CornerPosition,
  c: SetupCorner,
  damperUnitId: number | null,
): SetupCornerRow {
  return {
    revision_id: revisionId,
    position,
    analysis_json: canonicalJson(c.analysis),
    damper_unit_id: damperUnitId,
    ...clickColumnsOf(c.clicks),
    spring_label: c.springLabel,
    ride_height: c.rideHeight ?? null,
    tire_pressure_cold: c.tirePressureCold ?? null,
    camber: c.camber ?? null,
    toe: c.toe?.value ?? null,
    toe_kind: c.toe?.kind ?? null,
    notes: c.notes,
  };
}

/** The setup_revision columns a sheet fills. */
export function setupRevisionColumnsOf(
  s: SetupSheet,
): Omit<SetupRevisionInsert, 'vehicle_id' | 'number' | 'parent_id' | 'summary' | 'saved_at'> {
  return {
    name: s.name,
    event: s.event,
    track: s.track,
    driver: s.driver,
    setup_date: s.date ?? null,
    fuel_load: s.fuelLoad ?? null,
    anti_roll_bar_front: s.antiRollBar.front,
    anti_roll_bar_rear: s.antiRollBar.rear,
    notes: s.notes,
  };
}

function setupCornerOf(r: SetupCornerReadRow): SetupCorner {
  const c: SetupCorner = {
    // Written by setupCornerRowOf from a validated CornerInput; fields added later ride along.
    analysis: JSON.parse(r.analysis_json) as CornerInput,
    damperUnit: r.damper_label ?? '',
    clicks: clickSettingsOfColumns(r),
    springLabel: r.spring_label,
    notes: r.notes,
  };
  if (r.ride_height !== null) c.rideHeight = r.ride_height;
  if (r.tire_pressure_cold !== null) c.tirePressureCold = r.tire_pressure_cold;
  if (r.camber !== null) c.camber = r.camber;
  if (r.toe !== null && r.toe_kind !== null) c.toe = { kind: r.toe_kind, value: r.toe };
  return c;
}

/** The sheet a revision row and its four corner rows hold. */
export function setupSheetOf(r: SetupRevisionRow, corners: readonly SetupCornerReadRow[]): SetupSheet {
  const byPosition = new Map(corners.map((c) => [c.position, c]));
  const sheet: SetupSheet = {
    name: r.name,
    event: r.event,
    track: r.track,
    driver: r.driver,
    antiRollBar: { front: r.anti_roll_bar_front, rear: r.anti_roll_bar_rear },
    notes: r.notes,
    corners: {} as SetupSheet['corners'],
  };
  if (r.setup_date !== null) sheet.date = r.setup_date;
  if (r.fuel_load !== null) sheet.fuelLoad = r.fuel_load;
  for (const p of CORNER_POSITIONS) {
    const row = byPosition.get(p);
    if (!row) throw new Error(`revision ${r.id} has no ${p} corner: the database is damaged (run check)`);
    sheet.corners[p] = setupCornerOf(row);
  }
  return sheet;
}
