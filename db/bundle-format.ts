/** The bundle file: one vehicle with its revisions, and the damper units and bench runs they name. */
import type { ClickSettings } from '../core/damper/click-settings';
import { type CornerPosition } from '../core/setup/setup-sheet';
import { type RideScenario } from '../core/valving/ride-scenario';

/** The `format` tag of an exchange bundle. */
export const BUNDLE_FORMAT = 'rideledger-bundle' as const;
/** The bundle version this program writes and the newest it reads. */
export const BUNDLE_VERSION = 1 as const;

export type BundleCorner = {
  /** The corner input, SI, exactly as stored. */
  analysis: Record<string, unknown>;
  damperUnit: string | null;
  clicks: ClickSettings;
  springLabel: string;
  rideHeight: number | null;
  tirePressureCold: number | null;
  camber: number | null;
  toe: { kind: 'angle' | 'length'; value: number } | null;
  notes: string;
};

export type BundleRevision = {
  number: number;
  parent: number | null;
  name: string;
  event: string;
  track: string;
  driver: string;
  date: string | null;
  fuelLoad: number | null;
  antiRollBar: { front: string; rear: string };
  notes: string;
  /** What changed from the parent, as stored; an import recomputes it from the sheets. */
  summary: string;
  savedAt: string;
  corners: Record<CornerPosition, BundleCorner>;
};

export type BundleBenchRun = {
  date: string | null;
  clicks: ClickSettings;
  stroke: number | null;
  testFrequency: number | null;
  temperature: number | null;
  sourceKind: 'points' | 'trace';
  sourceName: string;
  sourceColumn: string;
  sourceSha256: string;
  pointCount: number;
  /** Base64 of the stored float64 pairs. */
  points: string;
  pointsSha256: string;
  traceCount: number | null;
  trace: string | null;
  /** The fitted curve as stored; an import refits the points and keeps only its own fit. */
  fit: unknown;
  notes: string;
  importedAt: string;
};

export type BundleDamper = {
  label: string;
  kind: string;
  serial: string;
  notes: string;
  createdAt: string;
  runs: BundleBenchRun[];
};

/**
 * A self-contained copy of one vehicle: the vehicle, all its revisions, the damper units
 * they fit and those units' bench runs. SI and exact: numbers as stored, blobs in base64.
 */
export type Bundle = {
  format: typeof BUNDLE_FORMAT;
  version: typeof BUNDLE_VERSION;
  vehicle: { name: string; kind: string; notes: string; createdAt: string };
  /** The vehicle's scenario (SI), when one is stored (bundles before schema 4 have none). */
  scenario?: RideScenario;
  revisions: BundleRevision[];
  dampers: BundleDamper[];
};
