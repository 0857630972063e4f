import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { contract } from '../../app/api/contract';
import { handlers } from '../../app/api/handlers/index';
import { InputError } from '../../core/input-error';

const demo = JSON.parse(
  readFileSync(new URL('../../assets/demo/club-coupe-front-left.json', import.meta.url), 'utf8'),
) as Record<string, unknown>;

function fieldOf(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as InputError).field;
  }
  throw new Error('expected an InputError');
}

describe('the API contract', () => {
  it('has a handler for every entry and an entry for every handler', () => {
    expect(Object.keys(handlers).sort()).toEqual(Object.keys(contract).sort());
  });

  it('analyzeCorner returns a report its output schema accepts', () => {
    const report = apiCall('analyzeCorner', { file: demo, frequencies: [1, 2] });
    expect(report.frf).toHaveLength(2);
    expect(contract.analyzeCorner.output.safeParse(report).success).toBe(true);
  });

  it('rejects invalid input before the handler runs, naming the field', () => {
    expect(fieldOf(() => apiCall('analyzeCorner', { file: demo, frequencies: [1, -2] }))).toBe(
      'frequencies[1]',
    );
    expect(fieldOf(() => apiCall('analyzeCorner', { file: demo, frequencies: [] }))).toBe('frequencies');
    expect(fieldOf(() => apiCall('analyzeCorner', { file: demo, extra: 1 }))).toBe('');
    expect(fieldOf(() => apiCall('analyzeCorner', null))).toBe('');
  });

  it('passes core’s field path through for a bad corner', () => {
    const bad = { ...demo, corner: { ...(demo.corner as object), springRate: '70 kg' } };
    expect(fieldOf(() => apiCall('analyzeCorner', { file: bad }))).toBe('corner.springRate');
  });
});
