import { ISO8608_CLASSES } from '../../core/corner/random-road';
import { z } from 'zod';
import { BUNDLE_FORMAT, BUNDLE_VERSION } from '../../db/bundle';
import { analyzeReportSchema, warningSchema } from './schemas';

/** Zod schemas of the shop's record: vehicles, setup revisions, damper bench runs, bundles. */

const finite = z.number().finite();
const count = z.number().int().nonnegative();

/** A vehicle by name, or by id. */
export const vehicleRefSchema = z.union([
  z.string().min(1, 'expected a vehicle name'),
  z.number().int().positive(),
]);

export const unitSystemSchema = z.enum(['si', 'us']).default('si');

export const cornerPositionSchema = z.enum(['FL', 'FR', 'RL', 'RR']);

export const clickSettingsSchema = z.strictObject({
  bump: count.optional(),
  rebound: count.optional(),
  bumpHighSpeed: count.optional(),
  reboundHighSpeed: count.optional(),
});

export const vehicleSchema = z.strictObject({
  id: z.number().int(),
  name: z.string(),
  kind: z.string(),
  notes: z.string(),
  createdAt: z.string(),
  revisionCount: count,
  lastSavedAt: z.string().nullable(),
});

export const revisionSummarySchema = z.strictObject({
  number: z.number().int().positive(),
  parent: z.number().int().positive().nullable(),
  name: z.string(),
  event: z.string(),
  track: z.string(),
  driver: z.string(),
  date: z.string().nullable(),
  savedAt: z.string(),
  summary: z.string(),
});

/** A revision reference: a vehicle and a revision number (the newest when left out). */
export const revisionRefSchema = z.strictObject({
  vehicle: vehicleRefSchema,
  revision: z.number().int().positive().optional(),
});

/** A corner's headline figures: the same keys, types and classes as the analyze report's. */
export const cornerFiguresSchema = analyzeReportSchema.pick({
  wheelRate: true,
  rideRate: true,
  rideFrequencyHz: true,
  wheelHopFrequencyHz: true,
  dampingRatio: true,
  dampingClass: true,
});

export const cornerWarningSchema = warningSchema.extend({ position: cornerPositionSchema });

export const fieldChangeSchema = z.strictObject({
  field: z.string(),
  label: z.string(),
  position: cornerPositionSchema.optional(),
  before: z.string().nullable(),
  after: z.string().nullable(),
  unit: z.string(),
});

export const figureChangeSchema = z.strictObject({
  position: cornerPositionSchema,
  figure: z.enum(['rideFrequencyHz', 'dampingRatioBump', 'dampingRatioRebound', 'wheelHopFrequencyHz']),
  label: z.string(),
  unit: z.string(),
  before: finite,
  after: finite,
});

/**
 * A stored fit of one direction. Loose on purpose: runs stored with a fit that a later
 * damperDirectionFit enriches (more fields) must still read, and the bundle carry them.
 */
const directionFitSchema = z
  .looseObject({
    curve: z.looseObject({
      kind: z.literal('bilinear'),
      lowSpeed: finite,
      kneeSpeed: finite,
      highSpeed: finite,
    }),
    rmsResidual: finite,
    points: count,
  })
  .nullable();

export const benchFitSchema = z.looseObject({
  bump: directionFitSchema,
  rebound: directionFitSchema,
  basis: z.enum(['points', 'binned']),
});

export const damperSchema = z.strictObject({
  id: z.number().int(),
  label: z.string(),
  kind: z.string(),
  serial: z.string(),
  notes: z.string(),
  createdAt: z.string(),
  runCount: count,
  lastRunDate: z.string().nullable(),
});

export const benchRunSummarySchema = z.strictObject({
  id: z.number().int(),
  damper: z.string(),
  date: z.string().nullable(),
  clicks: clickSettingsSchema,
  stroke: finite.nullable(),
  testFrequency: finite.nullable(),
  temperature: finite.nullable(),
  source: z.enum(['points', 'trace']),
  sourceName: z.string(),
  sourceColumn: z.string(),
  pointCount: count,
  traceSamples: count.nullable(),
  fit: benchFitSchema,
  notes: z.string(),
  importedAt: z.string(),
});

/** A text per bench-file column role. */
const columnTextsSchema = z.strictObject({
  velocity: z.string().optional(),
  force: z.string().optional(),
  time: z.string().optional(),
  displacement: z.string().optional(),
});

/** Quantities arrive as SI numbers or strings with units, read by core (which names the field). */
const quantityInput = z.union([z.number(), z.string()]).optional();

