/**
 * An input the program cannot use, with the path of the field that is wrong
 * (`corner.springRate`, `road.class`) so that every edge — the command, the API,
 * the setup editor — can point at it.
 */
export class InputError extends Error {
  readonly field: string;
  readonly problem: string;

  constructor(field: string, problem: string) {
    super(field ? `${field}: ${problem}` : problem);
    this.name = 'InputError';
    this.field = field;
    this.problem = problem;
  }
}

/** Joins a parent path and a key the way messages show it: `corner` + `damper` → `corner.damper`. */
export function inputFieldPath(parent: string, key: string | number): string {
  if (typeof key === 'number') return `${parent}[${key}]`;
  return parent ? `${parent}.${key}` : key;
}
