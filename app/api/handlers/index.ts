import type { ApiContext } from '../context';
import type { HandlerName, HandlerOutput, HandlerParsedInput } from '../contract';
import { analyzeCorner } from './analyze';
import { benchImportHandler, benchListHandler, benchShowHandler } from './bench';
import { loadDemo } from './demo';
import { storeExportHandler, storeImportHandler } from './exchange';
import { settingGetHandler, settingListHandler, settingSetHandler } from './setting';
import {
  setupDampersHandler,
  setupDiffHandler,
  setupHistoryHandler,
  setupSaveHandler,
  setupShowHandler,
} from './setup';
import { storeBackupHandler, storeCheckHandler } from './store';
import {
  setupCompareHandler,
  valvingChooseHandler,
  valvingMapHandler,
  valvingPresetsHandler,
} from './valving';
import {
  vehicleAdd,
  vehicleDeleteHandler,
  vehicleListHandler,
  vehicleScenarioHandler,
  vehicleScenarioSetHandler,
  vehicleShow,
} from './vehicle';

/** Every handler of the contract, by name; `satisfies` keeps the map and the contract in step. */
export const handlers = {
  analyzeCorner,
  vehicleAdd,
  vehicleList: vehicleListHandler,
  vehicleShow,
  vehicleDelete: vehicleDeleteHandler,
  vehicleScenario: vehicleScenarioHandler,
  vehicleScenarioSet: vehicleScenarioSetHandler,
  setupSave: setupSaveHandler,
  setupShow: setupShowHandler,
  setupDampers: setupDampersHandler,
  setupHistory: setupHistoryHandler,
  setupDiff: setupDiffHandler,
  benchImport: benchImportHandler,
  benchList: benchListHandler,
  benchShow: benchShowHandler,
  storeExport: storeExportHandler,
  storeImport: storeImportHandler,
  storeBackup: storeBackupHandler,
  storeCheck: storeCheckHandler,
  settingGet: settingGetHandler,
  settingSet: settingSetHandler,
  settingList: settingListHandler,
  loadDemo,
  valvingPresets: valvingPresetsHandler,
  valvingMap: valvingMapHandler,
  valvingChoose: valvingChooseHandler,
  setupCompare: setupCompareHandler,
} satisfies {
  [N in HandlerName]: (
    input: HandlerParsedInput<N>,
    context: ApiContext,
  ) => HandlerOutput<N> | Promise<HandlerOutput<N>>;
};
