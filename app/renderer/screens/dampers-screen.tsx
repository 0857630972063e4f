import { useEffect, useState } from 'react';
import { apiCall } from '../api-client';
import { useApp } from '../app-context';
import { benchFilePreview, type BenchFilePreview } from '../bench-import-model';
import { CautionLine } from '../components/caution';
import { ErrorLine } from '../components/status';
import { benchRunLabel } from '../damper-model';
import { textFilePick } from '../file-pick';
import type { Damper, ImportResult } from './dampers-shared';
import { UnitDetail } from './dampers-unit-detail';
import { ImportPanel } from './dampers-import-panel';

/**
 * The damper library: units and their bench runs, force–velocity curves with the fitted curve
 * over the measured points, the resulting ζ at a corner, and the import of a bench file through
 * a mapping step.
 */
export function DampersScreen() {
  const app = useApp();
  const [dampers, setDampers] = useState<Damper[] | null>(null);
  const [selected, setSelected] = useState<string | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [preview, setPreview] = useState<BenchFilePreview | null>(null);
  const [imported, setImported] = useState<ImportResult | null>(null);
  const [highlight, setHighlight] = useState<number[]>([]);

  useEffect(() => {
    apiCall('benchList', {}).then((r) => {
      setDampers(r.dampers);
      setSelected((s) => s ?? r.dampers.find((d) => d.runCount > 0)?.label ?? r.dampers[0]?.label ?? null);
    }, setError);
  }, [app.dataVersion]);

  const pickFile = async () => {
    setError(null);
    const file = await textFilePick({
      accept: '.csv,.txt,.tsv',
      title: 'Import a bench file',
      filterName: 'Bench file (CSV)',
      extensions: ['csv', 'txt', 'tsv'],
    });
    if (!file) return;
    setImported(null);
    setPreview(benchFilePreview(file.name, file.content));
  };

  const damper = dampers?.find((d) => d.label === selected) ?? null;
  return (
    <div className="two-col">
      <aside aria-label="Damper units">
        <h2>Dampers</h2>
        <div className="toolbar">
          <button type="button" className="primary" onClick={() => void pickFile().catch(setError)}>
            Import a bench file…
          </button>
        </div>
        <ErrorLine error={error} />
        {dampers && dampers.length === 0 ? <p>No damper unit yet: import a bench file.</p> : null}
        <ul className="list">
          {(dampers ?? []).map((d) => (
            <li key={d.id}>
              <button type="button" aria-current={selected === d.label} onClick={() => setSelected(d.label)}>
                <strong>{d.label}</strong>
                <br />
                <span className="muted">
                  {d.kind || 'no type'} · {d.runCount} run{d.runCount === 1 ? '' : 's'}
                  {d.lastRunDate ? ` · last ${d.lastRunDate}` : ''}
                </span>
              </button>
            </li>
          ))}
        </ul>
      </aside>
      <div>
        <CautionLine />
        {imported ? (
          <div className="status" role="status" data-testid="bench-imported">
            Stored {imported.runs.length} run{imported.runs.length === 1 ? '' : 's'} for{' '}
            {imported.damper.label}
            {imported.damperCreated ? ' (a new unit)' : ''}:{' '}
            {imported.runs.map((r) => benchRunLabel(r)).join(', ')}.
            {imported.warnings.length ? (
              <ul className="warning-list" aria-label="Import warnings">
                {imported.warnings.map((w, i) => (
                  <li key={i}>{w}</li>
                ))}
              </ul>
            ) : null}
          </div>
        ) : null}
        {preview && dampers ? (
          <ImportPanel
            key={`${preview.name}-${preview.text.length}`}
            preview={preview}
            dampers={dampers}
            units={app.units}
            onClose={() => setPreview(null)}
            onImported={(r) => {
              setPreview(null);
              setImported(r);
              setSelected(r.damper.label);
              setHighlight(r.runs.map((x) => x.id));
              app.dataChanged();
            }}
          />
        ) : null}
        {damper ? <UnitDetail damper={damper} units={app.units} highlight={highlight} /> : null}
      </div>
    </div>
  );
}
