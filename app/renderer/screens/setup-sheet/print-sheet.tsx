import { CAUTION_TEXT } from '../../../../core/safety/caution';
import { CORNER_POSITIONS, type CornerPosition } from '../../../../core/setup/setup-sheet';
import { numberFormat } from '../../../../core/units/units';
import { CORNER_FIELDS, TOP_FIELDS, fieldUnitLabel, type SetupForm } from '../../setup-form';
import type { CornerLive } from './corner-figures';

/** Today and now as a sheet prints it: "2026-12-02 15:40". */
function printDateText(d: Date): string {
  const two = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${two(d.getMonth() + 1)}-${two(d.getDate())} ${two(d.getHours())}:${two(d.getMinutes())}`;
}

/**
 * The printable sheet: which revision it is, when it was printed, every field, the headline
 * figures with where each damper curve comes from, and the caution once. No inputs.
 */
export function PrintSheet(props: {
  form: SetupForm;
  vehicle: string;
  /** What the sheet holds: "Revision #7", "Unsaved changes to a new revision after #7", … */
  revisionText: string;
  live: Record<CornerPosition, CornerLive>;
}) {
  const { form } = props;
  const v = (path: string) => form.values[path] ?? '';
  const unitOf = (kind: Parameters<typeof fieldUnitLabel>[0]) => fieldUnitLabel(kind, form.system);
  const perCorner = (cell: (l: Exclude<CornerLive, { error: string }>) => string) =>
    CORNER_POSITIONS.map((p) => {
      const l = props.live[p];
      return <td key={p}>{'error' in l ? '—' : cell(l)}</td>;
    });
  return (
    <section className="print-sheet" aria-label="Setup sheet for printing">
      <h2>
        {props.vehicle} — {v('name')}
      </h2>
      <p data-testid="print-revision">
        {props.revisionText} · printed {printDateText(new Date())}
      </p>
      <p>
        {TOP_FIELDS.filter((f) => f.key !== 'name')
          .map(
            (f) => `${f.label}: ${v(f.key) || '—'}${v(f.key) && unitOf(f.kind) ? ` ${unitOf(f.kind)}` : ''}`,
          )
          .join(' · ')}
      </p>
      <table className="figures">
        <thead>
          <tr>
            <th scope="col">Field</th>
            {CORNER_POSITIONS.map((p) => (
              <th scope="col" key={p}>
                {p}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {CORNER_FIELDS.map((f) => (
            <tr key={f.key}>
              <td>
                {f.label} {unitOf(f.kind) ? `(${unitOf(f.kind)})` : ''}
              </td>
              {CORNER_POSITIONS.map((p) => (
                <td key={p}>{v(`corners.${p}.${f.key}`) || '—'}</td>
              ))}
            </tr>
          ))}
          <tr>
            <td>Ride frequency (Hz)</td>
            {perCorner((l) => numberFormat(l.figures.rideFrequencyHz, 2))}
          </tr>
          <tr>
            <td>ζ bump / rebound</td>
            {perCorner(
              (l) =>
                `${numberFormat(l.figures.dampingRatio.bump, 2)} / ${numberFormat(l.figures.dampingRatio.rebound, 2)}`,
            )}
          </tr>
          <tr>
            <td>Damper curve from</td>
            {perCorner((l) => l.source.text)}
          </tr>
        </tbody>
      </table>
      <p className="muted">Caution: {CAUTION_TEXT}</p>
    </section>
  );
}
