/**
 * A labelled text field with the unit it is read in beside it and, when it does not read, the
 * problem right under it (announced, and tied to the field by aria-describedby).
 */
export function TextInputField(props: {
  id: string;
  label: string;
  value: string;
  unit: string;
  problem?: string | undefined;
  placeholder?: string | undefined;
  list?: string | undefined;
  numeric?: boolean;
  onChange: (text: string) => void;
}) {
  const errorId = `${props.id}-error`;
  return (
    <div className="field">
      <label htmlFor={props.id}>{props.label}</label>
      <input
        id={props.id}
        inputMode={props.numeric ? 'decimal' : 'text'}
        value={props.value}
        placeholder={props.placeholder}
        list={props.list}
        aria-invalid={props.problem ? true : undefined}
        aria-describedby={props.problem ? errorId : undefined}
        onChange={(e) => props.onChange(e.target.value)}
      />
      <span className="unit">{props.unit}</span>
      {props.problem ? (
        <span className="error-text" id={errorId} role="alert">
          {props.problem}
        </span>
      ) : null}
    </div>
  );
}
