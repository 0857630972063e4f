import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import type { HandlerName } from '../../app/api/contract';
import { FILE_DEPTH_MAX, FILE_TEXT_MAX, TABLE_POINTS_MAX } from '../../app/api/input-bounds';
import { InputError } from '../../core/units/input-error';
import { NAME_MAX_LENGTH, NOTES_MAX_LENGTH, textFieldParse, textLength } from '../../core/units/text-field';
import { storeClose, storeOpen, type Store } from '../../db/store';

// Sizes are limited before anything is parsed or copied (issue 11, item 2): a field over its
// limit is refused at once, with the field named, and nothing is stored.

let dir: string;
let store: Store;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'rideledger-limits-'));
  store = storeOpen(join(dir, 'shop.sqlite'));
});
afterAll(() => {
  storeClose(store);
  rmSync(dir, { recursive: true, force: true });
});

async function refusal(name: HandlerName, input: unknown): Promise<InputError> {
  try {
    await apiCall(name, input as never, { store });
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error(`${name} accepted the input`);
}

const corner = () =>
  JSON.parse(readFileSync('assets/demo/club-coupe-rear-left.json', 'utf8')) as {
    corner: { damper: { bump: { points: unknown[] } } };
    name: unknown;
  };
const table = (n: number) => Array.from({ length: n }, (_, i) => [0.001 * (i + 1), 100 + i]);

describe('text fields', () => {
  it('refuses a 60 MB notes field at once, naming it, and stores nothing', async () => {
    const notes = 'n'.repeat(60 * 1024 * 1024);
    const started = performance.now();
    const e = await refusal('vehicleAdd', { name: 'Limits coupe', notes });
    const ms = performance.now() - started;
    expect(e.field).toBe('notes');
    expect(e.message).toContain(`at most ${NOTES_MAX_LENGTH} are kept`);
    // Once it took 21 s and 2.3 GB (the text spread into an array to count it).
    expect(ms).toBeLessThan(2000);
    expect((await apiCall('vehicleList', {}, { store })).vehicles).toEqual([]);
  });

  it('counts characters, not UTF-16 units: an emoji is one', () => {
    // U+1F697 is two UTF-16 units, one character [calc].
    expect(textLength('🚗🚗a')).toBe(3);
    expect(textLength('x'.repeat(50), 10)).toBe(11);
    const name = '🚗'.repeat(NAME_MAX_LENGTH);
    expect(textFieldParse(name, 'name', { maxLength: NAME_MAX_LENGTH })).toBe(name);
    expect(() => textFieldParse(`${name}🚗`, 'name', { maxLength: NAME_MAX_LENGTH })).toThrow(
      `is ${NAME_MAX_LENGTH + 1} characters long; at most ${NAME_MAX_LENGTH} are kept`,
    );
  });

  it('keeps a text at its limit with spaces around it, as before', () => {
    const notes = `  ${'é'.repeat(NOTES_MAX_LENGTH)}\n\n  `;
    expect(textLength(textFieldParse(notes, 'notes', { maxLength: NOTES_MAX_LENGTH, multiline: true }))).toBe(
      NOTES_MAX_LENGTH,
    );
  });
});

describe('corner and setup files', () => {
  it(`reads a table of ${TABLE_POINTS_MAX} points and refuses one more, naming the table`, async () => {
    const ok = corner();
    ok.corner.damper.bump.points = table(TABLE_POINTS_MAX);
    const report = await apiCall('analyzeCorner', { file: ok }, { store });
    expect(report.wheelRate).toBeGreaterThan(0);
    const over = corner();
    over.corner.damper.bump.points = table(TABLE_POINTS_MAX + 1);
    const e = await refusal('analyzeCorner', { file: over });
    expect(e.field).toBe('file.corner.damper.bump.points');
    expect(e.message).toContain(`has ${TABLE_POINTS_MAX + 1} entries; at most ${TABLE_POINTS_MAX} points`);
    // A 10⁵-point table, which once held every other call for seconds, is refused at once.
    over.corner.damper.bump.points = table(100_000);
    const started = performance.now();
    expect((await refusal('analyzeCorner', { file: over })).field).toBe('file.corner.damper.bump.points');
    expect(performance.now() - started).toBeLessThan(1000);
  });

  it('refuses a file nested too deep or holding a giant text, naming where', async () => {
    let deep: unknown = 1;
    for (let i = 0; i < 100_000; i++) deep = [deep];
    const e = await refusal('analyzeCorner', { file: { corner: deep } });
    expect(e.field.startsWith('file.corner[0]')).toBe(true);
    expect(e.message).toContain(`${FILE_DEPTH_MAX} levels`);
    const long = corner();
    long.name = 'x'.repeat(FILE_TEXT_MAX + 1);
    expect((await refusal('analyzeCorner', { file: long })).field).toBe('file.name');
  });

  it('refuses an oversized setup file before it is read, and stores nothing', async () => {
    const e = await refusal('setupSave', {
      file: { vehicle: 'Nobody', corners: { FL: { damper: { bump: { points: table(5000) } } } } },
    });
    expect(e.field).toBe('file.corners.FL.damper.bump.points');
    expect((await apiCall('vehicleList', {}, { store })).vehicles).toEqual([]);
  });
});
