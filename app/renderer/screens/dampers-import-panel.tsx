import { useEffect, useMemo, useRef, useState } from 'react';
import { InputError } from '../../../core/units/input-error';
import type { UnitSystem } from '../../../core/units/units';
import { ApiCallError, apiJob } from '../api-client';
import {
  KIND_ROLES,
  LIVE_CHECK_MAX_CHARS,
  ROLE_UNITS,
  benchHeaderUnit,
  benchImportInput,
  benchMappingCheck,
  benchMappingDefault,
  benchProblemText,
  benchRunFieldUnit,
  type BenchFilePreview,
  type BenchMapping,
} from '../bench-import-model';
import { ProgressLine } from '../components/status';
import { TextInputField } from '../components/text-input-field';
import { quantityFieldConvert } from '../quantity-field';
import type { Damper, ImportResult } from './dampers-shared';
import { offsetNote } from './dampers-shared';

const ROLE_WORDS = {
  velocity: 'Velocity',
  force: 'Force',
  time: 'Time',
  displacement: 'Displacement',
} as const;

/** The mapping step: preview the file, choose what its columns hold, then import it as a job. */
export function ImportPanel(props: {
  preview: BenchFilePreview;
  dampers: Damper[];
  units: UnitSystem;
  onClose: () => void;
  onImported: (r: ImportResult) => void;
}) {
  const { preview, units } = props;
  const [mapping, setMapping] = useState<BenchMapping>(() => benchMappingDefault(preview));
  const mappingUnits = useRef(units);
  const [job, setJob] = useState<{ stage: string; controller: AbortController } | null>(null);
  const [failure, setFailure] = useState<string | null>(null);

  useEffect(() => {
    if (mappingUnits.current === units) return;
    const from = mappingUnits.current;
    setMapping((m) => ({
      ...m,
      stroke: quantityFieldConvert(m.stroke, 'length', from, units),
      temperature: quantityFieldConvert(m.temperature, 'temperature', from, units),
      gasForce: quantityFieldConvert(m.gasForce, 'force', from, units),
    }));
    mappingUnits.current = units;
  }, [units]);

  const live = preview.text.length <= LIVE_CHECK_MAX_CHARS;
  const check = useMemo(
    () => (live ? benchMappingCheck(preview, mapping, mappingUnits.current) : null),
    [preview, mapping, live, units],
  );
  const problems = check && !check.ok ? check.problems : new Map<string, string>();
  const set = (patch: Partial<BenchMapping>) => {
    setFailure(null);
    setMapping((m) => ({ ...m, ...patch }));
  };
  const existing = props.dampers.find((d) => d.label.toLowerCase() === mapping.damper.trim().toLowerCase());

  const importNow = async () => {
    const controller = new AbortController();
    setFailure(null);
    setJob({ stage: 'starting', controller });
    try {
      const r = await apiJob('benchImport', benchImportInput(preview, mapping, mappingUnits.current), {
        signal: controller.signal,
        onProgress: (p) => setJob((j) => (j ? { ...j, stage: p.stage } : j)),
      });
      props.onImported(r);
    } catch (e) {
      setFailure(
        e instanceof ApiCallError && e.status === 499
          ? 'Import cancelled: nothing was stored.'
          : `Not imported, nothing was stored: ${benchProblemText(new InputError('', e instanceof Error ? e.message : String(e)))}`,
      );
    } finally {
      setJob(null);
    }
  };

  const text = (
    key: 'date' | 'stroke' | 'testFrequency' | 'temperature' | 'gasForce' | 'clicks' | 'notes',
    label: string,
    unit: string,
    placeholder?: string,
  ) => (
    <TextInputField
      key={key}
      id={`bench-${key}`}
      label={label}
      value={mapping[key]}
      unit={unit}
      problem={problems.get(key)}
      placeholder={placeholder}
      numeric={key === 'stroke' || key === 'testFrequency' || key === 'temperature' || key === 'gasForce'}
      onChange={(t) => set({ [key]: t })}
    />
  );

  return (
    <section className="import-panel" aria-label="Import a bench file">
      <h2>Import a bench file: {preview.name}</h2>
      <p className="muted">
        Header on line {preview.header.line}, {preview.header.cells.length} columns separated by{' '}
        {preview.header.delimiter === '\t'
          ? 'tabs'
          : preview.header.delimiter === ';'
            ? 'semicolons'
            : 'commas'}
        . The first rows:
      </p>
      <div className="preview">
        <table className="figures" aria-label="First rows of the file">
          <thead>
            <tr>
              {preview.header.cells.map((c, i) => (
                <th scope="col" key={i}>
                  {c}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {preview.rows.map((r, i) => (
              <tr key={i}>
                {r.map((c, k) => (
                  <td key={k}>{c}</td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="mapping">
        <fieldset>
          <legend>What the file holds</legend>
          <label>
            <input
              type="radio"
              name="bench-kind"
              checked={mapping.kind === 'points'}
              onChange={() => set({ kind: 'points' })}
            />{' '}
            A table of points (velocity, force)
          </label>
          <br />
          <label>
            <input
              type="radio"
              name="bench-kind"
              checked={mapping.kind === 'trace'}
              onChange={() => set({ kind: 'trace' })}
            />{' '}
            A raw trace (time, displacement, force)
          </label>
        </fieldset>
        <fieldset>
          <legend>Columns and units</legend>
          {KIND_ROLES[mapping.kind].map((role) => {
            const headerUnit = benchHeaderUnit(preview, mapping, role);
            const si = ROLE_UNITS[role][0] as string;
            return (
              <div className="field mapping-role" key={role}>
                <label htmlFor={`bench-column-${role}`}>{ROLE_WORDS[role]} column</label>
                <select
                  id={`bench-column-${role}`}
                  value={mapping.columns[role]}
                  onChange={(e) => set({ columns: { ...mapping.columns, [role]: e.target.value } })}
                >
                  <option value="">
                    {mapping.kind === 'points'
                      ? `Every “${role}” column, one run per clicker setting`
                      : `The “${role}” column`}
                  </option>
                  {preview.header.cells.map((c) => (
                    <option key={c} value={c}>
                      {c}
                    </option>
                  ))}
                </select>
                {headerUnit !== undefined ? (
                  <span className="unit" id={`bench-unit-${role}`}>
                    {headerUnit} (from the header)
                  </span>
                ) : (
                  <select
                    id={`bench-unit-${role}`}
                    aria-label={`${ROLE_WORDS[role]} unit`}
                    value={mapping.units[role]}
                    onChange={(e) => set({ units: { ...mapping.units, [role]: e.target.value } })}
                  >
                    <option value="">{si} (SI)</option>
                    {ROLE_UNITS[role].slice(1).map((x) => (
                      <option key={x} value={x}>
                        {x}
                      </option>
                    ))}
                  </select>
                )}
              </div>
            );
          })}
          <fieldset className="inner">
            <legend>Compression sign in the file</legend>
            <label>
              <input
                type="radio"
                name="bench-compression"
                checked={mapping.compression === 'positive'}
                onChange={() => set({ compression: 'positive' })}
              />{' '}
              Compression (bump) is positive
            </label>
            <br />
            <label>
              <input
                type="radio"
                name="bench-compression"
                checked={mapping.compression === 'negative'}
                onChange={() => set({ compression: 'negative' })}
              />{' '}
              Compression is negative (bump values below zero)
            </label>
          </fieldset>
        </fieldset>
        <fieldset>
          <legend>The run</legend>
          <TextInputField
            id="bench-damper"
            label="Damper unit (existing or new) *"
            value={mapping.damper}
            unit={mapping.damper.trim() ? (existing ? 'existing' : 'new') : ''}
            problem={problems.get('damper')}
            list="bench-damper-units"
            onChange={(t) => set({ damper: t })}
          />
          <datalist id="bench-damper-units">
            {props.dampers.map((d) => (
              <option key={d.id} value={d.label} />
            ))}
          </datalist>
          {text('clicks', 'Clicks', '', 'bump 3 rebound 6')}
          {text('date', 'Date', '', 'YYYY-MM-DD')}
          {text('stroke', 'Stroke', benchRunFieldUnit('stroke', units))}
          {text('testFrequency', 'Test frequency', benchRunFieldUnit('testFrequency', units))}
          {text('temperature', 'Temperature', benchRunFieldUnit('temperature', units))}
          {text('gasForce', 'Gas force in the readings', benchRunFieldUnit('gasForce', units))}
          {text('notes', 'Notes', '')}
          <label>
            <input
              type="checkbox"
              checked={mapping.again}
              onChange={(e) => set({ again: e.target.checked })}
            />{' '}
            Import again if this file is already stored for this unit
          </label>
        </fieldset>
      </div>
      <div className="check" aria-live="polite" data-testid="bench-check">
        {check === null ? (
          <p>This file is large: it is checked when imported.</p>
        ) : check.ok ? (
          <p className="status">
            Reads as {check.runs.length} run{check.runs.length === 1 ? '' : 's'}:{' '}
            {check.runs.map((r) => `${r.label} (${r.points} points, fitted in ${r.fitted})`).join('; ')}.
            {offsetNote(check.runs, units)}
          </p>
        ) : problems.has('file') ? (
          <p className="status error" role="alert">
            The file does not read this way: {problems.get('file')}
          </p>
        ) : (
          <p className="status error">Fix the marked fields to import.</p>
        )}
      </div>
      {job ? (
        <ProgressLine label={`Importing: ${job.stage}`} onCancel={() => job.controller.abort()} />
      ) : null}
      {failure ? (
        <p className="status error" role="alert">
          {failure}
        </p>
      ) : null}
      <div className="toolbar">
        <button
          type="button"
          className="primary"
          disabled={job !== null || (check !== null && !check.ok)}
          onClick={() => void importNow()}
        >
          Import
        </button>
        <button type="button" className="secondary" disabled={job !== null} onClick={props.onClose}>
          Close without importing
        </button>
      </div>
    </section>
  );
}
