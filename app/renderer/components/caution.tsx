import { CAUTION_TEXT } from '../../../core/safety/caution';

/** The short caution every analysis and comparison screen carries. */
export function CautionLine() {
  return (
    <div className="caution-line" role="note" aria-label="Caution">
      <strong>Caution:</strong> figures from a simplified model. Confirm every change on the vehicle with a
      qualified vehicle or suspension engineer; stay within the damper and spring makers&apos; limits and the
      sanctioning body&apos;s rules.{' '}
      <details style={{ display: 'inline' }}>
        <summary style={{ display: 'inline', cursor: 'pointer', textDecoration: 'underline' }}>
          Full text
        </summary>
        <span> {CAUTION_TEXT}</span>
      </details>
    </div>
  );
}

/** Model warnings as a list; nothing when there are none. */
export function WarningList(props: {
  warnings: readonly { code: string; message: string; position?: string }[];
  label?: string;
  /** Show the label as a heading above the list (where several lists stand together). */
  titled?: boolean;
}) {
  if (props.warnings.length === 0) return null;
  const list = (
    <ul className="warning-list" aria-label={props.label ?? 'Model warnings'}>
      {props.warnings.map((w, i) => (
        <li key={`${w.code}-${w.position ?? ''}-${i}`} data-warning={w.code}>
          {w.position ? <strong>{w.position}: </strong> : null}
          {w.message}
        </li>
      ))}
    </ul>
  );
  if (!props.titled) return list;
  return (
    <div>
      <h3>{props.label ?? 'Model warnings'}</h3>
      {list}
    </div>
  );
}
