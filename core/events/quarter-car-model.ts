import { bumpStopInterpolant } from '../damper/bump-stop';
import { STANDARD_GRAVITY, cornerWheelRate, type CornerInput } from '../corner/corner';
import { cubicHermiteAt, type CubicHermite } from '../numeric/cubic-hermite';
import { damperTableInterpolant, type DamperDirectionCurve } from '../damper/damper-curve';
import type { OdeSystem } from '../numeric/integrator';
import { roadPieceAt, type RoadProfile } from './road';

/** One damper direction ready for the loop: slopes and knee, or the table's interpolant. */
type DirectionLoop = { knee: number; low: number; high: number; table: CubicHermite | null };

function directionLoopOf(d: DamperDirectionCurve): DirectionLoop {
  switch (d.kind) {
    case 'linear':
      return { knee: Infinity, low: d.coefficient, high: d.coefficient, table: null };
    case 'bilinear':
      return { knee: d.kneeSpeed, low: d.lowSpeed, high: d.highSpeed, table: null };
    case 'table':
      // A table is smooth (C¹) across its points: one region, no knee to locate.
      return { knee: Infinity, low: 0, high: 0, table: damperTableInterpolant(d.points) };
  }
}

/** Force magnitude of a direction at speed u by the formula of the region below (false) or above the knee. */
function directionForce(d: DirectionLoop, u: number, aboveKnee: boolean): number {
  if (d.table) return cubicHermiteAt(d.table, u);
  return aboveKnee ? d.low * d.knee + d.high * (u - d.knee) : d.low * u;
}

/** Outputs of the model at one instant (QuarterCarEventModel.outputs), in this order. */
export const OUTPUT = {
  bodyAccel: 0,
  bodyDisplacement: 1,
  wheelDisplacement: 2,
  travel: 3,
  damperVelocity: 4,
  tireLoad: 5,
  bumpStopForce: 6,
  roadHeight: 7,
  bodyVelocity: 8,
  wheelVelocity: 9,
} as const;
/** How many outputs QuarterCarEventModel.outputs writes. */
export const OUTPUT_COUNT = 10;

/**
 * The nonlinear quarter car of DESIGN.md (Conventions, Nonlinear events) as an OdeSystem.
 * States [zs, zu, vs, vu] from static equilibrium; x = zu − zs, compression positive; damper
 * velocity = MRd·ẋ and force at the wheel = MRd × damper force; bump stop and rebound limit at
 * the damper; suspension force beyond ms·g: kw·x + MRd·(F_damper + F_bump stop − F_top-out);
 * tyre force kt·(δ0 + zr − zu) + ct·(żr − żu), never below 0, zero once the tyre has left the
 * road, δ0 = M·g/kt. Gravity's ms·g is carried by the static preload (spring plus gas force).
 *
 * Modes — tyre in contact, bump stop touching, top-out touching, damper region (rebound above
 * or below the knee, bump below or above), road piece — are frozen within a step and switched
 * where the integrator locates their boundary. Switch values, in order: tyre on the road
 * (N), bump-stop gap (m), rebound travel left (m), damper velocity above the region's lower
 * bound and below its upper bound (m/s).
 */
export class QuarterCarEventModel implements OdeSystem {
  readonly dimension = 4;
  readonly switchCount = 5;
  readonly sprungMass: number;
  readonly unsprungMass: number;
  readonly wheelRate: number;
  readonly damperMotionRatio: number;
  readonly tireRate: number;
  readonly tireDamping: number;
  /** M·g (N): the static tyre load. */
  readonly staticTireLoad: number;
  readonly speed: number;
  readonly road: RoadProfile;
  private readonly bump: DirectionLoop;
  private readonly rebound: DirectionLoop;
  /** Region bounds of damper velocity: −∞, −rebound knee, 0, bump knee, +∞. */
  private readonly bounds: Float64Array;
  private readonly stopGap: number;
  private readonly stopRate: number;
  private readonly stopCurve: CubicHermite | null;
  private readonly hasStop: boolean;
  private readonly topTravel: number;
  private readonly topRate: number;
  private readonly hasTop: boolean;

  /** Mode: tyre on the road. */
  contact = true;
  /** Mode: bump stop touching. */
  stopOn = false;
  /** Mode: past the rebound limit (topped out). */
  topOn = false;
  /** Mode: damper region 0 rebound above the knee, 1 rebound below, 2 bump below, 3 bump above. */
  region = 2;
  /** Mode: road piece. */
  piece = 0;

  // The tyre at the last `tireAt`: kt·δ (N), δ̇ (m/s) and kt·δ + ct·δ̇ (N).
  private tireDeflectionForce = 0;
  private tireDeflectionRate = 0;
  private tireForce = 0;

