import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { InputError } from '../../../core/units/input-error';
import { nameKey } from '../../../core/units/text-field';
import { damperUnitEnsure } from '../../../db/damper-units';
import { storeEventInsert } from '../../../db/queries/store-event';
import { vehicleByKey } from '../../../db/queries/vehicle';
import { storeTransaction } from '../../../db/store';
import { textFileRead } from '../../../db/text-file';
import type { ApiContext } from '../context';
import { contract, type HandlerOutput, type HandlerParsedInput } from '../contract';
import { benchImportHandler } from './bench';
import { setupSaveHandler } from './setup';
import { vehicleAdd } from './vehicle';

/** The invented demo shop's files: the same data the desktop app offers on first run. */
const DEMO_DIR = fileURLToPath(new URL('../../../assets/demo/', import.meta.url));

type DemoManifest = {
  shop: string;
  dampers: { label: string; type?: string; serial?: string; notes?: string }[];
  vehicles: { name: string; kind: string; notes: string; revisions: string[] }[];
  bench: ({ file: string } & Record<string, unknown>)[];
};

function demoManifest(): DemoManifest {
  return JSON.parse(readFileSync(`${DEMO_DIR}shop.json`, 'utf8')) as DemoManifest;
}

/**
 * Handler `loadDemo`: loads the invented Millbrook shop — two vehicles with their revisions,
 * damper units and bench runs — in one transaction, through the same handlers a shop uses.
 * Loading it again changes nothing; a database holding a vehicle of a demo name but not
 * the demo is refused rather than mixed.
 */
export function loadDemo(
  _input: HandlerParsedInput<'loadDemo'>,
  context: ApiContext,
): HandlerOutput<'loadDemo'> {
  const { store } = context;
  const demo = demoManifest();
  const present = demo.vehicles.filter((v) => vehicleByKey(store.db, nameKey(v.name)));
  const summary = {
    vehicles: demo.vehicles.map((v) => v.name),
    revisions: demo.vehicles.reduce((n, v) => n + v.revisions.length, 0),
    dampers: demo.dampers.map((d) => d.label),
    benchRuns: 0,
  };
  if (present.length === demo.vehicles.length)
    return {
      loaded: false,
      ...summary,
      message: `the ${demo.shop} demo is already in this database; nothing was changed`,
    };
  if (present.length > 0)
    throw new InputError(
      'demo',
      `this database already has a vehicle named "${present[0]?.name}" that is not from a whole demo load; nothing was changed`,
    );
  return storeTransaction(store, () => {
    const at = new Date().toISOString();
    for (const d of demo.dampers)
      damperUnitEnsure(
        store.db,
        d.label,
        { kind: d.type ?? '', serial: d.serial ?? '', notes: d.notes ?? '' },
        at,
      );
    let benchRuns = 0;
    for (const b of demo.bench) {
      const { file, ...options } = b;
      const input = contract.benchImport.input.parse({
        ...options,
        source: { text: textFileRead(`${DEMO_DIR}${file}`), name: file.split('/').pop() ?? file },
      });
      benchRuns += benchImportHandler(input, context).runs.length;
    }
    for (const v of demo.vehicles) {
      vehicleAdd({ name: v.name, kind: v.kind, notes: v.notes }, context);
      for (const file of v.revisions) {
        const content = JSON.parse(readFileSync(`${DEMO_DIR}${file}`, 'utf8')) as unknown;
        setupSaveHandler({ file: content, units: 'si' }, context);
      }
    }
    storeEventInsert(store.db, { at, kind: 'demo-loaded', detail: `the invented ${demo.shop} demo shop` });
    return { loaded: true, ...summary, benchRuns, message: `loaded the invented ${demo.shop} demo shop` };
  });
}
