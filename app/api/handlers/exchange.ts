import { bundleExport, bundleImport } from '../../../db/bundle';
import type { ApiContext } from '../context';
import type { HandlerOutput, HandlerParsedInput } from '../contract';

/** Handler `storeExport`: one vehicle with all its revisions, dampers and bench runs, as a bundle. */
export function storeExportHandler(
  input: HandlerParsedInput<'storeExport'>,
  { store }: ApiContext,
): HandlerOutput<'storeExport'> {
  return { bundle: bundleExport(store, input.vehicle) as HandlerOutput<'storeExport'>['bundle'] };
}

/**
 * Handler `storeImport`: a bundle into this database, all or nothing, every record checked
 * by the rules of `setup save` and `bench import`, fits and summaries recomputed (bundleImport).
 */
export function storeImportHandler(
  input: HandlerParsedInput<'storeImport'>,
  { store }: ApiContext,
): HandlerOutput<'storeImport'> {
  return bundleImport(store, input.bundle, input.asName === undefined ? {} : { asName: input.asName });
}
