import { z } from 'zod';
import { boundedFileSchema } from './input-bounds';
import { analyzeReportSchema, warningSchema } from './schemas';
import {
  backupResultSchema,
  clickSettingsSchema,
  benchFitSchema,
  benchImportInputSchema,
  benchRunSummarySchema,
  bundleSchema,
  checkReportSchema,
  cornerFiguresSchema,
  cornerPositionSchema,
  cornerWarningSchema,
  damperSchema,
  fieldChangeSchema,
  figureChangeSchema,
  revisionRefSchema,
  revisionSummarySchema,
  unitSystemSchema,
  vehicleRefSchema,
  vehicleSchema,
} from './store-schemas';
import { valvingContract, valvingScenarioSchema } from './valving-schemas';

/** Names of the desktop app's settings and drafts: `caution-acknowledged`, `draft:Millbrook coupe #27`. */
const settingKeySchema = z
  .string()
  .min(1)
  .max(200)
  .regex(/^[a-z][a-z0-9-]*(:.+)?$/, 'expected a setting name such as "units" or "draft:Vehicle name"');

const vehicleNamed = z.strictObject({ id: z.number().int(), name: z.string() });

/** A vehicle's scenario, SI: stored with it, or (stored: false) the starting scenario. */
const vehicleScenarioOutput = z.strictObject({
  vehicle: vehicleNamed,
  scenario: valvingScenarioSchema,
  stored: z.boolean(),
  updatedAt: z.string().nullable(),
  /** Where the scenario comes from, in words. */
  note: z.string(),
});

/**
 * Which damper curve a corner runs (db/damper-resolve.ts): its source — a bench run at the
 * corner's clicks, interpolated between measured clicks, or entered — the curve itself (a
 * corner file's "damper" object, SI) and the warning when the entered curve disagrees.
 */
const cornerDamperSchema = z.strictObject({
  position: cornerPositionSchema,
  source: z.strictObject({
    kind: z.enum(['bench', 'interpolated', 'entered']),
    damper: z.string(),
    clicks: clickSettingsSchema,
    runIds: z.array(z.number().int()),
    text: z.string(),
  }),
  curve: z.record(z.string(), z.unknown()),
  warning: warningSchema.nullable(),
});

/**
 * The one typed API contract: handler name → zod input and output schemas. The command,
 * the loopback server, Electron IPC and the tests all call handlers through it, and every
 * input is validated here before a handler sees it.
 */
