import { InputError } from '../../core/input-error';
import { analyzeCommand } from './commands/analyze';
import { benchSimCommand } from './commands/bench-sim';
import { simulateCommand } from './commands/simulate';
import { EXIT_BAD_INPUT, EXIT_FAILURE, EXIT_OK, UsageError, type CliIo } from './cli-io';

type Command = { summary: string; run: (args: string[], io: CliIo) => Promise<number> };

const COMMANDS: Record<string, Command> = {
  analyze: { summary: 'ride figures of a corner file', run: analyzeCommand },
  simulate: {
    summary: 'one road event on the nonlinear quarter car; CSV time history',
    run: simulateCommand,
  },
  'bench-sim': { summary: 'benchmark of the bump simulation (simulations per second)', run: benchSimCommand },
};

function usage(): string {
  const lines = Object.entries(COMMANDS).map(([name, c]) => `  ${name.padEnd(12)} ${c.summary}`);
  return `rideledger — setup log, damper bench library and quarter-car ride figures\n\nUsage: rideledger COMMAND [options]   (rideledger COMMAND --help for more)\n\n${lines.join('\n')}\n`;
}

/** One line for stderr from any error: what is wrong, and where. */
function errorLine(e: unknown): { line: string; code: number } {
  if (e instanceof InputError || e instanceof UsageError) return { line: e.message, code: EXIT_BAD_INPUT };
  // node:util parseArgs reports unknown options and missing values this way.
  const code = (e as { code?: string }).code;
  if (typeof code === 'string' && code.startsWith('ERR_PARSE_ARGS'))
    return { line: (e as Error).message, code: EXIT_BAD_INPUT };
  return { line: `internal error: ${(e as Error).stack ?? String(e)}`, code: EXIT_FAILURE };
}

/** Runs the command line `argv` (without node and the script); returns the exit code. */
export async function cliMain(argv: string[], io: CliIo): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
    io.stdout(usage());
    return name === undefined ? EXIT_BAD_INPUT : EXIT_OK;
  }
  const command = COMMANDS[name];
  if (!command) {
    io.stderr(`rideledger: unknown command "${name}"; commands: ${Object.keys(COMMANDS).join(', ')}\n`);
    return EXIT_BAD_INPUT;
  }
  try {
    return await command.run(rest, io);
  } catch (e) {
    const { line, code } = errorLine(e);
    io.stderr(`rideledger ${name}: ${line.replace(/\s*\n\s*/g, code === EXIT_FAILURE ? '\n' : ' ')}\n`);
    return code;
  }
}
