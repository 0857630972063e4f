import type { CornerPosition } from '../../../../core/setup/setup-sheet';
import { CORNER_FIELDS, damperDirectionTabulated, type SetupForm } from '../../setup-form';
import { CornerLivePanel, type CornerLive } from './corner-figures';
import { SheetField } from './sheet-field';

const CORNER_NAMES: Record<CornerPosition, string> = {
  FL: 'Front left',
  FR: 'Front right',
  RL: 'Rear left',
  RR: 'Rear right',
};

/** One corner of the sheet: its fields, then its live figures and where its damper curve comes from. */
export function CornerCard(props: {
  position: CornerPosition;
  form: SetupForm;
  problems: ReadonlyMap<string, string>;
  live: CornerLive;
  onChange: (path: string, text: string) => void;
}) {
  const { position: p, form } = props;
  return (
    <div className="corner-card" aria-label={`${CORNER_NAMES[p]} (${p})`} role="group">
      <h3>
        {CORNER_NAMES[p]} ({p})
      </h3>
      {CORNER_FIELDS.map((spec) => {
        const dir = /^corner\.damper\.(bump|rebound)\./.exec(spec.key)?.[1] as 'bump' | 'rebound' | undefined;
        if (dir && damperDirectionTabulated(form, p, dir)) {
          return spec.key.endsWith('lowSpeed') ? (
            <p key={spec.key} className="muted">
              {dir === 'bump' ? 'Bump' : 'Rebound'}: a tabulated bench curve (kept as loaded).
            </p>
          ) : null;
        }
        const path = `corners.${p}.${spec.key}`;
        return (
          <SheetField
            key={spec.key}
            path={path}
            spec={spec}
            form={form}
            problem={props.problems.get(path)}
            onChange={props.onChange}
            idPrefix={p}
            {...(spec.key === 'damperUnit' ? { list: 'damper-units' } : {})}
          />
        );
      })}
      <CornerLivePanel live={props.live} position={p} />
    </div>
  );
}
