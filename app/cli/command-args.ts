import { parseArgs, type ParseArgsOptionsConfig } from 'node:util';
import type { CliIo } from './cli-io';

/** The options every database command takes: the database, JSON output, help. */
export const COMMON_OPTIONS = {
  db: { type: 'string' },
  json: { type: 'boolean' },
  help: { type: 'boolean', short: 'h' },
} as const satisfies ParseArgsOptionsConfig;

/** Parses a command's arguments strictly (an unknown option is a usage error) with the common options. */
export function commandArgsParse<O extends ParseArgsOptionsConfig>(args: string[], options: O) {
  return parseArgs({
    args,
    allowPositionals: true,
    strict: true,
    options: { ...COMMON_OPTIONS, ...options },
  });
}

/**
 * Prints `usage` when help was asked for (`--help`, `-h`, or as the subcommand).
 * @returns whether it did, so that the command returns at once.
 */
export function helpShown(
  values: { help?: boolean | undefined },
  sub: string | undefined,
  usage: string,
  io: CliIo,
): boolean {
  if (!values.help && sub !== '--help' && sub !== '-h') return false;
  io.stdout(`${usage}\n`);
  return true;
}

/** The `--json` form of a handler's output. */
export function jsonText(value: unknown): string {
  return `${JSON.stringify(value, null, 2)}\n`;
}
