import { createContext, useContext } from 'react';
import type { UnitSystem } from '../../core/units/units';

/** The screens of the app, in the order the header lists them. */
export const SCREENS = [
  { id: 'vehicles', label: 'Vehicles' },
  { id: 'setup', label: 'Setup sheet' },
  { id: 'analysis', label: 'Ride figures' },
  { id: 'compare', label: 'Compare' },
  { id: 'dampers', label: 'Dampers' },
  { id: 'valving', label: 'Valving' },
] as const;
export type ScreenId = (typeof SCREENS)[number]['id'];

/** A stored revision: a vehicle and its revision number. */
export type RevisionPick = { vehicle: string; revision: number };

/** What the setup sheet opens: a revision to start from, or a blank sheet for a vehicle. */
export type SheetOpen = { vehicle: string; fromRevision?: number };

export type AppState = {
  units: UnitSystem;
  setUnits: (u: UnitSystem) => void;
  screen: ScreenId;
  go: (screen: ScreenId) => void;
  /** The vehicle the user is working on. */
  vehicle: string | null;
  setVehicle: (v: string | null) => void;
  /** The revision shown by Ride figures. */
  revision: RevisionPick | null;
  openRevision: (r: RevisionPick) => void;
  /** Revisions picked for Compare (2 to 4). */
  comparePicks: RevisionPick[];
  setComparePicks: (r: RevisionPick[]) => void;
  /** Opens the setup sheet on a revision (a new revision based on it) or blank. */
  openSheet: (s: SheetOpen) => void;
  sheet: SheetOpen | null;
  /** Bumped whenever stored data changes, so screens reload. */
  dataVersion: number;
  dataChanged: () => void;
};

export const AppContext = createContext<AppState | null>(null);

export function useApp(): AppState {
  const s = useContext(AppContext);
  if (!s) throw new Error('useApp outside the app');
  return s;
}
