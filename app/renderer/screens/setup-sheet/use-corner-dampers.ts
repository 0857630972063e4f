import { useEffect, useMemo, useState } from 'react';
import type { CornerPosition } from '../../../../core/setup/setup-sheet';
import { apiCall } from '../../api-client';
import type { CornerDamper } from '../../revision-dampers';
import { setupFormDamperRefs, type SheetDamperRef } from '../../setup-field-words';
import type { SetupForm } from '../../setup-form';

/** A pause in typing before the bench library is asked again (ms). */
const ASK_DELAY_MS = 200;

/** What decides a corner's curve: the damper unit and the clicks (the corner's own fields only add the warning). */
const curveKeyOf = (r: Pick<SheetDamperRef, 'damperUnit' | 'clicks'>) =>
  JSON.stringify([r.damperUnit.trim().toLowerCase(), r.clicks]);

/** A corner's answer from the API, and the damper unit and clicks it answered for. */
export type SheetCornerDamper = { damper: CornerDamper; current: boolean };

/**
 * Which damper curve each corner of the sheet being edited runs, asked of the API (the one
 * place that decides it) a moment after the damper unit, clicks or corner change. An answer
 * is `current` while the unit and clicks it was given are still those on the sheet.
 */
export function useCornerDampers(
  form: SetupForm | null,
  dataVersion: number,
): Partial<Record<CornerPosition, SheetCornerDamper>> {
  const refs = useMemo(() => (form ? setupFormDamperRefs(form) : []), [form]);
  const ask = JSON.stringify(refs);
  const [answers, setAnswers] = useState<
    Partial<Record<CornerPosition, { key: string; damper: CornerDamper }>>
  >({});
  useEffect(() => {
    const corners = JSON.parse(ask) as SheetDamperRef[];
    if (corners.length === 0) return;
    let gone = false;
    const t = setTimeout(() => {
      apiCall('setupDampers', { corners }).then(
        (r) => {
          if (gone) return;
          const next: Partial<Record<CornerPosition, { key: string; damper: CornerDamper }>> = {};
          r.dampers.forEach((d, i) => {
            next[d.position] = { key: curveKeyOf(corners[i] as SheetDamperRef), damper: d };
          });
          setAnswers((old) => ({ ...old, ...next }));
        },
        // A corner the API cannot read keeps its entered curve; the sheet marks the field itself.
        () => {},
      );
    }, ASK_DELAY_MS);
    return () => {
      gone = true;
      clearTimeout(t);
    };
  }, [ask, dataVersion]);
  const out: Partial<Record<CornerPosition, SheetCornerDamper>> = {};
  for (const r of refs) {
    const a = answers[r.position];
    if (a) out[r.position] = { damper: a.damper, current: a.key === curveKeyOf(r) };
  }
  return out;
}
