import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));

/** The project files a file imports (relative imports, `import type` included), by path from the root. */
function importsOf(file: string): string[] {
  const text = readFileSync(join(ROOT, file), 'utf8');
  const out: string[] = [];
  for (const m of text.matchAll(/(?:^|\n)\s*(?:import|export)\b[^'"]*?from\s+['"](\.{1,2}\/[^'"]+)['"]/g)) {
    let target = resolve(join(ROOT, dirname(file)), m[1] as string).slice(ROOT.length);
    if (!/\.(ts|js)$/.test(target)) target += '.ts';
    out.push(target.replace(/^\//, ''));
  }
  return out;
}

/** The first import cycle among `files`, as the list of files around it; undefined when none. */
function cycleFind(files: string[], edges: (file: string) => string[] = importsOf): string[] | undefined {
  const inSet = new Set(files);
  const state = new Map<string, 'open' | 'done'>();
  const path: string[] = [];
  const visit = (f: string): string[] | undefined => {
    if (state.get(f) === 'done') return undefined;
    if (state.get(f) === 'open') return [...path.slice(path.indexOf(f)), f];
    state.set(f, 'open');
    path.push(f);
    for (const next of edges(f).filter((n) => inSet.has(n))) {
      const cycle = visit(next);
      if (cycle) return cycle;
    }
    path.pop();
    state.set(f, 'done');
    return undefined;
  };
  for (const f of files) {
    const cycle = visit(f);
    if (cycle) return cycle;
  }
  return undefined;
}

describe('the server modules', () => {
  it('import one another without a cycle (api-failure and jobs included)', () => {
    const files = readdirSync(join(ROOT, 'app/server'))
      .filter((f) => f.endsWith('.ts'))
      .map((f) => `app/server/${f}`);
    expect(files).toContain('app/server/api-failure.ts');
    expect(importsOf('app/server/jobs.ts')).toContain('app/server/api-failure.ts');
    expect(cycleFind(files)).toBeUndefined();
  });

  it('finds a cycle where there is one (the check itself)', () => {
    const graph: Record<string, string[]> = { a: ['b'], b: ['c'], c: ['a'], d: ['a'] };
    expect(cycleFind(['d', 'a', 'b', 'c'], (f) => graph[f] ?? [])).toEqual(['a', 'b', 'c', 'a']);
    expect(cycleFind(['d', 'a', 'b'], (f) => graph[f] ?? [])).toBeUndefined();
  });
});
