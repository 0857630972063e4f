import { fieldUnitLabel, type FieldSpec, type SetupForm } from '../../setup-form';

/**
 * One field of the sheet with its unit. A problem is shown beside it only once it matters
 * (the field was touched, or a save was tried): an empty new sheet reads calmly, with the
 * required fields marked "*".
 */
export function SheetField(props: {
  path: string;
  spec: FieldSpec;
  form: SetupForm;
  problem: string | undefined;
  onChange: (path: string, text: string) => void;
  onLeave?: (path: string) => void;
  idPrefix: string;
  list?: string;
}) {
  const { path, spec, form } = props;
  const id = `${props.idPrefix}-${path.replace(/[^A-Za-z0-9]+/g, '-')}`;
  const unit = fieldUnitLabel(spec.kind, form.system);
  const value = form.values[path] ?? '';
  const errorId = `${id}-error`;
  const leave = () => props.onLeave?.(path);
  if (spec.kind === 'notes') {
    return (
      <div className="field wide">
        <label htmlFor={id}>{spec.label}</label>
        <textarea
          id={id}
          rows={2}
          value={value}
          onChange={(e) => props.onChange(path, e.target.value)}
          onBlur={leave}
        />
      </div>
    );
  }
  const wide = spec.kind === 'text' || spec.kind === 'date';
  return (
    <div className={wide ? 'field wide' : 'field'}>
      <label htmlFor={id}>
        {spec.label}
        {spec.required ? ' *' : ''}
      </label>
      <input
        id={id}
        name={path}
        value={value}
        inputMode={wide || spec.kind === 'toe' ? 'text' : 'decimal'}
        placeholder={spec.kind === 'date' ? 'YYYY-MM-DD' : spec.required ? 'required' : undefined}
        aria-required={spec.required ? true : undefined}
        aria-invalid={props.problem ? true : undefined}
        aria-describedby={props.problem ? errorId : undefined}
        list={props.list}
        onChange={(e) => props.onChange(path, e.target.value)}
        onBlur={leave}
      />
      {wide ? null : <span className="unit">{unit}</span>}
      {props.problem ? (
        <span className="error-text" id={errorId} role="alert">
          {props.problem}
        </span>
      ) : null}
    </div>
  );
}
