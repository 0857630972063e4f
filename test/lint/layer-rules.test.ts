import { readFileSync } from 'node:fs';
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

const ROOT = new URL('../..', import.meta.url).pathname;

/** Lints a fixture's text as if it stood at `asPath` in the tree, and returns the rules it broke. */
async function rulesBroken(fixture: string, asPath: string): Promise<string[]> {
  const eslint = new ESLint({ cwd: ROOT });
  const text = readFileSync(new URL(`fixtures/${fixture}`, import.meta.url), 'utf8');
  const [result] = await eslint.lintText(text, { filePath: `${ROOT}${asPath}` });
  return (result?.messages ?? []).map((m) => m.ruleId ?? m.message);
}

describe('the layer rules of core/', () => {
  it('refuse a numerical tool that imports valving', async () => {
    expect(await rulesBroken('numeric-imports-valving.ts.txt', 'core/numeric/lint-fixture.ts')).toContain(
      'no-restricted-imports',
    );
  });

  it('refuse events importing valving, the reverse of the allowed direction', async () => {
    expect(await rulesBroken('events-imports-valving.ts.txt', 'core/events/lint-fixture.ts')).toContain(
      'no-restricted-imports',
    );
  });

  it('allow valving to import events', async () => {
    expect(await rulesBroken('valving-imports-events.ts.txt', 'core/valving/lint-fixture.ts')).toEqual([]);
  });

  it('refuse IO in core/', async () => {
    expect(await rulesBroken('corner-imports-sqlite.ts.txt', 'core/corner/lint-fixture.ts')).toContain(
      'no-restricted-imports',
    );
  });
});
