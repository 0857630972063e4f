import { useEffect, useMemo, useRef, useState } from 'react';
import { cornerSprungMass, cornerWheelRate, type CornerInput } from '../../../core/corner/corner';
import { CORNER_POSITIONS, type CornerPosition } from '../../../core/setup/setup-sheet';
import { numberFormat, quantityFormat, quantityUnitLabel, type UnitSystem } from '../../../core/units/units';
import { analysisCornersOf } from '../analysis-result';
import { apiCall } from '../api-client';
import { useApp, type RevisionPick } from '../app-context';
import { RevisionPicker } from '../components/revision-pick';
import { ErrorLine } from '../components/status';
import { TextInputField } from '../components/text-input-field';
import {
  ZETA_CORNER_FIELDS,
  benchRunDampingRatios,
  benchRunLabel,
  zetaCornerRead,
  zetaCornerTextsConvert,
  type BenchRun,
  type ZetaCorner,
  type ZetaCornerTexts,
  type ZetaFigure,
} from '../damper-model';

const zetaText = (z: ZetaFigure) =>
  z ? `${numberFormat(z.zeta, 2)}${z.class ? ` (${z.class})` : ''}` : '— (no fit)';

/** Where the ζ table's corner comes from: a corner of a stored setup, or one entered here. */
export function ZetaPanel(props: { runs: BenchRun[]; units: UnitSystem }) {
  const app = useApp();
  const u = props.units;
  const [source, setSource] = useState<'setup' | 'entered'>('setup');
  const [pick, setPick] = useState<RevisionPick | null>(app.revision);
  const [position, setPosition] = useState<CornerPosition>('FL');
  const [corners, setCorners] = useState<Record<CornerPosition, CornerInput> | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [texts, setTexts] = useState<ZetaCornerTexts>(() =>
    u === 'si'
      ? {
          cornerMass: '300',
          unsprungMass: '40',
          springRate: '70',
          springMotionRatio: '0.9',
          damperMotionRatio: '',
        }
      : {
          cornerMass: '660',
          unsprungMass: '88',
          springRate: '400',
          springMotionRatio: '0.9',
          damperMotionRatio: '',
        },
  );
  const textsUnits = useRef(u);
  useEffect(() => {
    if (textsUnits.current === u) return;
    setTexts((t) => zetaCornerTextsConvert(t, textsUnits.current, u));
    textsUnits.current = u;
  }, [u]);

  useEffect(() => {
    if (source !== 'setup' || !pick) return;
    let gone = false;
    setError(null);
    apiCall('setupShow', { vehicle: pick.vehicle, revision: pick.revision, units: 'si' }).then((r) => {
      if (gone) return;
      try {
        setCorners(analysisCornersOf(r.file));
      } catch (e) {
        setError(e);
      }
    }, setError);
    return () => {
      gone = true;
    };
  }, [source, pick, app.dataVersion]);

  const entered = useMemo(() => zetaCornerRead(texts, textsUnits.current), [texts, u]);
  const corner: ZetaCorner | null =
    source === 'setup' ? (corners?.[position] ?? null) : 'corner' in entered ? entered.corner : null;
  const problems = 'problems' in entered ? entered.problems : new Map<keyof ZetaCornerTexts, string>();

  return (
    <section aria-label="Damping ratio at a corner" className="zeta-panel">
      <h3>Damping ratio ζ at a corner</h3>
      <fieldset>
        <legend>Corner</legend>
        <div className="toolbar">
          <label>
            <input
              type="radio"
              name="zeta-source"
              checked={source === 'setup'}
              onChange={() => setSource('setup')}
            />{' '}
            A corner of a stored setup
          </label>
          <label>
            <input
              type="radio"
              name="zeta-source"
              checked={source === 'entered'}
              onChange={() => setSource('entered')}
            />{' '}
            A corner entered here
          </label>
        </div>
        {source === 'setup' ? (
          <div className="zeta-setup">
            <RevisionPicker idPrefix="zeta" value={pick} onChange={setPick} />
            <div className="field wide">
              <label htmlFor="zeta-corner">Corner</label>
              <select
                id="zeta-corner"
                value={position}
                onChange={(e) => setPosition(e.target.value as CornerPosition)}
              >
                {CORNER_POSITIONS.map((p) => (
                  <option key={p} value={p}>
                    {p}
                  </option>
                ))}
              </select>
            </div>
          </div>
        ) : (
          <div className="option-fields">
            {ZETA_CORNER_FIELDS.map((f) => (
              <TextInputField
                key={f.key}
                id={`zeta-${f.key}`}
                label={f.label}
                value={texts[f.key]}
                unit={f.kind === 'ratio' ? '' : quantityUnitLabel(f.kind, u)}
                problem={problems.get(f.key)}
                placeholder={f.key === 'damperMotionRatio' ? 'as spring' : undefined}
                numeric
                onChange={(text) => setTexts({ ...texts, [f.key]: text })}
              />
            ))}
          </div>
        )}
      </fieldset>
      <ErrorLine error={error} />
      {corner ? (
        <>
          <p data-testid="zeta-corner">
            Wheel rate {quantityFormat(cornerWheelRate(corner), 'stiffness', u)}, sprung mass{' '}
            {quantityFormat(cornerSprungMass(corner), 'mass', u)}, damper motion ratio{' '}
            {numberFormat(corner.damperMotionRatio, 3)}: ζ = c_damper · MRd² / 2√(wheel rate · sprung mass),
            from each run&apos;s fitted slopes.
          </p>
          <table className="figures" aria-label="Damping ratio per run">
            <thead>
              <tr>
                <th scope="col">Run</th>
                <th scope="col">ζ bump, low speed</th>
                <th scope="col">ζ bump, high speed</th>
                <th scope="col">ζ rebound, low speed</th>
                <th scope="col">ζ rebound, high speed</th>
              </tr>
            </thead>
            <tbody>
              {props.runs.map((r) => {
                const z = benchRunDampingRatios(r.fit, corner);
                return (
                  <tr key={r.id} data-run={r.id}>
                    <th scope="row">{benchRunLabel(r)}</th>
                    <td>{zetaText(z.bump)}</td>
                    <td>{zetaText(z.bumpHighSpeed)}</td>
                    <td>{zetaText(z.rebound)}</td>
                    <td>{zetaText(z.reboundHighSpeed)}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </>
      ) : source === 'setup' && pick && !error ? (
        <p>Loading the corner…</p>
      ) : null}
    </section>
  );
}