export const benchImportInputSchema = z.strictObject({
  damper: z.string(),
  /** The file on this machine, or its text (a browser has no path). */
  source: z.union([
    z.strictObject({ path: z.string().min(1) }),
    z.strictObject({ text: z.string(), name: z.string() }),
  ]),
  kind: z.enum(['points', 'trace']).optional(),
  /** Header names of the columns, by what they hold. */
  columns: columnTextsSchema.optional(),
  /** Units of the columns ("in/s", "lbf"), by what they hold. */
  units: columnTextsSchema.optional(),
  compression: z.enum(['positive', 'negative']).optional(),
  /** Clicker positions: the text form ("bump 3 rebound 6") or the object form. */
  clicks: z.union([z.string(), clickSettingsSchema]).optional(),
  date: z.string().optional(),
  stroke: quantityInput,
  testFrequency: quantityInput,
  temperature: quantityInput,
  /** The gas force the readings include, taken off every reading before it is stored and fitted. */
  gasForce: quantityInput,
  notes: z.string().optional(),
  type: z.string().optional(),
  serial: z.string().optional(),
  again: z.boolean().optional(),
  smoothing: z.number().int().optional(),
  bins: z.number().int().optional(),
});

const bundleCornerSchema = z.strictObject({
  analysis: z.record(z.string(), z.unknown()),
  damperUnit: z.string().nullable(),
  clicks: clickSettingsSchema,
  springLabel: z.string(),
  rideHeight: finite.nullable(),
  tirePressureCold: finite.nullable(),
  camber: finite.nullable(),
  toe: z.strictObject({ kind: z.enum(['angle', 'length']), value: finite }).nullable(),
  notes: z.string(),
});

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'expected a date written YYYY-MM-DD');

export const bundleSchema = z.strictObject({
  format: z.literal(BUNDLE_FORMAT, `expected "${BUNDLE_FORMAT}"`),
  version: z.literal(BUNDLE_VERSION, `this program reads bundle version ${BUNDLE_VERSION}`),
  vehicle: z.strictObject({ name: z.string(), kind: z.string(), notes: z.string(), createdAt: z.string() }),
  /** The vehicle's scenario, SI, when it has one stored; read again by core on import. */
  scenario: z
    .strictObject({
      road: z.strictObject({ roadClass: z.enum(ISO8608_CLASSES), speed: finite }),
      bump: z.strictObject({ height: finite, length: finite, speed: finite }),
      curb: z.strictObject({ height: finite, rise: finite, hold: finite, drop: finite, speed: finite }),
    })
    .optional(),
  revisions: z.array(
    z.strictObject({
      number: z.number().int().positive(),
      parent: z.number().int().positive().nullable(),
      name: z.string().min(1),
      event: z.string(),
      track: z.string(),
      driver: z.string(),
      date: isoDate.nullable(),
      fuelLoad: finite.nonnegative().nullable(),
      antiRollBar: z.strictObject({ front: z.string(), rear: z.string() }),
      notes: z.string(),
      summary: z.string(),
      savedAt: z.string(),
      corners: z.strictObject({
        FL: bundleCornerSchema,
        FR: bundleCornerSchema,
        RL: bundleCornerSchema,
        RR: bundleCornerSchema,
      }),
    }),
  ),
  dampers: z.array(
    z.strictObject({
      label: z.string().min(1),
      kind: z.string(),
      serial: z.string(),
      notes: z.string(),
      createdAt: z.string(),
      runs: z.array(
        z.strictObject({
          date: isoDate.nullable(),
          clicks: clickSettingsSchema,
          stroke: finite.nullable(),
          testFrequency: finite.nullable(),
          temperature: finite.nullable(),
          sourceKind: z.enum(['points', 'trace']),
          sourceName: z.string(),
          sourceColumn: z.string(),
          sourceSha256: z.string().regex(/^[0-9a-f]{64}$/),
          pointCount: count,
          points: z.string(),
          pointsSha256: z.string().regex(/^[0-9a-f]{64}$/),
          traceCount: count.nullable(),
          trace: z.string().nullable(),
          fit: benchFitSchema,
          notes: z.string(),
          importedAt: z.string(),
        }),
      ),
    }),
  ),
});

export const checkReportSchema = z.strictObject({
  ok: z.boolean(),
  problems: z.array(z.string()),
  schemaVersion: count,
  counts: z.strictObject({
    vehicles: count,
    revisions: count,
    dampers: count,
    benchRuns: count,
    benchPoints: count,
  }),
});

export const backupResultSchema = z.strictObject({
  path: z.string(),
  bytes: count,
  counts: z.strictObject({ vehicles: count, revisions: count, dampers: count, benchRuns: count }),
});

export { warningSchema };
