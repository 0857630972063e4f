import { useEffect, useMemo, useState } from 'react';
import { CORNER_POSITIONS, type CornerPosition } from '../../../core/setup/setup-sheet';
import { ApiCallError, apiCall } from '../api-client';
import { useApp } from '../app-context';
import { ErrorLine } from '../components/status';
import { menuCommandsListen, pagePrint } from '../native';
import { setupFieldLabel, setupProblemText } from '../setup-field-words';
import { TOP_FIELDS, formFields } from '../setup-form';
import { CornerCard } from './setup-sheet/corner-card';
import { axleFrequency, cornerLiveOf, type CornerLive } from './setup-sheet/corner-figures';
import { DraftNotice } from './setup-sheet/draft-notice';
import { PrintSheet } from './setup-sheet/print-sheet';
import { RideBalance } from './setup-sheet/ride-balance';
import { SheetField } from './setup-sheet/sheet-field';
import { useCornerDampers } from './setup-sheet/use-corner-dampers';
import { useSheetEdit } from './setup-sheet/use-sheet-edit';

/** Least time the printable sheet stays on screen (ms). */
const PRINT_VIEW_MS = 1500;
/** Longest wait for the damper curves' sources before printing without them (ms). */
const PRINT_WAIT_MS = 3000;

/** A failure from the store in the sheet's words: the field by its label, never its key. */
function SheetErrorLine(props: { error: unknown }) {
  const e = props.error;
  if (e instanceof ApiCallError && e.field) {
    const problem = e.message.startsWith(`${e.field}: `) ? e.message.slice(e.field.length + 2) : e.message;
    const text = setupProblemText(e.field, problem, true);
    return (
      <p className="status error" role="alert">
        {text === problem ? `${setupFieldLabel(e.field, true)}: ${problem}` : text}
      </p>
    );
  }
  return <ErrorLine error={e} />;
}

/** What the sheet holds, in words: which revision it starts from, and whether it is saved. */
function revisionTextOf(basedOn: number | undefined, name: string, dirty: boolean): string {
  if (basedOn === undefined) return 'First setup, not saved yet';
  const called = name ? ` “${name}”` : '';
  return dirty
    ? `Unsaved changes to a new revision after #${basedOn}${called}`
    : `Revision #${basedOn}${called}`;
}

/**
 * The setup sheet: four corners side by side and the vehicle fields, validated as you type,
 * with each corner's headline figures computed with the damper curve it runs (the bench's at
 * its clicks, or the one entered: the API says which). Save makes a new revision, and the
 * sheet then edits the next one after it; unsaved changes are kept as a draft with the shop's data.
 */
