import { z } from 'zod';
import { CLICK_ADJUSTERS } from '../../core/damper/click-settings';
import { ISO8608_CLASSES } from '../../core/corner/random-road';
import { VALVING_HEADLINE_KEYS } from '../../core/valving/valving-rank';
import { VALVING_TARGET_KEYS } from '../../core/valving/valving-targets';
import { boundedFileSchema } from './input-bounds';
import { warningSchema } from './schemas';
import {
  clickSettingsSchema,
  cornerPositionSchema,
  revisionRefSchema,
  unitSystemSchema,
} from './store-schemas';

/** Zod schemas of the valving handlers: damping maps, choices, track-day comparisons. */

const finite = z.number().finite();
const count = z.number().int().nonnegative();
const ratio = finite;

/** Edits of a preset, read by core (which names the bad field): see valvingSettingsOf. */
const editsInput = {
  /** {road: {class, speed}, bump: {height, length, speed}, curb: {height, rise, hold, drop, speed}}. */
  scenario: boundedFileSchema.optional(),
  /** By target name: "off", "LOW..HIGH", or {low, high, scale, weight}. */
  targets: boundedFileSchema.optional(),
  /** By target name: a weight (0 shows a target without scoring it). */
  weights: boundedFileSchema.optional(),
};

export const valvingSourceSchema = z.strictObject({
  tag: z.enum(['pub', 'mem', 'trade', 'calc', 'ours', 'user']),
  text: z.string(),
});

const targetSchema = z.strictObject({
  low: finite.nullable(),
  high: finite.nullable(),
  scale: finite,
  weight: finite,
  source: valvingSourceSchema,
});

export const valvingTargetsSchema = z.partialRecord(z.enum(VALVING_TARGET_KEYS), targetSchema);

export const valvingScenarioSchema = z.strictObject({
  road: z.strictObject({ roadClass: z.enum(ISO8608_CLASSES), speed: finite }),
  bump: z.strictObject({ height: finite, length: finite, speed: finite }),
  curb: z.strictObject({ height: finite, rise: finite, hold: finite, drop: finite, speed: finite }),
});

const presetSummarySchema = z.strictObject({ name: z.string(), title: z.string(), use: z.string() });

export const valvingPresetSchema = presetSummarySchema.extend({
  scenario: valvingScenarioSchema,
  scenarioSource: valvingSourceSchema,
  targets: valvingTargetsSchema,
});

const adjusterSchema = z.enum(CLICK_ADJUSTERS);
const cellSourceSchema = z.enum(['measured', 'interpolated']);

const axisSchema = z.strictObject({
  adjuster: adjusterSchema,
  clicks: z.array(count),
  measured: z.array(count),
});

const bilinearSchema = z.strictObject({
  kind: z.literal('bilinear'),
  lowSpeed: finite,
  kneeSpeed: finite,
  highSpeed: finite,
});

const modeSchema = z.strictObject({ frequencyHz: finite, dampingRatio: finite }).nullable();
const dampingClassSchema = z.enum(['underdamped', 'critically damped', 'overdamped']);

export const valvingMapCellSchema = z.strictObject({
  clicks: clickSettingsSchema,
  source: cellSourceSchema,
  runIds: z.array(z.number().int()),
  damper: z.strictObject({ bump: bilinearSchema, rebound: bilinearSchema }),
  figures: z.strictObject({
    dampingRatio: z.strictObject({
      bump: ratio,
      rebound: ratio,
      bumpHighSpeed: ratio,
      reboundHighSpeed: ratio,
      lowSpeedMean: ratio,
    }),
    dampingClass: z.strictObject({ bump: dampingClassSchema, rebound: dampingClassSchema }),
    kneeSpeed: z.strictObject({ bump: finite.nullable(), rebound: finite.nullable() }),
    modes: z.strictObject({ body: modeSchema, wheelHop: modeSchema, overdamped: count }),
  }),
});

const headlineSchema = z.strictObject(
  Object.fromEntries(VALVING_HEADLINE_KEYS.map((k) => [k, finite.nullable()])) as Record<
    (typeof VALVING_HEADLINE_KEYS)[number],
    z.ZodNullable<z.ZodNumber>
  >,
);

const checkSchema = z.strictObject({
  target: z.enum(VALVING_TARGET_KEYS),
  figure: z.string(),
  value: finite,
  low: finite.nullable(),
  high: finite.nullable(),
  met: z.boolean(),
  miss: finite,
  weight: finite,
  penalty: finite,
});

const scoreFields = {
  score: finite,
  centring: finite,
  checks: z.array(checkSchema),
  met: count,
  missed: count,
};

const stepSchema = z.strictObject({
  adjuster: adjusterSchema,
  direction: z.union([z.literal(-1), z.literal(1)]),
  clicks: clickSettingsSchema,
  available: z.boolean(),
  source: cellSourceSchema.nullable(),
  score: finite.nullable(),
  change: headlineSchema.nullable(),
});

const pickSchema = z.strictObject({
  ...scoreFields,
  rank: z.number().int().positive(),
  cell: count,
  clicks: clickSettingsSchema,
  source: cellSourceSchema,
  runIds: z.array(z.number().int()),
  headline: headlineSchema,
  sensitivity: z.array(stepSchema),
  warnings: z.array(warningSchema),
});

