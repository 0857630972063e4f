import type { Draft } from './use-sheet-edit';

/**
 * Unsaved changes of an earlier visit: put back already (`restored`, when the sheet was left
 * for another screen), or kept with the shop's data and offered (after a reload).
 */
export function DraftNotice(props: {
  offer: Draft | null;
  restored: boolean;
  onRestore: () => void;
  onDiscard: () => void;
}) {
  if (!props.offer && !props.restored) return null;
  const discard = (
    <button type="button" className="secondary" onClick={props.onDiscard}>
      Discard them
    </button>
  );
  if (props.restored)
    return (
      <div className="status" role="status" data-testid="draft-restored">
        Your unsaved changes are back on the sheet. {discard}
      </div>
    );
  const d = props.offer as Draft;
  const base =
    d.basedOnRevision === undefined ? 'the first setup' : `a new revision after #${d.basedOnRevision}`;
  return (
    <div className="status" role="alert">
      Unsaved changes to {base} from {new Date(d.at).toLocaleString()} were kept.{' '}
      <button type="button" className="secondary" onClick={props.onRestore}>
        Restore them
      </button>{' '}
      {discard}
    </div>
  );
}