export function SetupEditor() {
  const app = useApp();
  const open = app.sheet;
  const sheet = useSheetEdit(open);
  const { form, basedOn, dirty } = sheet;
  const [printView, setPrintView] = useState(false);
  const [dampers, setDampers] = useState<string[]>([]);
  const curves = useCornerDampers(form, app.dataVersion);

  useEffect(() => {
    let gone = false;
    apiCall('benchList', {}).then(
      (list) => !gone && setDampers(list.dampers.map((d) => d.label)),
      () => {},
    );
    return () => {
      gone = true;
    };
  }, [app.dataVersion]);

  const live = useMemo(() => {
    const out = {} as Record<CornerPosition, CornerLive>;
    if (form) for (const p of CORNER_POSITIONS) out[p] = cornerLiveOf(form, p, curves[p]);
    return out;
  }, [form, curves]);

  const { save, step } = sheet;
  useEffect(
    () =>
      menuCommandsListen((c) => {
        if (c === 'save') void save();
        if (c === 'undo') step(-1);
        if (c === 'redo') step(1);
        if (c === 'print') setPrintView(true);
      }),
    [save, step],
  );

  // The printable sheet is drawn — once each curve's source is known, or after a wait — printed, and
  // stays on screen a moment (a quick PDF save would flash it).
  const asking = Object.values(live).some((l) => !('error' in l) && l.source.kind === 'asking');
  useEffect(() => {
    if (!printView) return;
    const shownAt = Date.now();
    let back: ReturnType<typeof setTimeout> | undefined;
    const t = setTimeout(
      () => {
        void pagePrint(`${open?.vehicle ?? 'setup'} ${form?.values.name ?? ''}.pdf`.trim()).finally(() => {
          back = setTimeout(() => setPrintView(false), Math.max(0, PRINT_VIEW_MS - (Date.now() - shownAt)));
        });
      },
      asking ? PRINT_WAIT_MS : 50,
    );
    return () => {
      clearTimeout(t);
      if (back) clearTimeout(back);
    };
  }, [printView, asking, open, form]);

  if (!open) {
    return (
      <section>
        <h2>Setup sheet</h2>
        <p>
          Open a vehicle’s history (Vehicles) and pick “New revision from …”, or “Enter the first setup” for a
          new vehicle.
        </p>
      </section>
    );
  }
  if (sheet.error && !form) return <SheetErrorLine error={sheet.error} />;
  if (!form) return <p>Loading the sheet…</p>;

  const revisionText = revisionTextOf(basedOn, sheet.baseName, dirty);
  if (printView)
    return <PrintSheet form={form} vehicle={open.vehicle} revisionText={revisionText} live={live} />;

  const at = sheet.history;
  const placed = new Set(formFields(form).map((f) => f.path));
  const unplaced = [...sheet.problems].filter(([path]) => !placed.has(path));

  return (
    <section aria-label="Setup sheet">
      <h2>
        Setup sheet — {open.vehicle}
        {basedOn !== undefined ? ` (new revision after #${basedOn})` : ' (first setup)'}
        {dirty ? ' • unsaved' : ''}
      </h2>
      <p className="muted" data-testid="sheet-revision">
        {basedOn === undefined
          ? 'Editing the first setup of this vehicle.'
          : `Editing a new revision after #${basedOn}${sheet.baseName ? ` “${sheet.baseName}”` : ''}; saving makes it the next revision.`}
      </p>
      <DraftNotice
        offer={sheet.draftOffer}
        restored={sheet.restored}
        onRestore={sheet.restoreDraft}
        onDiscard={sheet.discardDraft}
      />
      <div className="toolbar">
        <button type="button" className="primary" onClick={() => void save()}>
          Save as new revision
        </button>
        <button type="button" className="secondary" disabled={at.at <= 0} onClick={() => step(-1)}>
          Undo
        </button>
        <button
          type="button"
          className="secondary"
          disabled={at.at >= at.stack.length - 1}
          onClick={() => step(1)}
        >
          Redo
        </button>
        <button type="button" className="secondary" onClick={() => setPrintView(true)}>
          Print sheet / PDF
        </button>
        <span role="status" aria-live="polite">
          {sheet.message}
        </span>
      </div>
      <SheetErrorLine error={sheet.error} />
      {unplaced.length > 0 ? (
        <ul className="warning-list" aria-label="Problems of the sheet">
          {unplaced.map(([path, problem]) => (
            <li key={path}>
              {/^corners\.(FL|FR|RL|RR)\./.exec(path)?.[1] ?? 'Vehicle'}: {problem}
            </li>
          ))}
        </ul>
      ) : null}
      <datalist id="damper-units">
        {dampers.map((d) => (
          <option key={d} value={d} />
        ))}
      </datalist>
      <fieldset>
        <legend>Vehicle</legend>
        <div className="vehicle-fields">
          {TOP_FIELDS.map((spec) => (
            <SheetField
              key={spec.key}
              path={spec.key}
              spec={spec}
              form={form}
              problem={sheet.problems.get(spec.key)}
              onChange={sheet.change}
              idPrefix="top"
            />
          ))}
        </div>
      </fieldset>
      <RideBalance front={axleFrequency(live, 'FL', 'FR')} rear={axleFrequency(live, 'RL', 'RR')} />
      <div className="corners">
        {CORNER_POSITIONS.map((p) => (
          <CornerCard
            key={p}
            position={p}
            form={form}
            problems={sheet.problems}
            live={live[p]}
            onChange={sheet.change}
          />
        ))}
      </div>
    </section>
  );
}
