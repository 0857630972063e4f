import {
  appSettingDelete,
  appSettingGet,
  appSettingKeys,
  appSettingPut,
} from '../../../db/queries/app-setting';
import type { ApiContext } from '../context';
import type { HandlerParsedInput, HandlerOutput } from '../contract';

/** Handler `settingGet`: one setting or draft of the desktop app; null when never set. */
export function settingGetHandler(
  input: HandlerParsedInput<'settingGet'>,
  ctx: ApiContext,
): HandlerOutput<'settingGet'> {
  const row = appSettingGet(ctx.store.db, input.key);
  return {
    key: input.key,
    value: row ? (JSON.parse(row.value) as unknown) : null,
    updatedAt: row?.updated_at ?? null,
  };
}

/** Handler `settingSet`: stores a value (any JSON), or removes the setting when the value is null. */
export function settingSetHandler(
  input: HandlerParsedInput<'settingSet'>,
  ctx: ApiContext,
): HandlerOutput<'settingSet'> {
  if (input.value === null || input.value === undefined) {
    appSettingDelete(ctx.store.db, input.key);
    return { key: input.key, updatedAt: null };
  }
  const updatedAt = new Date().toISOString();
  appSettingPut(ctx.store.db, { key: input.key, value: JSON.stringify(input.value), updated_at: updatedAt });
  return { key: input.key, updatedAt };
}

/** Handler `settingList`: the keys that start with `prefix` (the drafts kept, for instance). */
export function settingListHandler(
  input: HandlerParsedInput<'settingList'>,
  ctx: ApiContext,
): HandlerOutput<'settingList'> {
  return { keys: appSettingKeys(ctx.store.db, input.prefix) };
}
