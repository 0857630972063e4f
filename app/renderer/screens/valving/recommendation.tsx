import { scenarioText } from '../../scenario-model';
import { CAUTION_TEXT } from '../../../../core/safety/caution';
import { numberFormat, type UnitSystem } from '../../../../core/units/units';
import { VALVING_HEADLINES } from '../../../../core/valving/valving-rank';
import type { TargetKinds, ValvingChoice } from '../../valving-model';
import { PickDetail } from './valving-pick';

/** The ranking's answer: the best clicks of each corner, the clicks as set now, the front/rear balance. */
export function Recommendation(props: {
  choice: ValvingChoice & { units: UnitSystem };
  units: UnitSystem;
  kinds: TargetKinds;
}) {
  const { choice, units, kinds } = props;
  return (
    <section aria-label="Recommendation" data-testid="recommendation">
      <h3>
        Starting points for testing on the car — {choice.vehicle.name} #{choice.revision},{' '}
        {choice.preset.title}
      </h3>
      <div className="caution-line" role="note" aria-label="Caution beside the recommendation">
        <strong>Caution:</strong> {CAUTION_TEXT} {choice.valvingCaution}
      </div>
      <p className="muted">
        {choice.combinations} combinations evaluated on {scenarioText(choice.scenario, units)}.{' '}
        {choice.objective}
        {choice.units !== units
          ? ` The model warnings below are written in ${choice.units === 'si' ? 'SI' : 'US'} units, as when the clicks were ranked: rank again to rewrite them.`
          : ''}
      </p>
      {choice.corners.map((c) => (
        <div key={c.position} className="corner-result">
          <h3>
            {c.position} with {c.damper}: {c.meetingAll} combination{c.meetingAll === 1 ? '' : 's'} meet every
            target
          </h3>
          {c.best.map((b) => (
            <PickDetail key={b.cell} pick={b} units={units} kinds={kinds} title={`#${b.rank}`} />
          ))}
          {c.current ? (
            <PickDetail
              pick={c.current}
              units={units}
              kinds={kinds}
              title={`As set now (rank ${c.current.rank} of ${c.evaluated})`}
            />
          ) : null}
        </div>
      ))}
      {choice.balance ? (
        <p className="status">
          Front/rear balance of the best picks: ride frequency rear ÷ front{' '}
          {numberFormat(choice.balance.ratio.rideFrequency, 2)} (
          {choice.balance.flatRide.met ? 'within' : 'outside'} the usual flat-ride{' '}
          {numberFormat(choice.balance.flatRide.low, 2)}–{numberFormat(choice.balance.flatRide.high, 2)}); ζ
          low-speed mean rear ÷ front {numberFormat(choice.balance.ratio.lowSpeedMean, 2)}.{' '}
          {VALVING_HEADLINES.rideFrequencyHz.label} does not change with clicks.
        </p>
      ) : null}
    </section>
  );
}