  constructor(corner: CornerInput, road: RoadProfile, speed: number) {
    this.sprungMass = corner.cornerMass - corner.unsprungMass;
    this.unsprungMass = corner.unsprungMass;
    this.wheelRate = cornerWheelRate(corner);
    this.damperMotionRatio = corner.damperMotionRatio;
    this.tireRate = corner.tireRate;
    this.tireDamping = corner.tireDamping;
    this.staticTireLoad = corner.cornerMass * STANDARD_GRAVITY;
    this.road = road;
    this.speed = speed;
    this.bump = directionLoopOf(corner.damper.bump);
    this.rebound = directionLoopOf(corner.damper.rebound);
    this.bounds = Float64Array.from([-Infinity, -this.rebound.knee, 0, this.bump.knee, Infinity]);
    const b = corner.bumpStop;
    this.hasStop = b !== undefined;
    this.stopGap = b ? b.gap : 0;
    this.stopRate = b && 'rate' in b ? b.rate : 0;
    this.stopCurve = b && 'curve' in b ? bumpStopInterpolant(b.curve) : null;
    const r = corner.reboundLimit;
    this.hasTop = r !== undefined;
    this.topTravel = r ? r.travel : 0;
    this.topRate = r ? r.rate : 0;
  }

  /** Sets every mode from the state at time t, as the physics says it is there. */
  modesFrom(t: number, y: ArrayLike<number>): void {
    const s = this.speed * t;
    this.piece = roadPieceAt(this.road, s);
    const zu = y[1] as number;
    const xd = this.damperMotionRatio * (zu - (y[0] as number));
    const vd = this.damperMotionRatio * ((y[3] as number) - (y[2] as number));
    this.tireAt(s, this.piece, zu, y[3] as number);
    this.contact = Math.min(this.tireDeflectionForce, this.tireForce) > 0;
    this.stopOn = this.hasStop && xd > this.stopGap;
    this.topOn = this.hasTop && -xd > this.topTravel;
    this.region = this.regionOf(vd);
  }

  /**
   * The tyre at distance s on `piece` with the wheel at zu, vu: kt·δ, δ̇ and kt·δ + ct·δ̇, with
   * δ = δ0 + zr − zu. It presses on the road while both forces are above zero.
   */
  private tireAt(s: number, piece: number, zu: number, vu: number): void {
    this.tireDeflectionForce = this.staticTireLoad + this.tireRate * (this.road.heightIn(piece, s) - zu);
    this.tireDeflectionRate = this.speed * this.road.slopeIn(piece, s) - vu;
    this.tireForce = this.tireDeflectionForce + this.tireDamping * this.tireDeflectionRate;
  }

  /** The damper region that holds damper velocity vd: bounds[r] ≤ vd < bounds[r + 1]. */
  private regionOf(vd: number): number {
    let region = 1;
    while (region < 3 && vd >= (this.bounds[region + 1] as number)) region++;
    while (region > 0 && vd < (this.bounds[region] as number)) region--;
    return region;
  }

  /** Damper force (N, compression positive) at damper velocity vd by the formula of `region`. */
  private damperInRegion(region: number, vd: number): number {
    switch (region) {
      case 3:
        return directionForce(this.bump, vd, true);
      case 2:
        return directionForce(this.bump, vd, false);
      case 1:
        return -directionForce(this.rebound, -vd, false);
      default:
        return -directionForce(this.rebound, -vd, true);
    }
  }

  private stopForceAt(squeeze: number): number {
    return this.stopCurve ? cubicHermiteAt(this.stopCurve, squeeze) : this.stopRate * squeeze;
  }

  /**
   * Suspension force beyond the static ms·g at the wheel (N, compression positive) for travel
   * x and damper velocity vd, by the formulas of the given damper region and stop contacts.
   */
  private suspensionForce(x: number, vd: number, region: number, stopOn: boolean, topOn: boolean): number {
    const mr = this.damperMotionRatio;
    const xd = mr * x;
    let damper = this.damperInRegion(region, vd);
    if (stopOn) damper += this.stopForceAt(xd - this.stopGap);
    if (topOn) damper -= this.topRate * (-xd - this.topTravel);
    return this.wheelRate * x + mr * damper;
  }

  derivative(t: number, y: Float64Array, dydt: Float64Array): void {
    const zs = y[0] as number;
    const zu = y[1] as number;
    const vs = y[2] as number;
    const vu = y[3] as number;
    const vd = this.damperMotionRatio * (vu - vs);
    const suspension = this.suspensionForce(zu - zs, vd, this.region, this.stopOn, this.topOn);
    let tire = -this.staticTireLoad;
    if (this.contact) {
      const s = this.speed * t;
      const zr = this.road.heightIn(this.piece, s);
      const vr = this.speed * this.road.slopeIn(this.piece, s);
      tire = this.tireRate * (zr - zu) + this.tireDamping * (vr - vu);
    }
    dydt[0] = vs;
    dydt[1] = vu;
    dydt[2] = suspension / this.sprungMass;
    dydt[3] = (tire - suspension) / this.unsprungMass;
  }

