import { useEffect, useId, useMemo, useState } from 'react';
import { cornerQuarterCar } from '../../../core/corner';
import { eventBump } from '../../../core/event';
import { frequencyResponseGrid, frequencyResponseMagnitudeAt } from '../../../core/frequency-response';
import { setupFileParse } from '../../../core/setup-file';
import type { CornerPosition, SetupSheet } from '../../../core/setup-sheet';
import { eventSimulate } from '../../../core/simulate';
import {
  quantityFormat,
  quantityToDisplay,
  quantityUnitLabel,
  numberFormat,
  type UnitSystem,
} from '../../../core/units';
import {
  VALVING_VERDICT_RULE,
  valvingHeadlineVerdict,
  valvingScoreVerdict,
  type ValvingVerdict,
} from '../../../core/valving-compare';
import {
  VALVING_HEADLINE_KEYS,
  VALVING_HEADLINES,
  type ValvingHeadlineKey,
} from '../../../core/valving-rank';
import type { ValvingTargets } from '../../../core/valving-targets';
import type { HandlerOutput } from '../../api/contract';
import { apiCall } from '../api-client';
import { useApp, type RevisionPick } from '../app-context';
import { CornerChoice, PresetChoice } from '../components/choices';
import { CautionLine, WarningList } from '../components/caution';
import { LinePlot, type PlotSeries } from '../components/plot';
import { RevisionPicker } from '../components/revision-pick';
import { ErrorLine } from '../components/status';

type Presets = HandlerOutput<'valvingPresets'>;
type Compared = HandlerOutput<'setupCompare'>;
type Loaded = { pick: RevisionPick; name: string; sheet: SetupSheet };

const labelOf = (l: Loaded) => `${l.pick.vehicle} #${l.pick.revision} “${l.name}”`;

function valueText(key: ValvingHeadlineKey, v: number | null, units: UnitSystem): string {
  if (v === null) return '—';
  const kind = VALVING_HEADLINES[key].kind;
  if (kind === 'time') return `${numberFormat(v * 1000, 1)} ms`;
  if (kind === 'frequency') return `${numberFormat(v, 2)} Hz`;
  return kind
    ? quantityFormat(v, kind, units, kind === 'length' ? { decimals: units === 'si' ? 2 : 3 } : {})
    : numberFormat(v, 3);
}

/** Line widths of the compared revisions' curves, the baseline widest. */
const CURVE_WIDTHS = [6, 3.5, 2, 1.5];

const VERDICT_TEXT: Record<Exclude<ValvingVerdict, null>, string> = {
  better: '▲ better',
  worse: '▼ worse',
  same: '= same',
};

/**
 * Two to four revisions (of one vehicle or several) side by side: the headline figures of each
 * corner on a preset's scenario with their change against the first, marked better or worse by
 * each figure's sense in words and arrows, and the frequency and bump responses overlaid.
 */
