import { bumpSpecParse, roadSpecParse, type BumpSpec, type RoadSpec } from '../../core/corner/corner-file';
import { InputError } from '../../core/units/input-error';
import { ISO8608_CLASSES } from '../../core/corner/random-road';
import { STEP_HEIGHT } from '../../core/corner/step-response';
import { quantityFormat, type QuantityKind, type UnitSystem } from '../../core/units/units';
import { quantityFieldConvert, quantityFieldValue } from './quantity-field';

/** What the user picks for the road and the bump, as typed (numbers in the unit system's units). */
export type AnalysisOptionTexts = {
  roadClass: string;
  roadSpeed: string;
  bumpHeight: string;
  bumpLength: string;
  bumpSpeed: string;
};

/** The road and bump the figures are taken on, SI. */
export type AnalysisOptions = { road: RoadSpec; bump: BumpSpec };

const OPTION_KINDS = {
  roadSpeed: 'speed',
  bumpHeight: 'length',
  bumpLength: 'length',
  bumpSpeed: 'speed',
} as const satisfies Record<Exclude<keyof AnalysisOptionTexts, 'roadClass'>, QuantityKind>;

/**
 * The defaults: ISO 8608 class C (an average road) at a fast-road speed, and a 25 mm bump half
 * a metre long crossed at a corner-exit speed — round numbers in each unit system.
 */
export function analysisOptionTextsDefault(system: UnitSystem): AnalysisOptionTexts {
  return system === 'si'
    ? { roadClass: 'C', roadSpeed: '80', bumpHeight: '25', bumpLength: '500', bumpSpeed: '50' }
    : { roadClass: 'C', roadSpeed: '50', bumpHeight: '1', bumpLength: '20', bumpSpeed: '30' };
}

/**
 * The texts shown in another unit system: defaults left as they were become the new system's
 * round defaults; every other value that reads is converted, and the rest kept as typed.
 */
export function analysisOptionTextsConvert(
  texts: AnalysisOptionTexts,
  from: UnitSystem,
  to: UnitSystem,
): AnalysisOptionTexts {
  if (from === to) return texts;
  const fromDefaults = analysisOptionTextsDefault(from);
  const toDefaults = analysisOptionTextsDefault(to);
  const out = { ...texts };
  for (const [key, kind] of Object.entries(OPTION_KINDS) as [keyof typeof OPTION_KINDS, QuantityKind][])
    out[key] =
      texts[key].trim() === fromDefaults[key]
        ? toDefaults[key]
        : quantityFieldConvert(texts[key], kind, from, to);
  return out;
}

/** Which text each field path of core's road and bump readers comes from. */
const OPTION_FIELDS: Record<string, keyof AnalysisOptionTexts> = {
  'road.class': 'roadClass',
  'road.speed': 'roadSpeed',
  'bump.height': 'bumpHeight',
  'bump.length': 'bumpLength',
  'bump.speed': 'bumpSpeed',
};

/**
 * Reads the option texts with core's road and bump readers (a bare number is in the unit shown
 * beside its field). Problems come back by text key, with core's message.
 */
export function analysisOptionsRead(
  texts: AnalysisOptionTexts,
  system: UnitSystem,
): { options: AnalysisOptions } | { problems: Map<keyof AnalysisOptionTexts, string> } {
  const problems = new Map<keyof AnalysisOptionTexts, string>();
  const value = (key: keyof typeof OPTION_KINDS) => {
    const v = quantityFieldValue(texts[key], OPTION_KINDS[key], system);
    if (v === undefined) problems.set(key, 'is needed');
    return v;
  };
  const attempt = <T>(read: () => T): T | undefined => {
    try {
      return read();
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      const key = OPTION_FIELDS[e.field];
      if (key) problems.set(key, e.problem);
      else throw e;
      return undefined;
    }
  };
  const roadSpeed = value('roadSpeed');
  const road =
    roadSpeed === undefined
      ? undefined
      : attempt(() => roadSpecParse({ class: texts.roadClass, speed: roadSpeed }, 'road'));
  const bumpTexts = {
    height: value('bumpHeight'),
    length: value('bumpLength'),
    speed: value('bumpSpeed'),
  };
  let bump: BumpSpec | undefined;
  if (bumpTexts.height !== undefined && bumpTexts.length !== undefined && bumpTexts.speed !== undefined) {
    // core stops at the first wrong field; a wrong one is set aside and the rest read again,
    // so that every wrong field is marked at once.
    const trial: Record<string, string> = { ...bumpTexts } as Record<string, string>;
    for (let pass = 0; pass < 3 && !bump; pass++) {
      const before = problems.size;
      bump = attempt(() => bumpSpecParse(trial, 'bump'));
      if (!bump && problems.size === before) break;
      for (const [key, placeholder] of [
        // Stand-ins inside every plausible range (core/corner/plausible-range.ts), so they raise nothing.
        ['height', '25 mm'],
        ['length', '1 m'],
        ['speed', '10 m/s'],
      ] as const)
        if (problems.has(OPTION_FIELDS[`bump.${key}`] as keyof AnalysisOptionTexts)) trial[key] = placeholder;
    }
    if (problems.size > 0) bump = undefined;
  }
  if (problems.size > 0 || !road || !bump) return { problems };
  return { options: { road, bump } };
}

/** Words for the road the random-road figures are taken on, in `system`. */
export function roadText(road: RoadSpec, system: UnitSystem): string {
  return `ISO 8608 class ${road.roadClass} at ${quantityFormat(road.speed, 'speed', system)}`;
}

/** Words for the bump, in `system`. */
export function bumpText(bump: BumpSpec, system: UnitSystem): string {
  return `${quantityFormat(bump.height, 'length', system)} high, ${quantityFormat(bump.length, 'length', system)} long, at ${quantityFormat(bump.speed, 'speed', system)}`;
}

/** Words for the linear model's road step, in `system`. */
export const stepText = (system: UnitSystem) => quantityFormat(STEP_HEIGHT, 'length', system);

/** The road classes a user may pick, smoothest first. */
export const ROAD_CLASSES = ISO8608_CLASSES;
