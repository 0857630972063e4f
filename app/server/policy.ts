import { InputError } from '../../core/units/input-error';
import { contract, type HandlerName } from '../api/contract';

/**
 * What the page may not ask of the backend even with its token: handlers and inputs that
 * name files on this machine. A page reads its files itself (a file picker or a native
 * dialog) and sends their text; backups go to the database's own backup folder.
 */
export class PolicyRefusal extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PolicyRefusal';
  }
}

/** Handlers the page may never call over HTTP. */
const REFUSED: ReadonlySet<string> = new Set<HandlerName>(['storeBackup']);

export function handlerNameCheck(name: string): HandlerName {
  if (!Object.hasOwn(contract, name)) throw new PolicyRefusal(`no API handler "${name}"`);
  if (REFUSED.has(name))
    throw new PolicyRefusal(`"${name}" is not available to the page; use the command line`);
  return name as HandlerName;
}

/** Refuses inputs that would make the backend read a path the page chose. */
export function handlerInputCheck(name: HandlerName, input: unknown): void {
  if (name === 'benchImport') {
    const source = (input as { source?: unknown } | null)?.source;
    if (source && typeof source === 'object' && 'path' in source) {
      throw new InputError('source.path', 'the page sends the file’s text, not a path on this machine');
    }
  }
}