export function CompareScreen() {
  const app = useApp();
  const id = useId();
  const picks = app.comparePicks;
  const [presets, setPresets] = useState<Presets | null>(null);
  const [preset, setPreset] = useState('track-day');
  const [position, setPosition] = useState<CornerPosition>('FL');
  const [loaded, setLoaded] = useState<Loaded[]>([]);
  const [compared, setCompared] = useState<Compared[]>([]);
  const [error, setError] = useState<unknown>(null);
  const [candidate, setCandidate] = useState<RevisionPick | null>(null);

  useEffect(() => {
    apiCall('valvingPresets', {}).then(setPresets, setError);
  }, []);

  useEffect(() => {
    setError(null);
    let gone = false;
    (async () => {
      const sheets = await Promise.all(
        picks.map(async (pick) => {
          const r = await apiCall('setupShow', {
            vehicle: pick.vehicle,
            revision: pick.revision,
            units: 'si',
          });
          return { pick, name: r.revision.name, sheet: setupFileParse(r.file).sheet };
        }),
      );
      const [first, ...rest] = picks;
      const pairs = first
        ? await Promise.all(
            rest.map((b) => apiCall('setupCompare', { a: first, b, preset, units: app.units })),
          )
        : [];
      if (!gone) {
        setLoaded(sheets);
        setCompared(pairs);
      }
    })().catch((e: unknown) => !gone && setError(e));
    return () => {
      gone = true;
    };
    // The units switch asks again for the warnings' words; what is shown stays until the answer.
  }, [picks, preset, app.units, app.dataVersion]);

  const scenario = presets?.presets.find((p) => p.name === preset)?.scenario;
  const targets = (compared[0]?.targets ??
    presets?.presets.find((p) => p.name === preset)?.targets ??
    {}) as ValvingTargets;

  const plots = useMemo(() => {
    if (!scenario || loaded.length === 0) return null;
    const freqs = frequencyResponseGrid(0.3, 30, 40);
    const perMetre = quantityToDisplay(1, 'length', app.units);
    const frf = { accel: [] as PlotSeries[], tire: [] as PlotSeries[], travel: [] as PlotSeries[] };
    const bump = { accel: [] as PlotSeries[], travel: [] as PlotSeries[], tire: [] as PlotSeries[] };
    const event = eventBump(scenario.bump);
    for (const [i, l] of loaded.entries()) {
      const corner = l.sheet.corners[position].analysis;
      const q = cornerQuarterCar(corner);
      const m = freqs.map((f) => frequencyResponseMagnitudeAt(q, f));
      // Widest first, each later one inside it with its own dash: identical curves both show.
      const width = CURVE_WIDTHS[i] ?? 1.5;
      const name = labelOf(l);
      frf.accel.push({ name, x: freqs, width, y: m.map((r) => r.bodyAccel / perMetre) });
      frf.tire.push({
        name,
        x: freqs,
        width,
        y: m.map((r) => quantityToDisplay(r.tireLoad, 'force', app.units) / perMetre),
      });
      frf.travel.push({ name, x: freqs, width, y: m.map((r) => r.travel) });
      const h = eventSimulate(corner, event, { historyPoints: 600 }).history;
      if (h) {
        bump.accel.push({ name, x: h.time, width, y: h.bodyAccel });
        bump.travel.push({
          name,
          x: h.time,
          width,
          y: Array.from(h.travel, (v) => quantityToDisplay(v, 'length', app.units)),
        });
        bump.tire.push({
          name,
          x: h.time,
          width,
          y: Array.from(h.tireLoad, (v) => quantityToDisplay(v, 'force', app.units)),
        });
      }
    }
    return { frf, bump };
  }, [loaded, position, scenario, app.units]);

  const add = (p: RevisionPick) => {
    if (picks.some((x) => x.vehicle === p.vehicle && x.revision === p.revision) || picks.length >= 4) return;
    app.setComparePicks([...picks, p]);
  };
  const len = quantityUnitLabel('length', app.units);
  const force = quantityUnitLabel('force', app.units);

  const rows = useMemo(() => {
    const [first] = compared;
    if (!first) return [];
    return VALVING_HEADLINE_KEYS.map((key) => {
      const corner = (c: Compared) => c.corners.find((x) => x.position === position);
      const base = corner(first)?.a.headline[key] ?? null;
      const others = compared.map((c) => {
        const v = corner(c)?.b.headline[key] ?? null;
        return { v, verdict: valvingHeadlineVerdict(key, base, v, targets) };
      });
      return { key, base, others };
    });
  }, [compared, position, targets]);
  const scores = useMemo(() => {
    const side = (c: Compared, s: 'a' | 'b') => c.corners.find((x) => x.position === position)?.[s].score;
    const base = compared[0] ? side(compared[0], 'a') : undefined;
    return base
      ? {
          base,
          others: compared.map((c) => {
            const s = side(c, 'b');
            return s ? { s, verdict: valvingScoreVerdict(base.score, s.score) } : null;
          }),
        }
      : null;
  }, [compared, position]);
  // Revisions whose figures at this corner are the baseline's, to the last digit.
  const sameAsBaseline = rows.length
    ? loaded.slice(1).filter((_, i) => rows.every((r) => r.others[i]?.v === r.base))
    : [];

  return (
    <section aria-label="Compare setups">
      <h2>Compare setups</h2>
      <CautionLine />
      <fieldset className="toolbar">
        <legend>Add a revision</legend>
        <RevisionPicker idPrefix={`${id}-add`} value={candidate} onChange={setCandidate} />
        <button
          type="button"
          className="secondary"
          disabled={!candidate || picks.length >= 4}
          onClick={() => candidate && add(candidate)}
        >
          Add to the comparison
        </button>
      </fieldset>
      <ul className="chips" aria-label="Revisions compared">
        {loaded.map((l, i) => (
          <li key={`${l.pick.vehicle}-${l.pick.revision}`}>
            <span className="chip">
              {i === 0 ? 'Baseline: ' : ''}
              {labelOf(l)}{' '}
              <button
                type="button"
                className="secondary"
                aria-label={`Remove ${labelOf(l)}`}
                onClick={() =>
                  app.setComparePicks(
                    picks.filter((x) => !(x.vehicle === l.pick.vehicle && x.revision === l.pick.revision)),
                  )
                }
              >
                Remove
              </button>
            </span>
          </li>
        ))}
      </ul>
      {picks.length < 2 ? (
        <p>Pick two to four revisions: here, or with “pick” in a vehicle’s history.</p>
      ) : null}
      <div className="toolbar">
        <PresetChoice
          label="Judged on"
          value={preset}
          presets={presets?.presets ?? []}
          onChange={setPreset}
        />
        <CornerChoice value={position} onChange={setPosition} />
      </div>
      {scenario ? (
        <p className="muted">
          Scenario: ISO 8608 class {scenario.road.roadClass} at{' '}
          {quantityFormat(scenario.road.speed, 'speed', app.units)}; a{' '}
          {quantityFormat(scenario.bump.height, 'length', app.units)} bump{' '}
          {quantityFormat(scenario.bump.length, 'length', app.units)} long at{' '}
          {quantityFormat(scenario.bump.speed, 'speed', app.units)}; a{' '}
          {quantityFormat(scenario.curb.height, 'length', app.units)} curb at{' '}
          {quantityFormat(scenario.curb.speed, 'speed', app.units)}. {compared[0]?.objective ?? ''}
        </p>
      ) : null}
      <ErrorLine error={error} />
      {rows.length > 0 && loaded.length >= 2 ? (
        <table className="figures" aria-label={`Headline figures at ${position}`} data-testid="compare-table">
          <thead>
            <tr>
              <th scope="col">{position}</th>
              <th scope="col">{labelOf(loaded[0] as Loaded)}</th>
              {loaded.slice(1).map((l) => (
                <th scope="col" key={labelOf(l)} colSpan={3}>
                  {labelOf(l)}: value, change, verdict
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.key}>
                <th scope="row" style={{ textAlign: 'left' }}>
                  {VALVING_HEADLINES[r.key].label}
                </th>
                <td>{valueText(r.key, r.base, app.units)}</td>
                {r.others.map((o, i) => {
                  const d = r.base !== null && o.v !== null ? o.v - r.base : null;
                  const pct =
                    d !== null && r.base !== null && r.base !== 0 ? (100 * d) / Math.abs(r.base) : null;
                  return [
                    <td key={`v${i}`}>{valueText(r.key, o.v, app.units)}</td>,
                    <td key={`d${i}`}>
                      {d === null ? '—' : `${d >= 0 ? '+' : '−'}${valueText(r.key, Math.abs(d), app.units)}`}
                      {pct === null ? '' : ` (${pct >= 0 ? '+' : '−'}${numberFormat(Math.abs(pct), 1)} %)`}
                    </td>,
                    <td
                      key={`j${i}`}
                      className={o.verdict === 'better' ? 'better' : o.verdict === 'worse' ? 'worse' : ''}
                      data-verdict={o.verdict ?? ''}
                    >
                      {o.verdict ? VERDICT_TEXT[o.verdict] : '—'}
                    </td>,
                  ];
                })}
              </tr>
            ))}
            {scores ? (
              <>
                <tr>
                  <th scope="row" style={{ textAlign: 'left' }}>
                    Targets met
                  </th>
                  <td>
                    {scores.base.met} of {scores.base.met + scores.base.missed}
                  </td>
                  {scores.others.map((o, i) => [
                    <td key={`v${i}`}>{o ? `${o.s.met} of ${o.s.met + o.s.missed}` : '—'}</td>,
                    <td key={`d${i}`}>
                      {o
                        ? `${o.s.met - scores.base.met >= 0 ? '+' : '−'}${Math.abs(o.s.met - scores.base.met)}`
                        : '—'}
                    </td>,
                    <td key={`j${i}`} />,
                  ])}
                </tr>
                <tr data-figure="score">
                  <th scope="row" style={{ textAlign: 'left' }}>
                    Score (0 when every target is met; lower is better)
                  </th>
                  <td>{numberFormat(scores.base.score, 3)}</td>
                  {scores.others.map((o, i) => [
                    <td key={`v${i}`}>{o ? numberFormat(o.s.score, 3) : '—'}</td>,
                    <td key={`d${i}`}>
                      {o
                        ? `${o.s.score - scores.base.score >= 0 ? '+' : '−'}${numberFormat(Math.abs(o.s.score - scores.base.score), 3)}`
                        : '—'}
                    </td>,
                    <td
                      key={`j${i}`}
                      className={o?.verdict === 'better' ? 'better' : o?.verdict === 'worse' ? 'worse' : ''}
                      data-verdict={o?.verdict ?? ''}
                    >
                      {o ? VERDICT_TEXT[o.verdict] : '—'}
                    </td>,
                  ])}
                </tr>
              </>
            ) : null}
          </tbody>
        </table>
      ) : null}
      {rows.length > 0 && loaded.length >= 2 ? (
        <p className="muted" data-testid="verdict-rule">
          <strong>How the verdict is given:</strong> {VALVING_VERDICT_RULE}
        </p>
      ) : null}
      {compared.length > 0 ? (
        <>
          <WarningList
            titled
            label={`Model warnings, ${labelOf(loaded[0] as Loaded)}`}
            warnings={compared[0]?.corners.find((c) => c.position === position)?.a.warnings ?? []}
          />
          {compared.map((c, i) => (
            <WarningList
              titled
              key={i}
              label={`Model warnings, ${loaded[i + 1] ? labelOf(loaded[i + 1] as Loaded) : ''}`}
              warnings={c.corners.find((x) => x.position === position)?.b.warnings ?? []}
            />
          ))}
          {compared[0] ? <p className="muted">{compared[0].valvingCaution}</p> : null}
        </>
      ) : null}
      {plots && loaded.length >= 2 ? (
        <p className="muted" data-testid="curve-note">
          Each revision’s curve is drawn over the one before, narrower and with its own dash, so that curves
          that coincide both show.
          {sameAsBaseline.length > 0
            ? ` At ${position}, ${sameAsBaseline.map(labelOf).join(' and ')} give${sameAsBaseline.length === 1 ? 's' : ''} the baseline’s figures exactly: its curves lie inside the baseline’s.`
            : ''}
        </p>
      ) : null}
      {plots && loaded.length >= 2 ? (
        <div className="plots">
          <LinePlot
            id={`compare-frf-body-accel-${position}`}
            title={`${position}: body acceleration per road displacement`}
            xLabel="frequency (Hz)"
            yLabel={`m/s² per ${len}`}
            series={plots.frf.accel}
            xLog
            yLog
          />
          <LinePlot
            id={`compare-frf-tire-load-${position}`}
            title={`${position}: dynamic tyre load per road displacement`}
            xLabel="frequency (Hz)"
            yLabel={`${force} per ${len}`}
            series={plots.frf.tire}
            xLog
            yLog
          />
          <LinePlot
            id={`compare-frf-travel-${position}`}
            title={`${position}: suspension travel per road displacement`}
            xLabel="frequency (Hz)"
            yLabel={`${len} per ${len}`}
            series={plots.frf.travel}
            xLog
            yLog
          />
          <LinePlot
            id={`compare-bump-body-accel-${position}`}
            title={`${position}: body acceleration over the bump (nonlinear)`}
            xLabel="time (s)"
            yLabel="m/s²"
            series={plots.bump.accel}
          />
          <LinePlot
            id={`compare-bump-travel-${position}`}
            title={`${position}: suspension travel over the bump, compression + (nonlinear)`}
            xLabel="time (s)"
            yLabel={len}
            series={plots.bump.travel}
          />
          <LinePlot
            id={`compare-bump-tire-load-${position}`}
            title={`${position}: tyre load over the bump (nonlinear)`}
            xLabel="time (s)"
            yLabel={force}
            series={plots.bump.tire}
          />
        </div>
      ) : null}
    </section>
  );
}
