import { InputError } from '../../core/units/input-error';
import { textControlsEscaped } from '../../core/units/text-field';
import { EXIT_BAD_INPUT, EXIT_FAILURE, EXIT_OK, UsageError, type CliIo } from './cli-io';

type CommandRun = (args: string[], io: CliIo) => Promise<number>;
/** `load` imports the command's module only when it runs: `--help` and each command start without the others. */
type Command = { summary: string; load: () => Promise<CommandRun> };

const COMMANDS: Record<string, Command> = {
  analyze: {
    summary: 'ride figures of a corner file',
    load: async () => (await import('./commands/analyze')).analyzeCommand,
  },
  simulate: {
    summary: 'one road event on the nonlinear quarter car; CSV time history',
    load: async () => (await import('./commands/simulate')).simulateCommand,
  },
  'bench-sim': {
    summary: 'benchmark of the bump simulation (simulations per second)',
    load: async () => (await import('./commands/bench-sim')).benchSimCommand,
  },
  'bench-sweep': {
    summary: 'benchmark of the valving sweep (click combinations per second)',
    load: async () => (await import('./commands/bench-sweep')).benchSweepCommand,
  },
  vehicle: {
    summary: 'add, list, show or delete vehicles',
    load: async () => (await import('./commands/vehicle')).vehicleCommand,
  },
  setup: {
    summary: 'save, show, history and diff of setup revisions',
    load: async () => (await import('./commands/setup')).setupCommand,
  },
  bench: {
    summary: 'import, list and show damper bench runs',
    load: async () => (await import('./commands/bench')).benchCommand,
  },
  'damping-map': {
    summary: "a damper's ζ and modes per click on one corner",
    load: async () => (await import('./commands/damping-map')).dampingMapCommand,
  },
  choose: {
    summary: 'rank every click combination of a damper against targets',
    load: async () => (await import('./commands/choose')).chooseCommand,
  },
  compare: {
    summary: 'two revisions side by side: the track-day sheet',
    load: async () => (await import('./commands/compare')).compareCommand,
  },
  export: {
    summary: 'write a vehicle with its revisions and bench data to a bundle',
    load: async () => (await import('./commands/exchange')).exportCommand,
  },
  import: {
    summary: 'read a bundle into the database',
    load: async () => (await import('./commands/exchange')).importCommand,
  },
  backup: {
    summary: 'copy the whole database, checked',
    load: async () => (await import('./commands/store')).backupCommand,
  },
  check: {
    summary: 'check the database for damage',
    load: async () => (await import('./commands/store')).checkCommand,
  },
  demo: {
    summary: 'load the invented Millbrook demo shop',
    load: async () => (await import('./commands/store')).demoCommand,
  },
};

/**
 * `--db FILE` may come before the command (rideledger --db shop.sqlite vehicle list); each
 * command reads it among its own options, so leading ones are moved behind the arguments.
 */
function globalOptionsMoved(argv: string[]): string[] {
  const moved: string[] = [];
  let i = 0;
  while (i < argv.length) {
    const a = argv[i] as string;
    if (a === '--db' && i + 1 < argv.length) {
      moved.push(a, argv[i + 1] as string);
      i += 2;
    } else if (a.startsWith('--db=')) {
      moved.push(a);
      i += 1;
    } else break;
  }
  return [...argv.slice(i), ...moved];
}

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
  // SQLite's own failures (a lock held too long, a full disk, a damaged file): its words, no stack.
  if (typeof code === 'string' && code.startsWith('SQLITE_'))
    return { line: `the database reported ${code}: ${(e as Error).message}`, code: EXIT_FAILURE };
  return { line: `internal error: ${(e as Error).stack ?? String(e)}`, code: EXIT_FAILURE };
}

/** Runs the command line `argv` (without node and the script); returns the exit code. */
export async function cliMain(argv: string[], io: CliIo): Promise<number> {
  const [name, ...afterName] = globalOptionsMoved(argv);
  // Also between a command and its subcommand: rideledger vehicle --db shop.sqlite list.
  const rest = globalOptionsMoved(afterName);
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
    return await (
      await command.load()
    )(rest, io);
  } catch (e) {
    const { line, code } = errorLine(e);
    // A message may quote what it was given: no control character of it reaches the terminal.
    const shown = textControlsEscaped(line.replace(/\s*\n\s*/g, code === EXIT_FAILURE ? '\n' : ' '));
    io.stderr(`rideledger ${name}: ${shown}\n`);
    return code;
  }
}
