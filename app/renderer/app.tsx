import { useCallback, useEffect, useMemo, useState } from 'react';
import { CAUTION_TEXT } from '../../core/safety/caution';
import type { UnitSystem } from '../../core/units/units';
import { apiCall } from './api-client';
import {
  AppContext,
  SCREENS,
  type AppState,
  type RevisionPick,
  type ScreenId,
  type SheetOpen,
} from './app-context';
import { Modal } from './components/modal';
import { ErrorLine } from './components/status';
import { menuCommandsListen } from './native';
import { AnalysisScreen } from './screens/analysis-screen';
import { CompareScreen } from './screens/compare-screen';
import { DampersScreen } from './screens/dampers-screen';
import { SetupEditor } from './screens/setup-editor';
import { ValvingScreen } from './screens/valving-screen';
import { VehiclesScreen } from './screens/vehicles-screen';

/** The notice every user acknowledges once, kept with the shop's data. */
const CAUTION_KEY = 'caution-acknowledged';
const DEMO_OFFER_KEY = 'demo-offered';
const UNITS_KEY = 'units';

function FirstRun(props: { onDone: () => void }) {
  const [step, setStep] = useState<'caution' | 'demo' | 'loading'>('caution');
  const [error, setError] = useState<unknown>(null);
  const acknowledge = async () => {
    await apiCall('settingSet', { key: CAUTION_KEY, value: { at: new Date().toISOString() } });
    const offered = await apiCall('settingGet', { key: DEMO_OFFER_KEY });
    const { vehicles } = await apiCall('vehicleList', {});
    if (offered.value === null && vehicles.length === 0) setStep('demo');
    else props.onDone();
  };
  const demo = async (load: boolean) => {
    setStep('loading');
    try {
      if (load) await apiCall('loadDemo', {});
      await apiCall('settingSet', {
        key: DEMO_OFFER_KEY,
        value: { at: new Date().toISOString(), loaded: load },
      });
      props.onDone();
    } catch (e) {
      setError(e);
      setStep('demo');
    }
  };
  if (step === 'caution') {
    return (
      <Modal title="Before you use RideLedger">
        <p>{CAUTION_TEXT}</p>
        <p>
          The model also warns where its own figures say trouble: tyre lift-off, bump stop engaged, damping
          ratio outside the usual range, travel beyond the entered limit, ride frequencies far from the usual
          range for the vehicle type.
        </p>
        <button type="button" className="primary" onClick={() => void acknowledge().catch(setError)}>
          I understand
        </button>
        <ErrorLine error={error} />
      </Modal>
    );
  }
  return (
    <Modal title="Start with the demo shop?">
      <p>
        The demo is an invented shop, Millbrook, with two vehicles and their setup histories, and two damper
        units with bench runs at several clicker settings, so that every screen has something to show. You can
        add your own vehicles beside it.
      </p>
      <div className="toolbar">
        <button
          type="button"
          className="primary"
          disabled={step === 'loading'}
          onClick={() => void demo(true)}
        >
          Load the demo shop
        </button>
        <button
          type="button"
          className="secondary"
          disabled={step === 'loading'}
          onClick={() => void demo(false)}
        >
          Start empty
        </button>
      </div>
      <ErrorLine error={error} />
    </Modal>
  );
}

export function App() {
  const [ready, setReady] = useState<'checking' | 'first-run' | 'ready'>('checking');
  const [error, setError] = useState<unknown>(null);
  const [units, setUnitsState] = useState<UnitSystem>('si');
  const [screen, setScreen] = useState<ScreenId>('vehicles');
  const [vehicle, setVehicle] = useState<string | null>(null);
  const [revision, setRevision] = useState<RevisionPick | null>(null);
  const [comparePicks, setComparePicks] = useState<RevisionPick[]>([]);
  const [sheet, setSheet] = useState<SheetOpen | null>(null);
  const [dataVersion, setDataVersion] = useState(0);

  useEffect(() => {
    (async () => {
      const [ack, u] = await Promise.all([
        apiCall('settingGet', { key: CAUTION_KEY }),
        apiCall('settingGet', { key: UNITS_KEY }),
      ]);
      if (u.value === 'us' || u.value === 'si') setUnitsState(u.value);
      setReady(ack.value === null ? 'first-run' : 'ready');
    })().catch(setError);
  }, []);

  const setUnits = useCallback((u: UnitSystem) => {
    setUnitsState(u);
    void apiCall('settingSet', { key: UNITS_KEY, value: u }).catch(() => {});
  }, []);

  const state = useMemo<AppState>(
    () => ({
      units,
      setUnits,
      screen,
      go: setScreen,
      vehicle,
      setVehicle,
      revision,
      openRevision: (r) => {
        setRevision(r);
        setVehicle(r.vehicle);
        setScreen('analysis');
      },
      comparePicks,
      setComparePicks,
      sheet,
      openSheet: (s) => {
        setSheet(s);
        setVehicle(s.vehicle);
        setScreen('setup');
      },
      dataVersion,
      dataChanged: () => setDataVersion((v) => v + 1),
    }),
    [units, setUnits, screen, vehicle, revision, comparePicks, sheet, dataVersion],
  );

  useEffect(
    () =>
      menuCommandsListen((command) => {
        if (command === 'compare') setScreen('compare');
        if (command === 'new-setup' && vehicle) state.openSheet({ vehicle });
        // save, undo, redo and print belong to the screen in front; it listens itself.
      }),
    [vehicle, state],
  );

  if (error) {
    return (
      <main>
        <h1>RideLedger</h1>
        <ErrorLine error={error} />
      </main>
    );
  }
  return (
    <AppContext.Provider value={state}>
      <header className="app-header">
        <h1>RideLedger</h1>
        <nav className="app-nav" aria-label="Screens">
          {SCREENS.map((s) => (
            <button
              key={s.id}
              type="button"
              aria-current={screen === s.id ? 'page' : undefined}
              onClick={() => setScreen(s.id)}
            >
              {s.label}
            </button>
          ))}
        </nav>
        <span className="spacer" />
        <fieldset className="units-switch" style={{ border: 0, margin: 0, padding: 0 }}>
          <legend style={{ float: 'left', padding: '0 6px 0 0', fontWeight: 600 }}>Units</legend>
          {(['si', 'us'] as const).map((u) => (
            <label key={u}>
              <input type="radio" name="units" value={u} checked={units === u} onChange={() => setUnits(u)} />{' '}
              {u === 'si' ? 'SI' : 'US'}
            </label>
          ))}
        </fieldset>
      </header>
      <main>
        {ready === 'ready' ? (
          <>
            {screen === 'vehicles' && <VehiclesScreen />}
            {screen === 'setup' && <SetupEditor />}
            {screen === 'analysis' && <AnalysisScreen />}
            {screen === 'compare' && <CompareScreen />}
            {screen === 'dampers' && <DampersScreen />}
            {screen === 'valving' && <ValvingScreen />}
          </>
        ) : null}
      </main>
      {ready === 'first-run' ? (
        <FirstRun
          onDone={() => {
            setReady('ready');
            state.dataChanged();
          }}
        />
      ) : null}
    </AppContext.Provider>
  );
}