const axleSchema = z.strictObject({
  positions: z.array(z.string()),
  rideFrequencyHz: finite,
  zetaBump: ratio,
  zetaRebound: ratio,
  lowSpeedMean: ratio,
});

export const valvingBalanceSchema = z
  .strictObject({
    front: axleSchema,
    rear: axleSchema,
    ratio: z.strictObject({ rideFrequency: ratio, zetaBump: ratio, zetaRebound: ratio, lowSpeedMean: ratio }),
    flatRide: z.strictObject({ low: ratio, high: ratio, met: z.boolean(), source: valvingSourceSchema }),
  })
  .nullable();

const vehicleNamed = z.strictObject({ id: z.number().int(), name: z.string() });

/** What every recommendation and comparison carries: the objective and the cautions. */
const judgedOn = {
  preset: presetSummarySchema,
  scenario: valvingScenarioSchema,
  scenarioSource: valvingSourceSchema,
  targets: valvingTargetsSchema,
  objective: z.string(),
  caution: z.string(),
  valvingCaution: z.string(),
};

export const valvingContract = {
  valvingPresets: {
    input: z.strictObject({}),
    output: z.strictObject({
      presets: z.array(valvingPresetSchema),
      /** Every target: its name, words and the kind of quantity its bands are in (null: a plain number). */
      targets: z.array(
        z.strictObject({ key: z.enum(VALVING_TARGET_KEYS), label: z.string(), kind: z.string().nullable() }),
      ),
      objective: z.string(),
    }),
  },
  valvingMap: {
    /** A damper unit's damping map on one corner of a revision (the newest without a number). */
    input: revisionRefSchema.extend({
      corner: cornerPositionSchema,
      /** The damper unit; the one the corner records when left out. */
      damper: z.string().optional(),
      /** Interpolate clicks between measured neighbours (never beyond them); marked in every cell. */
      interpolate: z.boolean().optional(),
    }),
    output: z.strictObject({
      vehicle: vehicleNamed,
      revision: z.number().int(),
      position: cornerPositionSchema,
      damper: z.string(),
      axes: z.array(axisSchema),
      cells: z.array(valvingMapCellSchema),
      interpolated: z.boolean(),
      notes: z.array(z.string()),
      corner: z.strictObject({
        rideFrequencyHz: finite,
        wheelHopFrequencyHz: finite,
        criticalDamping: finite,
      }),
    }),
  },
  valvingChoose: {
    input: revisionRefSchema.extend({
      /** The corners to choose for, each with its own sweep of the damper's clicks. */
      corners: z.array(cornerPositionSchema).min(1, 'give at least one corner (FL, FR, RL, RR)'),
      /** The damper unit for every corner; each corner's recorded unit when left out. */
      damper: z.string().optional(),
      preset: z.string().min(1, 'expected a preset name'),
      interpolate: z.boolean().optional(),
      ...editsInput,
      /** How many of the best combinations to show per corner. */
      best: z.number().int().min(1).max(50).optional(),
      /** Worker threads (0: this thread only); one a core when left out. Ignored where a kept pool sweeps (the server). */
      threads: z.number().int().min(0).max(64).optional(),
      /** The unit system the warnings are written in (the figures stay SI). */
      units: unitSystemSchema,
    }),
    output: z.strictObject({
      vehicle: vehicleNamed,
      revision: z.number().int(),
      ...judgedOn,
      dampers: z.array(
        z.strictObject({
          label: z.string(),
          positions: z.array(cornerPositionSchema),
          axes: z.array(axisSchema),
          cells: count,
          measured: count,
          interpolated: count,
          interpolate: z.boolean(),
          notes: z.array(z.string()),
        }),
      ),
      combinations: count,
      corners: z.array(
        z.strictObject({
          position: cornerPositionSchema,
          damper: z.string(),
          evaluated: count,
          meetingAll: count,
          best: z.array(pickSchema),
          current: pickSchema.nullable(),
        }),
      ),
      balance: valvingBalanceSchema,
    }),
  },
  setupCompare: {
    /** Two revisions side by side (`b` without a number: the newest) on a preset's scenario and targets. */
    input: z.strictObject({
      a: revisionRefSchema,
      b: revisionRefSchema,
      preset: z.string().min(1, 'expected a preset name'),
      ...editsInput,
      /** The unit system the warnings are written in (the figures stay SI). */
      units: unitSystemSchema,
    }),
    output: z.strictObject({
      a: z.strictObject({ vehicle: z.string(), revision: z.number().int(), name: z.string() }),
      b: z.strictObject({ vehicle: z.string(), revision: z.number().int(), name: z.string() }),
      ...judgedOn,
      corners: z.array(
        z.strictObject({
          position: cornerPositionSchema,
          a: compareSideSchema(),
          b: compareSideSchema(),
          change: headlineSchema,
        }),
      ),
      balance: z.strictObject({ a: valvingBalanceSchema, b: valvingBalanceSchema }),
    }),
  },
} as const;

function compareSideSchema() {
  return z.strictObject({
    damperUnit: z.string(),
    clicks: clickSettingsSchema,
    headline: headlineSchema,
    score: z.strictObject(scoreFields),
    warnings: z.array(warningSchema),
  });
}
