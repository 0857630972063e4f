import type { BenchFit } from '../../core/damper/bench-fit';
import type { DamperUnitListRow } from '../../db/queries/damper-unit';
import type { SetupRevisionListRow } from '../../db/queries/setup-revision';
import type { VehicleListRow } from '../../db/queries/vehicle';
import type { BenchRunSummaryRow, DamperUnitRow, SetupRevisionRow } from '../../db/rows';
import { clickSettingsOfColumns } from '../../db/setup-rows';
import type { HandlerOutput } from './contract';

/** How the API shows the database's rows: camelCase, JSON only, the fields the contract names. */

type VehicleView = HandlerOutput<'vehicleList'>['vehicles'][number];
type RevisionView = HandlerOutput<'setupHistory'>['revisions'][number];
type DamperView = HandlerOutput<'benchList'>['dampers'][number];
type BenchRunView = HandlerOutput<'benchList'>['runs'][number];

export function vehicleViewOf(v: VehicleListRow): VehicleView {
  return {
    id: v.id,
    name: v.name,
    kind: v.kind,
    notes: v.notes,
    createdAt: v.created_at,
    revisionCount: v.revision_count,
    lastSavedAt: v.last_saved_at,
  };
}

export function revisionViewOf(r: SetupRevisionRow, parentNumber: number | null): RevisionView {
  return {
    number: r.number,
    parent: parentNumber,
    name: r.name,
    event: r.event,
    track: r.track,
    driver: r.driver,
    date: r.setup_date,
    savedAt: r.saved_at,
    summary: r.summary,
  };
}

export function revisionListViewOf(r: SetupRevisionListRow): RevisionView {
  return revisionViewOf(r, r.parent_number);
}

export function damperViewOf(d: DamperUnitRow | DamperUnitListRow): DamperView {
  return {
    id: d.id,
    label: d.label,
    kind: d.kind,
    serial: d.serial,
    notes: d.notes,
    createdAt: d.created_at,
    runCount: 'run_count' in d ? d.run_count : 0,
    lastRunDate: 'last_run_date' in d ? d.last_run_date : null,
  };
}

export function benchRunViewOf(r: BenchRunSummaryRow, damperLabel: string): BenchRunView {
  return {
    id: r.id,
    damper: damperLabel,
    date: r.run_date,
    clicks: clickSettingsOfColumns(r),
    stroke: r.stroke,
    testFrequency: r.test_frequency,
    temperature: r.temperature,
    source: r.source_kind,
    sourceName: r.source_name,
    sourceColumn: r.source_column,
    pointCount: r.point_count,
    traceSamples: r.trace_count,
    fit: JSON.parse(r.fit_json) as BenchFit,
    notes: r.notes,
    importedAt: r.imported_at,
  };
}
