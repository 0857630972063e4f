import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { apiCall } from '../../api-client';
import { sheetSaveConfirmingNewDampers } from './save-new-dampers';
import { useApp, type SheetOpen } from '../../app-context';
import { setupProblemText } from '../../setup-field-words';
import {
  setupFormBlank,
  setupFormConvert,
  setupFormFromFile,
  setupFormProblems,
  setupFormSet,
  setupFormToFile,
  type SetupForm,
} from '../../setup-form';

/** Unsaved changes, kept with the shop's data (setting `draft:<vehicle>`). */
export type Draft = { form: SetupForm; basedOnRevision?: number; at: string };
const draftKey = (vehicle: string) => `draft:${vehicle}`;

/**
 * The drafts of this page, by vehicle: what the sheet held when it was left for another
 * screen. A sheet opened again on the same revision takes it back at once, even before the
 * stored copy is written; after a reload only the stored copy remains, and is offered.
 */
const pageDrafts = new Map<string, Draft | null>();

/** The vehicle's newest revision number when a sheet last loaded, by the app's sheet it loaded for. */
const sheetSeen = new WeakMap<SheetOpen, number>();

/**
 * The revision a sheet coming back should start from: the newest one saved since it was last
 * here (elsewhere: another window, the command) in the line of its own revision — or its own.
 */
function revisionFollowed(
  revisions: readonly { number: number; parent: number | null }[],
  from: number,
  seen: number | undefined,
): number {
  if (seen === undefined) return from;
  const parentOf = new Map(revisions.map((r) => [r.number, r.parent]));
  const descends = (n: number) => {
    for (let p: number | null | undefined = n; typeof p === 'number'; p = parentOf.get(p))
      if (p === from) return true;
    return false;
  };
  const later = revisions.filter((r) => r.number > seen && r.number !== from && descends(r.number));
  return later.at(-1)?.number ?? from;
}

type UndoHistory = { stack: SetupForm[]; at: number; lastPath: string; lastTime: number };

/**
 * The sheet being edited: loading the revision it starts from (or a blank one), the draft
 * of unsaved changes, undo and redo, which problems to show, and saving. After a save the
 * sheet edits a new revision after the one just saved — in the app's state too, so that it
 * comes back so from other screens — and the next save's parent is that one.
 */
