import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import Database from 'better-sqlite3';
import { describe, expect, it } from 'vitest';
import { tempFolder } from '../db/store-fixture';
import { cli, fileDigest } from './cli-fixture';

const COUPE = 'Millbrook coupe #27';
const DEMO = fileURLToPath(new URL('../../assets/demo/', import.meta.url));

/** The demo shop in a fresh database, and its coupe exported as a bundle. */
async function demoExported(): Promise<{ dir: string; db: string; bundle: Record<string, unknown> }> {
  const dir = tempFolder();
  const db = join(dir, 'shop.sqlite');
  expect((await cli('--db', db, 'demo')).code).toBe(0);
  const file = join(dir, 'coupe.json');
  expect((await cli('--db', db, 'export', COUPE, '--out', file)).code).toBe(0);
  return { dir, db, bundle: JSON.parse(readFileSync(file, 'utf8')) as Record<string, unknown> };
}

describe('rideledger import checks every record of a bundle', () => {
  it('refuses a revision name with a terminal escape: exit 2, the field named, nothing stored', async () => {
    const { dir, bundle } = await demoExported();
    const revisions = bundle.revisions as { name: string }[];
    revisions[1]!.name = 'Wet\u001b[2J';
    const file = join(dir, 'crafted.json');
    writeFileSync(file, JSON.stringify(bundle));
    const target = join(dir, 'other.sqlite');
    expect((await cli('--db', target, 'vehicle', 'add', 'Other car')).code).toBe(0);
    const before = fileDigest(target);
    const out = await cli('--db', target, 'import', file, '--as', 'Copy');
    expect(out.code).toBe(2);
    expect(out.stderr).toMatch(/revisions\[1\]\.name: contains a control character/);
    // The message itself carries no escape to the terminal.
    expect(out.stderr).not.toContain('\u001b');
    expect(fileDigest(target)).toBe(before);
  });

  it('quotes a bad value in a message without letting its escape reach the terminal', async () => {
    const dir = tempFolder();
    const sheet = JSON.parse(readFileSync(join(DEMO, 'setups', 'coupe-27', '01-baseline.json'), 'utf8')) as {
      corners: { FL: { rideHeight: unknown } };
    };
    sheet.corners.FL.rideHeight = '95\u001b[2J mm';
    const file = join(dir, 'sheet.json');
    writeFileSync(file, JSON.stringify(sheet));
    const out = await cli('--db', join(dir, 'shop.sqlite'), 'setup', 'save', file, '--vehicle', 'Car');
    expect(out.code).toBe(2);
    expect(out.stderr).toMatch(/corners\.FL\.rideHeight: .*95\\u001b\[2J mm/);
    expect(out.stderr).not.toContain('\u001b');
  });

  it('refuses revision number 2^53 − 1 through the command, and the database stays whole', async () => {
    const { dir, bundle } = await demoExported();
    const revisions = bundle.revisions as { number: number }[];
    revisions[revisions.length - 1]!.number = Number.MAX_SAFE_INTEGER;
    const file = join(dir, 'crafted.json');
    writeFileSync(file, JSON.stringify(bundle));
    const target = join(dir, 'other.sqlite');
    expect((await cli('--db', target, 'vehicle', 'add', 'Other car')).code).toBe(0);
    const before = fileDigest(target);
    const out = await cli('--db', target, 'import', file);
    expect(out.code).toBe(2);
    expect(out.stderr).toMatch(/revisions\[\d+\]\.number: got 9007199254740991/);
    expect(fileDigest(target)).toBe(before);
    expect((await cli('--db', target, 'check')).code).toBe(0);
  });
});

describe('rideledger check', () => {
  it('exits 1 and names a revision number broken by raw SQL', async () => {
    const { db } = await demoExported();
    expect((await cli('--db', db, 'check')).code).toBe(0);
    const raw = new Database(db);
    raw.exec(`DROP TRIGGER setup_revision_immutable;
      UPDATE setup_revision SET number = 9007199254740991
      WHERE id = (SELECT max(r.id) FROM setup_revision r JOIN vehicle v ON v.id = r.vehicle_id
                  WHERE v.name = '${COUPE}')`);
    raw.close();
    const out = await cli('--db', db, 'check');
    expect(out.code).toBe(1);
    expect(out.stdout).toMatch(/Check FAILED/);
    expect(out.stdout).toMatch(
      /vehicle Millbrook coupe #27: its \d+ revisions are numbered 1 to 9007199254740991; they must be 1 to \d+, each once/,
    );
  });

  it('shows a stored name with a terminal escape escaped in setup history, and check names it', async () => {
    const { db } = await demoExported();
    const raw = new Database(db);
    raw.exec(`DROP TRIGGER setup_revision_immutable;
      UPDATE setup_revision SET name = 'Wet' || char(27) || '[2J' WHERE number = 1`);
    raw.close();
    const history = await cli('--db', db, 'setup', 'history', COUPE);
    expect(history.code).toBe(0);
    expect(history.stdout).toContain('Wet\\u001b[2J');
    expect(history.stdout).not.toContain('\u001b');
    const check = await cli('--db', db, 'check');
    expect(check.code).toBe(1);
    expect(check.stdout).toMatch(/revision Millbrook coupe #27@1: name: contains a control character/);
    expect(check.stdout).not.toContain('\u001b');
  });
});