export const contract = {
  analyzeCorner: {
    input: z.strictObject({
      /** A corner file's content (DESIGN.md): read and checked by core, which names the bad field. */
      file: boundedFileSchema,
      frequencies: z.array(z.number().finite().positive()).min(1).max(500).optional(),
    }),
    output: analyzeReportSchema,
  },

  vehicleAdd: {
    /** Name, class or type, notes: read by core (a name is one line, no "@", not taken yet). */
    input: z.strictObject({ name: z.unknown(), kind: z.unknown().optional(), notes: z.unknown().optional() }),
    output: z.strictObject({ vehicle: vehicleSchema }),
  },
  vehicleList: {
    input: z.strictObject({}),
    output: z.strictObject({ vehicles: z.array(vehicleSchema) }),
  },
  vehicleShow: {
    input: z.strictObject({ vehicle: vehicleRefSchema }),
    output: z.strictObject({
      vehicle: vehicleSchema,
      latest: revisionSummarySchema.nullable(),
      /** The damper unit fitted at each corner in the newest revision. */
      dampers: z.array(z.strictObject({ position: cornerPositionSchema, label: z.string() })),
    }),
  },
  vehicleDelete: {
    /** `confirm: true` is the API's `--yes`: a full backup is made first, then the vehicle goes. */
    input: z.strictObject({
      vehicle: vehicleRefSchema,
      confirm: z.literal(true, 'deleting a vehicle needs confirm: true'),
    }),
    output: z.strictObject({
      vehicle: z.string(),
      revisionsDeleted: z.number().int(),
      backupPath: z.string(),
    }),
  },
  vehicleScenario: {
    /** The road, bump and curb this vehicle is judged on (Ride figures, Compare, Valving, the command). */
    input: z.strictObject({ vehicle: vehicleRefSchema }),
    output: vehicleScenarioOutput,
  },
  vehicleScenarioSet: {
    input: z.strictObject({
      vehicle: vehicleRefSchema,
      /**
       * {road: {class, speed}, bump: {height, length, speed}, curb: {height, rise, hold, drop,
       * speed}}: the parts given replace the vehicle's (quantities with units, numbers SI), read by
       * core, which names the bad field; null goes back to the starting scenario.
       */
      scenario: z.unknown(),
    }),
    output: vehicleScenarioOutput,
  },

  setupSave: {
    /** A setup file's content; the vehicle and parent from here override the file's. */
    input: z.strictObject({
      file: boundedFileSchema,
      vehicle: vehicleRefSchema.optional(),
      basedOnRevision: z.number().int().positive().optional(),
      /** The unit system the summary of what changed is written in (the sheet is stored SI). */
      units: unitSystemSchema,
      /** Damper labels of the sheet to add to the library; any other label the library lacks is refused. */
      newDamperUnits: z.array(z.string().max(200)).max(16).optional(),
    }),
    output: z.strictObject({
      vehicle: vehicleNamed,
      revision: revisionSummarySchema,
      branched: z.boolean(),
      dampersCreated: z.array(z.string()),
    }),
  },
  setupShow: {
    input: revisionRefSchema.extend({ units: unitSystemSchema }),
    output: z.strictObject({
      vehicle: vehicleNamed,
      revision: revisionSummarySchema,
      /** The setup file (our format) of this revision, in the unit system asked for. */
      file: z.record(z.string(), z.unknown()),
      figures: z.strictObject({
        FL: cornerFiguresSchema,
        FR: cornerFiguresSchema,
        RL: cornerFiguresSchema,
        RR: cornerFiguresSchema,
      }),
      /** The damper curve each corner's figures use, and where it comes from. */
      dampers: z.array(cornerDamperSchema),
      warnings: z.array(cornerWarningSchema),
      caution: z.string(),
    }),
  },
  setupDampers: {
    /** Corners being edited: each corner's "corner" object, damper unit and clicks as a setup file has them. */
    input: z.strictObject({
      corners: z
        .array(
          z.strictObject({
            position: cornerPositionSchema,
            corner: z.unknown(),
            damperUnit: z.string().max(200),
            clicks: z.unknown().optional(),
          }),
        )
        .max(4),
    }),
    output: z.strictObject({ dampers: z.array(cornerDamperSchema) }),
  },
  setupHistory: {
    input: z.strictObject({ vehicle: vehicleRefSchema }),
    output: z.strictObject({ vehicle: vehicleNamed, revisions: z.array(revisionSummarySchema) }),
  },
  setupDiff: {
    /** Two revisions (of one vehicle or two); `b` left without a revision number is the newest. */
    input: z.strictObject({ a: revisionRefSchema, b: revisionRefSchema, units: unitSystemSchema }),
    output: z.strictObject({
      a: z.strictObject({ vehicle: z.string(), revision: z.number().int(), name: z.string() }),
      b: z.strictObject({ vehicle: z.string(), revision: z.number().int(), name: z.string() }),
      fields: z.array(fieldChangeSchema),
      figures: z.array(figureChangeSchema),
      /** The model's warnings for revision b. */
      warnings: z.array(cornerWarningSchema),
      caution: z.string(),
    }),
  },

  benchImport: {
    input: benchImportInputSchema,
    output: z.strictObject({
      damper: damperSchema,
      damperCreated: z.boolean(),
      runs: z.array(benchRunSummarySchema),
      warnings: z.array(z.string()),
    }),
  },
  benchList: {
    /** Every damper unit; with `damper`, that unit and its runs. */
    input: z.strictObject({ damper: z.string().optional() }),
    output: z.strictObject({ dampers: z.array(damperSchema), runs: z.array(benchRunSummarySchema) }),
  },
  benchShow: {
    input: z.strictObject({ run: z.number().int().positive(), points: z.boolean().optional() }),
    output: z.strictObject({
      run: benchRunSummarySchema,
      fit: benchFitSchema,
      /** [velocity m/s, force N] pairs, compression positive, when asked for. */
      points: z.array(z.tuple([z.number(), z.number()])).optional(),
    }),
  },

  storeExport: {
    input: z.strictObject({ vehicle: vehicleRefSchema }),
    output: z.strictObject({ bundle: bundleSchema }),
  },
  storeImport: {
    input: z.strictObject({ bundle: bundleSchema, asName: z.string().optional() }),
    output: z.strictObject({
      vehicle: z.string(),
      revisions: z.number().int(),
      dampersCreated: z.array(z.string()),
      dampersMatched: z.array(z.string()),
      runsImported: z.number().int(),
      runsAlreadyPresent: z.number().int(),
    }),
  },
  storeBackup: {
    input: z.strictObject({ path: z.string().min(1), overwrite: z.boolean().optional() }),
    output: backupResultSchema,
  },
  storeCheck: {
    input: z.strictObject({}),
    output: checkReportSchema,
  },
  settingGet: {
    input: z.strictObject({ key: settingKeySchema }),
    output: z.strictObject({ key: z.string(), value: z.unknown(), updatedAt: z.string().nullable() }),
  },
  settingSet: {
    /** Any JSON value up to 4 MB as text; null removes the setting. */
    input: z.strictObject({
      key: settingKeySchema,
      value: z
        .unknown()
        .refine((v) => JSON.stringify(v ?? null).length <= 4 * 1024 * 1024, 'is larger than 4 MB'),
    }),
    output: z.strictObject({ key: z.string(), updatedAt: z.string().nullable() }),
  },
  settingList: {
    input: z.strictObject({ prefix: z.string().max(200) }),
    output: z.strictObject({ keys: z.array(z.string()) }),
  },
  loadDemo: {
    input: z.strictObject({}),
    output: z.strictObject({
      loaded: z.boolean(),
      vehicles: z.array(z.string()),
      revisions: z.number().int(),
      dampers: z.array(z.string()),
      benchRuns: z.number().int(),
      message: z.string(),
    }),
  },

  ...valvingContract,
} as const;

export type Contract = typeof contract;
export type HandlerName = keyof Contract;
export type HandlerInput<N extends HandlerName> = z.input<Contract[N]['input']>;
export type HandlerOutput<N extends HandlerName> = z.output<Contract[N]['output']>;
/** What a handler receives: the input after its schema has checked it and filled defaults. */
export type HandlerParsedInput<N extends HandlerName> = z.output<Contract[N]['input']>;