export function useSheetEdit(open: SheetOpen | null) {
  const app = useApp();
  const [form, setForm] = useState<SetupForm | null>(null);
  const [basedOn, setBasedOn] = useState<number | undefined>(undefined);
  const [baseName, setBaseName] = useState('');
  const [dirty, setDirty] = useState(false);
  const [error, setError] = useState<unknown>(null);
  const [message, setMessage] = useState('');
  const [draftOffer, setDraftOffer] = useState<Draft | null>(null);
  /** The draft this page kept was put back on the sheet when it opened again. */
  const [restored, setRestored] = useState(false);
  const [touched, setTouched] = useState<ReadonlySet<string>>(new Set());
  const [saveTried, setSaveTried] = useState(false);
  const history = useRef<UndoHistory>({ stack: [], at: -1, lastPath: '', lastTime: 0 });
  /** The sheet the app was pointed at by this sheet's own save: no reload is needed for it. */
  const followed = useRef<SheetOpen | null>(null);
  const pending = useRef<{ vehicle: string; draft: Draft } | null>(null);
  const units = useRef(app.units);
  units.current = app.units;

  const formIn = (f: SetupForm) => (f.system === units.current ? f : setupFormConvert(f, units.current));

  // Load the revision (or a blank sheet), then take back or offer a draft left unsaved.
  useEffect(() => {
    if (!open) return;
    if (followed.current === open) return;
    let gone = false;
    setForm(null);
    setRestored(false);
    setMessage('');
    setDirty(false);
    setTouched(new Set());
    setSaveTried(false);
    (async () => {
      let f: SetupForm;
      let name = '';
      let from = open.fromRevision;
      const here = pageDrafts.get(open.vehicle);
      let note = '';
      let newest: number | undefined;
      if (from !== undefined) {
        const h = await apiCall('setupHistory', { vehicle: open.vehicle });
        // A sheet coming back with no edits of its own follows what was saved after its revision meanwhile.
        const next =
          here?.basedOnRevision === from ? from : revisionFollowed(h.revisions, from, sheetSeen.get(open));
        newest = h.revisions.at(-1)?.number ?? from;
        if (next !== from) {
          note = `Revision #${next} was saved after #${from} meanwhile: the sheet now starts from #${next}.`;
          from = next;
        }
        const r = await apiCall('setupShow', { vehicle: open.vehicle, revision: from, units: units.current });
        f = setupFormFromFile(r.file, units.current);
        name = r.revision.name;
      } else {
        f = setupFormBlank(units.current, '');
      }
      const stored =
        here === undefined
          ? ((await apiCall('settingGet', { key: draftKey(open.vehicle) })).value as Draft | null)
          : here;
      if (gone) return;
      // Marked only by the load that stands (React may start this effect twice).
      if (newest !== undefined) sheetSeen.set(open, newest);
      history.current = { stack: [f], at: 0, lastPath: '', lastTime: 0 };
      setBasedOn(from);
      setBaseName(name);
      setMessage(note);
      if (from !== undefined && from !== open.fromRevision) {
        const moved: SheetOpen = { vehicle: open.vehicle, fromRevision: from };
        sheetSeen.set(moved, sheetSeen.get(open) ?? from);
        followed.current = moved;
        app.openSheet(moved);
      }
      if (here && here.basedOnRevision === open.fromRevision) {
        // Back from another screen: the sheet is as it was left.
        const back = formIn(here.form);
        history.current = { stack: [f, back], at: 1, lastPath: '', lastTime: 0 };
        setForm(back);
        setDirty(true);
        setDraftOffer(null);
        setRestored(true);
      } else {
        setForm(f);
        setDraftOffer(stored ?? null);
      }
    })().catch(setError);
    return () => {
      gone = true;
    };
    // Only a new sheet reloads; the unit system is applied by conversion below.
  }, [open]);

  // Units switch: convert in place.
  useEffect(() => {
    setForm((f) => (f && f.system !== app.units ? setupFormConvert(f, app.units) : f));
  }, [app.units]);

  const draftWrite = useCallback(() => {
    const p = pending.current;
    pending.current = null;
    if (p) void apiCall('settingSet', { key: draftKey(p.vehicle), value: p.draft }).catch(setError);
  }, []);

  // Keep a draft of unsaved changes with the shop's data, a moment after each change, and at once on leaving.
  useEffect(() => {
    if (!dirty || !form || !open) return;
    const draft: Draft = {
      form,
      ...(basedOn !== undefined ? { basedOnRevision: basedOn } : {}),
      at: new Date().toISOString(),
    };
    pending.current = { vehicle: open.vehicle, draft };
    pageDrafts.set(open.vehicle, draft);
    const t = setTimeout(draftWrite, 600);
    return () => clearTimeout(t);
  }, [form, dirty, basedOn, open, draftWrite]);
  useEffect(() => draftWrite, [draftWrite]);

  const draftDrop = useCallback((vehicle: string) => {
    pending.current = null;
    pageDrafts.set(vehicle, null);
    return apiCall('settingSet', { key: draftKey(vehicle), value: null });
  }, []);

  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  const change = useCallback((path: string, text: string) => {
    setForm((f) => {
      if (!f) return f;
      const next = setupFormSet(f, path, text);
      const h = history.current;
      const now = Date.now();
      // Typing in one field is one step of undo.
      if (h.lastPath === path && now - h.lastTime < 1500) h.stack[h.at] = next;
      else {
        h.stack = [...h.stack.slice(0, h.at + 1), next];
        h.at = h.stack.length - 1;
      }
      h.lastPath = path;
      h.lastTime = now;
      return next;
    });
    setTouched((t) => (t.has(path) ? t : new Set([...t, path])));
    setDirty(true);
    setMessage('');
  }, []);

  const step = useCallback((by: -1 | 1) => {
    const h = history.current;
    const f = h.stack[h.at + by];
    if (!f) return;
    h.at += by;
    h.lastPath = '';
    setForm(f.system === units.current ? f : setupFormConvert(f, units.current));
    setDirty(true);
  }, []);

  const problems = useMemo(() => (form ? setupFormProblems(form) : new Map<string, string>()), [form]);
  /** The problems shown: of the fields touched, or of every field once a save was tried; in words, not keys. */
  const shown = useMemo(() => {
    const out = new Map<string, string>();
    for (const [path, problem] of problems)
      if (saveTried || touched.has(path)) out.set(path, setupProblemText(path, problem));
    return out;
  }, [problems, touched, saveTried]);

  const save = useCallback(async () => {
    if (!form || !open) return;
    // An untouched sheet would only add a revision that says "no changes".
    if (!dirty && basedOn !== undefined) {
      setMessage(`Nothing to save: the sheet is as revision #${basedOn} has it.`);
      return;
    }
    setSaveTried(true);
    if (problems.size > 0) {
      setMessage(
        `Not saved: ${problems.size} field${problems.size === 1 ? ' needs' : 's need'} attention (marked).`,
      );
      return;
    }
    setError(null);
    try {
      const file = setupFormToFile(form);
      const r = await sheetSaveConfirmingNewDampers(file, (newDamperUnits) =>
        apiCall('setupSave', {
          file,
          vehicle: open.vehicle,
          ...(basedOn !== undefined ? { basedOnRevision: basedOn } : {}),
          units: form.system,
          ...(newDamperUnits.length > 0 ? { newDamperUnits } : {}),
        }),
      );
      if (r === null) {
        setMessage('Not saved: a damper unit the library does not have was not confirmed as new.');
        return;
      }
      await draftDrop(open.vehicle);
      const n = r.revision.number;
      setBasedOn(n);
      setBaseName(r.revision.name);
      setDirty(false);
      setDraftOffer(null);
      setRestored(false);
      setTouched(new Set());
      setSaveTried(false);
      setMessage(
        `Saved as revision #${n}${r.branched ? ` (a branch from #${r.revision.parent})` : ''}: ${r.revision.summary}`,
      );
      // The app now opens the sheet on the revision just saved: other screens and the way back agree.
      const next: SheetOpen = { vehicle: open.vehicle, fromRevision: n };
      followed.current = next;
      sheetSeen.set(next, n);
      app.openSheet(next);
      app.dataChanged();
    } catch (e) {
      setError(e);
    }
  }, [form, open, basedOn, dirty, problems, app, draftDrop]);

  const restoreDraft = useCallback(() => {
    if (!draftOffer) return;
    setForm(formIn(draftOffer.form));
    setBasedOn(draftOffer.basedOnRevision);
    setDirty(true);
    setDraftOffer(null);
  }, [draftOffer]);

  const discardDraft = useCallback(() => {
    if (open) void draftDrop(open.vehicle).catch(setError);
    setDraftOffer(null);
    if (restored) {
      // Back to the revision's own values.
      const base = history.current.stack[0];
      if (base) setForm(formIn(base));
      history.current = { stack: base ? [base] : [], at: base ? 0 : -1, lastPath: '', lastTime: 0 };
      setDirty(false);
      setRestored(false);
    }
  }, [open, draftDrop, restored]);

  return {
    form,
    basedOn,
    baseName,
    dirty,
    error,
    message,
    draftOffer,
    restored,
    problems: shown,
    history: history.current,
    change,
    step,
    save,
    restoreDraft,
    discardDraft,
  };
}
