import { useId } from 'react';
import { CORNER_POSITIONS, type CornerPosition } from '../../../core/setup/setup-sheet';

/** One corner of the four, as a radio group. */
export function CornerChoice(props: {
  value: CornerPosition;
  onChange: (p: CornerPosition) => void;
  legend?: string;
}) {
  const id = useId();
  return (
    <fieldset className="toolbar inline-fieldset">
      <legend>{props.legend ?? 'Corner'}</legend>
      {CORNER_POSITIONS.map((p) => (
        <label key={p}>
          <input
            type="radio"
            name={`${id}-corner`}
            checked={props.value === p}
            onChange={() => props.onChange(p)}
          />{' '}
          {p}
        </label>
      ))}
    </fieldset>
  );
}

/** A valving preset by name, from the presets the backend lists. */
export function PresetChoice(props: {
  label: string;
  value: string;
  presets: readonly { name: string; title: string }[];
  onChange: (name: string) => void;
}) {
  const id = useId();
  return (
    <>
      <label htmlFor={`${id}-preset`}>{props.label}</label>
      <select id={`${id}-preset`} value={props.value} onChange={(e) => props.onChange(e.target.value)}>
        {props.presets.map((p) => (
          <option key={p.name} value={p.name}>
            {p.title}
          </option>
        ))}
      </select>
    </>
  );
}
