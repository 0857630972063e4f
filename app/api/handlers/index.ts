import type { HandlerInput, HandlerName, HandlerOutput } from '../contract';
import { analyzeCorner } from './analyze';

/** Every handler of the contract, by name; `satisfies` keeps the map and the contract in step. */
export const handlers = {
  analyzeCorner,
} satisfies { [N in HandlerName]: (input: HandlerInput<N>) => HandlerOutput<N> };
