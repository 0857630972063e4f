import { ApiCallError } from '../api-client';
import { messagePlain } from '../plain-words';

/** A line saying what went wrong, in words, with the field where there is one. */
export function ErrorLine(props: { error: unknown }) {
  if (!props.error) return null;
  const e = props.error;
  const field = (e as { field?: unknown }).field;
  const text =
    e instanceof ApiCallError
      ? e.message
      : messagePlain(
          e instanceof Error ? e.message : String(e),
          typeof field === 'string' ? field : undefined,
        );
  return (
    <p className="status error" role="alert">
      {text}
    </p>
  );
}

/** Progress of a long job, with a way to stop it. */
export function ProgressLine(props: { label: string; fraction?: number; onCancel?: () => void }) {
  return (
    <div className="progress" role="status" aria-live="polite">
      <span>{props.label}</span>
      <progress aria-label={props.label} max={1} value={props.fraction} />
      {props.onCancel ? (
        <button type="button" className="secondary" onClick={props.onCancel}>
          Cancel
        </button>
      ) : null}
    </div>
  );
}
