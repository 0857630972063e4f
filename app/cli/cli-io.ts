/** Where a command writes; tests pass their own to capture output. */
export type CliIo = {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
};

/** Exit codes: 0 done, 1 the program failed, 2 the input or the command line is wrong. */
export const EXIT_OK = 0;
export const EXIT_FAILURE = 1;
export const EXIT_BAD_INPUT = 2;

/** A wrong command line (unknown option, missing file name): reported as one line, exit 2. */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}
