import { contract, type HandlerName, type HandlerOutput } from './contract';
import { inputErrorFromZod } from './api-error';
import { handlers } from './handlers/index';

/**
 * Calls a handler through the contract: the input is validated by its zod schema (an
 * InputError names the bad field), the handler runs, and its output is checked against the
 * output schema so that no caller ever sees a shape the contract does not promise.
 */
export function apiCall<N extends HandlerName>(name: N, rawInput: unknown): HandlerOutput<N> {
  const entry = contract[name];
  const parsed = entry.input.safeParse(rawInput);
  if (!parsed.success) throw inputErrorFromZod(parsed.error);
  const handler = handlers[name] as (input: unknown) => unknown;
  return entry.output.parse(handler(parsed.data)) as HandlerOutput<N>;
}
