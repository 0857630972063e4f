import type { UnitSystem } from '../../../../core/units';
import { quantityUnitLabel } from '../../../../core/units';
import { ROAD_CLASSES, type AnalysisOptionTexts } from '../../analysis-options';
import { TextInputField } from '../../components/text-input-field';

const OPTION_FIELDS: { key: keyof AnalysisOptionTexts; label: string; kind: 'speed' | 'length' }[] = [
  { key: 'roadSpeed', label: 'Road speed', kind: 'speed' },
  { key: 'bumpHeight', label: 'Bump height', kind: 'length' },
  { key: 'bumpLength', label: 'Bump length', kind: 'length' },
  { key: 'bumpSpeed', label: 'Bump speed', kind: 'speed' },
];

/** The road and the bump the figures are taken on, typed in the unit system's units. */
export function OptionsForm(props: {
  texts: AnalysisOptionTexts;
  units: UnitSystem;
  problems: Map<keyof AnalysisOptionTexts, string>;
  onChange: (texts: AnalysisOptionTexts) => void;
}) {
  const { texts, problems } = props;
  return (
    <fieldset className="analysis-options">
      <legend>Road and bump</legend>
      <div className="option-fields">
        <div className="field">
          <label htmlFor="analysis-road-class">Road class (ISO 8608)</label>
          <select
            id="analysis-road-class"
            value={texts.roadClass}
            onChange={(e) => props.onChange({ ...texts, roadClass: e.target.value })}
          >
            {ROAD_CLASSES.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
          <span className="unit" />
        </div>
        {OPTION_FIELDS.map((f) => (
          <TextInputField
            key={f.key}
            id={`analysis-${f.key}`}
            label={f.label}
            value={texts[f.key]}
            unit={quantityUnitLabel(f.kind, props.units)}
            problem={problems.get(f.key)}
            numeric
            onChange={(text) => props.onChange({ ...texts, [f.key]: text })}
          />
        ))}
      </div>
    </fieldset>
  );
}
