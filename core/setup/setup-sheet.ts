import type { ClickSettings } from '../damper/click-settings';
import type { CornerInput } from '../corner/corner';

/** The four corners of a vehicle, in the order sheets list them. */
export const CORNER_POSITIONS = ['FL', 'FR', 'RL', 'RR'] as const;
export type CornerPosition = (typeof CORNER_POSITIONS)[number];

/**
 * Static toe of one wheel, positive toe-in: an angle (rad), or a length at the rim (m) as
 * many sheets give it. Kept in the form it was measured in — converting needs the rim size.
 */
export type Toe = { kind: 'angle' | 'length'; value: number };

/** One corner of a setup sheet: the analysis input and the shop's sheet fields, SI. */
export type SetupCorner = {
  /** The quarter-car input exactly as a corner file's "corner" object holds it. */
  analysis: CornerInput;
  /** Label of the damper unit fitted, as in the bench library ("" when not recorded). */
  damperUnit: string;
  clicks: ClickSettings;
  /** The spring as the shop names it (part number, rate and length). */
  springLabel: string;
  /** Ride height (m) at the shop's own measuring point. */
  rideHeight?: number;
  /** Cold tyre pressure, gauge (Pa). */
  tirePressureCold?: number;
  /** Camber (rad), negative with the top of the wheel leaning in. */
  camber?: number;
  toe?: Toe;
  notes: string;
};

/** A whole vehicle's setup sheet: four corners and the vehicle-level fields, SI. */
export type SetupSheet = {
  /** What the shop calls this setup ("Baseline", "Wet, soft rear"). */
  name: string;
  event: string;
  track: string;
  driver: string;
  /** Day the setup ran or was set, `YYYY-MM-DD`. */
  date?: string;
  /** Fuel on board (kg). */
  fuelLoad?: number;
  /** Anti-roll bar settings as the shop writes them ("hole 2 of 5", "disconnected"). */
  antiRollBar: { front: string; rear: string };
  notes: string;
  corners: Record<CornerPosition, SetupCorner>;
};

/**
 * Words for the fields of a setup file, by the path inside a corner or at the top, for
 * change lists. A field without an entry (a new optional corner input) shows its path.
 */
export const SETUP_FIELD_LABELS: Readonly<Record<string, string>> = {
  name: 'name',
  event: 'event',
  track: 'track',
  driver: 'driver',
  date: 'date',
  fuelLoad: 'fuel load',
  'antiRollBar.front': 'front anti-roll bar',
  'antiRollBar.rear': 'rear anti-roll bar',
  notes: 'notes',
  damperUnit: 'damper unit',
  'clicks.bump': 'bump clicks',
  'clicks.rebound': 'rebound clicks',
  'clicks.bumpHighSpeed': 'high-speed bump clicks',
  'clicks.reboundHighSpeed': 'high-speed rebound clicks',
  springLabel: 'spring',
  rideHeight: 'ride height',
  tirePressureCold: 'cold pressure',
  camber: 'camber',
  toe: 'toe',
  'corner.cornerMass': 'corner mass',
  'corner.unsprungMass': 'unsprung mass',
  'corner.springRate': 'spring rate',
  'corner.springMotionRatio': 'spring motion ratio',
  'corner.damperMotionRatio': 'damper motion ratio',
  'corner.tireRate': 'tyre rate',
  'corner.tireDamping': 'tyre damping',
  'corner.damper.bump.lowSpeed': 'bump damping',
  'corner.damper.bump.kneeSpeed': 'bump knee',
  'corner.damper.bump.highSpeed': 'high-speed bump damping',
  'corner.damper.rebound.lowSpeed': 'rebound damping',
  'corner.damper.rebound.kneeSpeed': 'rebound knee',
  'corner.damper.rebound.highSpeed': 'high-speed rebound damping',
  'corner.bumpStop.gap': 'bump-stop gap',
  'corner.bumpStop.rate': 'bump-stop rate',
};
