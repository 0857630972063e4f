import { describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { fieldWords, messagePlain } from '../../app/renderer/plain-words';
import { InputError } from '../../core/units/input-error';
import { damperUnitResolve } from '../../db/damper-units';
import { freshContext } from '../api/api-fixture';

const COUPE = 'Millbrook coupe #27';
/** What a screen must not show: a command-line option, a command's placeholder, a field's path. */
const COMMAND_WORDS = /--[a-z]|\bFILE\b|\bLABEL\b|\bNAME\b|\b[a-z]+[A-Z][a-zA-Z]*\b|\w\.\w/;

/** The message a screen shows for what a handler refuses. */
async function shown(call: () => Promise<unknown>): Promise<string> {
  try {
    await call();
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    return messagePlain(e.message, e.field);
  }
  throw new Error('expected the call to be refused');
}

describe('plain words in the app', () => {
  it('shows what the backend refuses without command-line options or field paths', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    const { bundle } = await apiCall('storeExport', { vehicle: COUPE }, ctx);
    const messages = [
      await shown(() => apiCall('storeImport', { bundle }, ctx)),
      await shown(() => apiCall('valvingMap', { vehicle: COUPE, corner: 'FL', damper: 'MB-XX' }, ctx)),
      await shown(() =>
        apiCall('valvingChoose', { vehicle: COUPE, corners: ['FR'], preset: 'track-day', threads: 0 }, ctx),
      ),
      await shown(() => apiCall('benchShow', { run: 99999 }, ctx)),
    ];
    expect(messages[0]).toBe(
      `Vehicle name: a vehicle named "${COUPE}" is already in this database; nothing was imported`,
    );
    expect(messages[2]).toMatch(/import a bench file for it on the Dampers screen/);
    for (const m of messages) expect(m, m).not.toMatch(COMMAND_WORDS);
    const empty = freshContext();
    await apiCall('vehicleAdd', { name: 'Coupe' }, empty);
    const none = await shown(async () => damperUnitResolve(empty.store.db, 'X'));
    expect(none).toMatch(/the library is empty \(import a bench file on the Dampers screen\)/);
    const noSetup = await shown(() => apiCall('valvingMap', { vehicle: 'Coupe', corner: 'FL' }, empty));
    expect(noSetup).toMatch(/has no setup saved yet: save one on the Setup sheet/);
    expect(noSetup).not.toMatch(COMMAND_WORDS);
  });

  it('writes a field path in words', () => {
    expect(fieldWords('corners.FL.corner.cornerMass')).toBe('FL corner mass');
    expect(fieldWords('corners.RR.corner.damper.bump.lowSpeed')).toBe('RR damper bump low speed');
    expect(fieldWords('--as')).toBe('vehicle name');
    expect(messagePlain('corners.FL.corner.cornerMass: is missing', 'corners.FL.corner.cornerMass')).toBe(
      'FL corner mass: is missing',
    );
    expect(messagePlain('nothing here', undefined)).toBe('nothing here');
  });
});
