import { contract, type HandlerName, type HandlerOutput } from './contract';
import { inputErrorFromZod } from './api-error';
import type { ApiContext } from './context';
import { handlers } from './handlers/index';

/**
 * Calls a handler through the contract: the input is validated by its zod schema (an
 * InputError names the bad field), the handler runs, and its output is checked against the
 * output schema so that no caller ever sees a shape the contract does not promise. Handlers
 * run against `context` (the open database); some finish later (a backup), so the call is async.
 */
export async function apiCall<N extends HandlerName>(
  name: N,
  rawInput: unknown,
  context: ApiContext,
): Promise<HandlerOutput<N>> {
  const entry = contract[name];
  const parsed = entry.input.safeParse(rawInput);
  if (!parsed.success) throw inputErrorFromZod(parsed.error);
  const handler = handlers[name] as (input: unknown, context: ApiContext) => unknown;
  return entry.output.parse(await handler(parsed.data, context)) as HandlerOutput<N>;
}