  switches(t: number, y: Float64Array, g: Float64Array): void {
    const zu = y[1] as number;
    const mr = this.damperMotionRatio;
    const xd = mr * (zu - (y[0] as number));
    const vd = mr * ((y[3] as number) - (y[2] as number));
    this.tireAt(this.speed * t, this.piece, zu, y[3] as number);
    const onRoad = Math.min(this.tireDeflectionForce, this.tireForce);
    g[0] = this.contact ? onRoad : -onRoad;
    g[1] = this.hasStop ? (this.stopOn ? xd - this.stopGap : this.stopGap - xd) : Infinity;
    g[2] = this.hasTop ? (this.topOn ? -xd - this.topTravel : this.topTravel + xd) : Infinity;
    g[3] = vd - (this.bounds[this.region] as number);
    g[4] = (this.bounds[this.region + 1] as number) - vd;
  }

  switchRates(t: number, y: Float64Array, dydt: Float64Array, rates: Float64Array): void {
    const zu = y[1] as number;
    const vs = y[2] as number;
    const vu = y[3] as number;
    const mr = this.damperMotionRatio;
    const xdRate = mr * (vu - vs);
    const vdRate = mr * ((dydt[3] as number) - (dydt[2] as number));
    const s = this.speed * t;
    this.tireAt(s, this.piece, zu, vu);
    const deflectionRate = this.tireDeflectionRate;
    // The rate of whichever of kt·δ and kt·δ + ct·δ̇ is the smaller, as `switches` takes it.
    const onRoadRate =
      this.tireDeflectionForce <= this.tireForce
        ? this.tireRate * deflectionRate
        : this.tireRate * deflectionRate +
          this.tireDamping *
            (this.speed * this.speed * this.road.curvatureIn(this.piece, s) - (dydt[3] as number));
    rates[0] = this.contact ? onRoadRate : -onRoadRate;
    rates[1] = this.stopOn ? xdRate : -xdRate;
    rates[2] = this.topOn ? -xdRate : xdRate;
    rates[3] = vdRate;
    rates[4] = -vdRate;
  }

  switchCross(index: number): void {
    switch (index) {
      case 0:
        this.contact = !this.contact;
        break;
      case 1:
        this.stopOn = !this.stopOn;
        break;
      case 2:
        this.topOn = !this.topOn;
        break;
      case 3:
        this.region--;
        break;
      default:
        this.region++;
    }
  }

  nextStop(): number {
    const b = this.road.breaks;
    return this.piece < b.length ? (b[this.piece] as number) / this.speed : Infinity;
  }

  stopReach(): void {
    this.piece++;
  }

  /**
   * The physical outputs at (t, y) (not the frozen modes', so they are exact at any instant),
   * with the road evaluated on `piece`; written into `out` by the OUTPUT indices. Tyre load is
   * the total load (N); bump-stop force is at the damper (N).
   */
  outputs(t: number, y: ArrayLike<number>, piece: number, out: Float64Array): void {
    const zs = y[0] as number;
    const zu = y[1] as number;
    const vs = y[2] as number;
    const vu = y[3] as number;
    const mr = this.damperMotionRatio;
    const x = zu - zs;
    const xd = mr * x;
    const vd = mr * (vu - vs);
    const stopOn = this.hasStop && xd > this.stopGap;
    const topOn = this.hasTop && -xd > this.topTravel;
    const suspension = this.suspensionForce(x, vd, this.regionOf(vd), stopOn, topOn);
    const stop = stopOn ? this.stopForceAt(xd - this.stopGap) : 0;
    const s = this.speed * t;
    this.tireAt(s, piece, zu, vu);
    out[OUTPUT.bodyAccel] = suspension / this.sprungMass;
    out[OUTPUT.bodyDisplacement] = zs;
    out[OUTPUT.wheelDisplacement] = zu;
    out[OUTPUT.travel] = x;
    out[OUTPUT.damperVelocity] = vd;
    out[OUTPUT.tireLoad] = this.tireDeflectionForce > 0 && this.tireForce > 0 ? this.tireForce : 0;
    out[OUTPUT.bumpStopForce] = stop;
    out[OUTPUT.roadHeight] = this.road.heightIn(piece, s);
    out[OUTPUT.bodyVelocity] = vs;
    out[OUTPUT.wheelVelocity] = vu;
  }
}
