import { useCallback, useEffect, useRef, useState } from 'react';
import type { RideScenario } from '../../../core/valving/ride-scenario';
import { quantityUnitLabel } from '../../../core/units/units';
import { apiCall } from '../api-client';
import { useApp } from '../app-context';
import {
  SCENARIO_FIELDS,
  SCENARIO_ROAD_CLASSES,
  scenarioEditsOf,
  scenarioFieldEdit,
  scenarioTexts,
  type ScenarioPart,
} from '../scenario-model';
import { ErrorLine } from './status';
import { TextInputField } from './text-input-field';

/** A vehicle's scenario as a screen holds it: SI, where it comes from, and the vehicle. */
export type ScenarioShown = { vehicle: string; scenario: RideScenario; stored: boolean; note: string };

/**
 * The scenario of `vehicle`, read from the store (again whenever stored data changes), and a
 * way to change it: the screen uses the new scenario at once, and it is stored SI behind.
 */
export function useVehicleScenario(vehicle: string | null): {
  shown: ScenarioShown | null;
  error: unknown;
  change: (s: RideScenario) => void;
  reset: () => void;
} {
  const app = useApp();
  const { dataChanged } = app;
  const [shown, setShown] = useState<ScenarioShown | null>(null);
  const [error, setError] = useState<unknown>(null);
  // Saves go one after another; a read that started before the last change is not applied.
  const saves = useRef<Promise<unknown>>(Promise.resolve());
  const changes = useRef(0);

  useEffect(() => {
    if (!vehicle) {
      setShown(null);
      return;
    }
    let gone = false;
    const at = changes.current;
    apiCall('vehicleScenario', { vehicle }).then(
      (r) => {
        if (gone || changes.current !== at) return;
        setError(null);
        setShown((old) =>
          old && old.vehicle === vehicle && JSON.stringify(old.scenario) === JSON.stringify(r.scenario)
            ? { ...old, stored: r.stored, note: r.note }
            : { vehicle, scenario: r.scenario, stored: r.stored, note: r.note },
        );
      },
      (e: unknown) => {
        if (!gone) setError(e);
      },
    );
    return () => {
      gone = true;
    };
  }, [vehicle, app.dataVersion]);

  const store = useCallback(
    (scenario: unknown) => {
      if (!vehicle) return;
      changes.current += 1;
      saves.current = saves.current
        .then(() => apiCall('vehicleScenarioSet', { vehicle, scenario }))
        .then(
          (r) => {
            setShown((old) =>
              old && old.vehicle === vehicle ? { ...old, stored: r.stored, note: r.note } : old,
            );
            dataChanged();
          },
          (e: unknown) => setError(e),
        );
    },
    [vehicle, dataChanged],
  );

  const change = useCallback(
    (s: RideScenario) => {
      if (!vehicle) return;
      setShown((old) => (old ? { ...old, scenario: s } : old));
      store(scenarioEditsOf(s));
    },
    [vehicle, store],
  );
  const reset = useCallback(() => {
    changes.current += 1;
    store(null);
  }, [store]);
  return { shown, error, change, reset };
}

const camel = (key: string) => key.replace(/\.(\w)/, (_m, c: string) => c.toUpperCase());

/**
 * The vehicle's scenario, editable: the fields of the parts a screen uses, in the unit system
 * shown. Each field that reads changes the scenario (stored SI); a unit switch rewrites the
 * fields from the SI values, so that it converts and never changes a value.
 */
export function ScenarioPanel(props: {
  idPrefix: string;
  parts: readonly ScenarioPart[];
  state: ReturnType<typeof useVehicleScenario>;
}) {
  const { units } = useApp();
  const { shown, change, reset, error } = props.state;
  const [texts, setTexts] = useState<Record<string, string>>({});
  const [problems, setProblems] = useState<Map<string, string>>(new Map());
  // What the texts were written from: another scenario or unit system rewrites them.
  const basis = useRef<{ scenario: RideScenario; units: string } | null>(null);

  useEffect(() => {
    if (!shown) return;
    const b = basis.current;
    if (b && b.scenario === shown.scenario && b.units === units) return;
    const fresh = scenarioTexts(shown.scenario, units);
    // A field still being fixed keeps what was typed; the rest show the scenario.
    setTexts((old) => {
      const out = { ...fresh };
      for (const key of problems.keys()) if (old[key] !== undefined) out[key] = old[key] as string;
      return out;
    });
    basis.current = { scenario: shown.scenario, units };
  }, [shown, units, problems]);

  if (!shown)
    return (
      <fieldset className="analysis-options scenario-panel">
        <legend>Scenario</legend>
        <ErrorLine error={error} />
        <p className="muted">Pick a vehicle: its road, bump and curb show here.</p>
      </fieldset>
    );

  const onEdit = (key: string, text: string) => {
    setTexts((t) => ({ ...t, [key]: text }));
    const r = scenarioFieldEdit(shown.scenario, key, text, units);
    const next = new Map(problems);
    if ('problem' in r) {
      next.set(key, r.problem);
      setProblems(next);
      return;
    }
    next.delete(key);
    setProblems(next);
    // The texts stay as typed: only the value they stand for is new.
    basis.current = { scenario: r.scenario, units };
    change(r.scenario);
  };

  const fields = SCENARIO_FIELDS.filter((f) => props.parts.includes(f.part));
  return (
    <fieldset className="analysis-options scenario-panel" data-testid="scenario-panel">
      <legend>Scenario for {shown.vehicle}</legend>
      <div className="option-fields">
        {fields.map((f) =>
          f.kind === null ? (
            <div className="field" key={f.key}>
              <label htmlFor={`${props.idPrefix}-${camel(f.key)}`}>{f.label}</label>
              <select
                id={`${props.idPrefix}-${camel(f.key)}`}
                value={texts[f.key] ?? ''}
                onChange={(e) => onEdit(f.key, e.target.value)}
              >
                {SCENARIO_ROAD_CLASSES.map((c) => (
                  <option key={c} value={c}>
                    {c}
                  </option>
                ))}
              </select>
              <span className="unit" />
            </div>
          ) : (
            <TextInputField
              key={f.key}
              id={`${props.idPrefix}-${camel(f.key)}`}
              label={f.label}
              value={texts[f.key] ?? ''}
              unit={quantityUnitLabel(f.kind, units)}
              problem={problems.get(f.key)}
              numeric
              onChange={(text) => onEdit(f.key, text)}
            />
          ),
        )}
      </div>
      <p className="muted scenario-note">
        {shown.stored
          ? `The scenario stored for ${shown.vehicle}: every screen and the command judge it on this.`
          : 'The starting scenario (the same for every vehicle without its own): change a field to store one for this vehicle.'}{' '}
        {shown.stored ? (
          <button type="button" className="secondary" onClick={reset}>
            Back to the starting scenario
          </button>
        ) : null}
      </p>
      {problems.size > 0 ? (
        <p className="status" role="status">
          The figures are for the last values that read: fix the marked field.
        </p>
      ) : null}
      <ErrorLine error={error} />
    </fieldset>
  );
}
