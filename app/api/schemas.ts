import { z } from 'zod';

/** Zod schemas of the values the API returns, shared by the contract's handlers. */

const finite = z.number().finite();

export const modeSchema = z.strictObject({ frequencyHz: finite, dampingRatio: finite });

export const overdampedModeSchema = z.strictObject({ decayRate: finite, timeConstant: finite });

export const warningSchema = z.strictObject({ code: z.string(), field: z.string(), message: z.string() });

export const dampingClassSchema = z.enum(['underdamped', 'critically damped', 'overdamped']);

/** The JSON report of `rideledger analyze --json`: exactly the keys DESIGN.md lists, SI. */
export const analyzeReportSchema = z.strictObject({
  wheelRate: finite,
  rideRate: finite,
  rideFrequencyHz: finite,
  wheelHopFrequencyHz: finite,
  dampingRatio: z.strictObject({
    bump: finite,
    rebound: finite,
    bumpHighSpeed: finite,
    reboundHighSpeed: finite,
  }),
  dampingClass: z.strictObject({ bump: dampingClassSchema, rebound: dampingClassSchema }),
  modes: z.strictObject({
    body: modeSchema.optional(),
    wheelHop: modeSchema.optional(),
    overdamped: z.array(overdampedModeSchema).optional(),
  }),
  frf: z.array(z.strictObject({ frequencyHz: finite, bodyAccel: finite, tireLoad: finite, travel: finite })),
  randomRoad: z
    .strictObject({
      bodyAccelRms: finite,
      bodyAccelWeightedRms: finite,
      tireLoadRmsRatio: finite,
      travelRms: finite,
    })
    .optional(),
  bump: z
    .strictObject({
      peakBodyAccel: finite,
      maxCompression: finite,
      maxExtension: finite,
      minTireLoad: finite,
      maxTireLoad: finite,
      airborneTime: finite,
      peakBodyDisplacement: finite,
      bumpStopContactTime: finite,
    })
    .optional(),
  step: z.strictObject({ overshoot: finite, settlingTime: finite }),
  warnings: z.array(warningSchema),
});

export type AnalyzeReport = z.infer<typeof analyzeReportSchema>;
