import { quantityUnitLabel, type QuantityKind, type UnitSystem } from '../../../../core/units/units';
import {
  TARGET_EDIT_OFF,
  type TargetEdit,
  type ValvingPreset,
  type ValvingPresets,
} from '../../valving-model';

/** The targets of the ranking, editable: band, weight, off, with each band's source. */
export function TargetsTable(props: {
  presets: ValvingPresets | null;
  preset: ValvingPreset | undefined;
  edits: Record<string, TargetEdit>;
  onEdits: (edits: Record<string, TargetEdit>) => void;
  units: UnitSystem;
}) {
  const { presets, edits, units } = props;
  return (
    <table className="figures" aria-label="Targets">
      <thead>
        <tr>
          <th scope="col">Target</th>
          <th scope="col">Low</th>
          <th scope="col">High</th>
          <th scope="col">Unit</th>
          <th scope="col">Weight</th>
          <th scope="col">Off</th>
          <th scope="col">Source</th>
        </tr>
      </thead>
      <tbody>
        {(presets?.targets ?? []).map((t) => {
          const e = edits[t.key] ?? TARGET_EDIT_OFF;
          const set = (patch: Partial<TargetEdit>) =>
            props.onEdits({ ...edits, [t.key]: { ...e, ...patch } });
          const source = props.preset?.targets[t.key]?.source;
          return (
            <tr key={t.key}>
              <th scope="row" style={{ textAlign: 'left' }}>
                {t.label}
              </th>
              <td>
                <input
                  aria-label={`${t.label}, low`}
                  size={7}
                  value={e.low}
                  disabled={e.off}
                  onChange={(x) => set({ low: x.target.value, band: true })}
                />
              </td>
              <td>
                <input
                  aria-label={`${t.label}, high`}
                  size={7}
                  value={e.high}
                  disabled={e.off}
                  onChange={(x) => set({ high: x.target.value, band: true })}
                />
              </td>
              <td>{t.kind ? quantityUnitLabel(t.kind as QuantityKind, units) : ''}</td>
              <td>
                <input
                  aria-label={`${t.label}, weight`}
                  size={4}
                  value={e.weight}
                  disabled={e.off}
                  onChange={(x) => set({ weight: x.target.value, weighted: true })}
                />
              </td>
              <td>
                <input
                  type="checkbox"
                  aria-label={`${t.label}, off`}
                  checked={e.off}
                  onChange={(x) => set({ off: x.target.checked })}
                />
              </td>
              <td className="muted" style={{ textAlign: 'left', fontSize: 13 }}>
                {source ? `[${source.tag}] ${source.text}` : '—'}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
