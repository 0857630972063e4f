import { z } from 'zod';
import { analyzeReportSchema } from './schemas';

/**
 * The one typed API contract: handler name → zod input and output schemas. The command,
 * the loopback server, Electron IPC and the tests all call handlers through it, and every
 * input is validated here before a handler sees it.
 */
export const contract = {
  analyzeCorner: {
    input: z.strictObject({
      /** A corner file's content (DESIGN.md): read and checked by core, which names the bad field. */
      file: z.unknown(),
      frequencies: z.array(z.number().finite().positive()).min(1).max(500).optional(),
    }),
    output: analyzeReportSchema,
  },
} as const;

export type Contract = typeof contract;
export type HandlerName = keyof Contract;
export type HandlerInput<N extends HandlerName> = z.input<Contract[N]['input']>;
export type HandlerOutput<N extends HandlerName> = z.output<Contract[N]['output']>;
