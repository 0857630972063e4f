import { numberFormat } from '../../../../core/units/units';
import { VALVING_FLAT_RIDE } from '../../../../core/valving/valving-rank';

/** The usual flat-ride choice: rear ride frequency 10–20 % above the front [trade]. */
const FLAT_RIDE = VALVING_FLAT_RIDE;

/** The front/rear ride-frequency balance against the usual flat-ride choice. */
export function RideBalance(props: { front: number | null; rear: number | null }) {
  const { front, rear } = props;
  const ratio = front && rear ? rear / front : null;
  return (
    <p className="status" data-testid="balance">
      Front/rear ride frequency:{' '}
      {ratio && front && rear
        ? `front ${numberFormat(front, 2)} Hz, rear ${numberFormat(rear, 2)} Hz, rear ÷ front ${numberFormat(ratio, 2)} — ${
            ratio >= FLAT_RIDE.low && ratio <= FLAT_RIDE.high
              ? 'within the usual flat-ride choice (rear 10–20 % above front)'
              : ratio < FLAT_RIDE.low
                ? 'rear less than 10 % above front: the usual flat-ride choice is rear 10–20 % above, so that the car settles level after a bump'
                : 'rear more than 20 % above front: beyond the usual flat-ride choice of 10–20 %'
          } (common practice).`
        : 'appears when all four corners read.'}
    </p>
  );
}
