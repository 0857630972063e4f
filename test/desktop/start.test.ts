import { describe, expect, it } from 'vitest';
import { desktopStart } from '../../app/main/start';

describe('npm start', () => {
  it('runs Electron on the built main with the arguments given', async () => {
    const runs: [string, string[]][] = [];
    const code = await desktopStart(['--db', 'shop.sqlite'], {
      electronPath: () => '/opt/electron/electron',
      run: async (program, args) => {
        runs.push([program, args]);
        return 0;
      },
      stderr: () => {
        throw new Error('nothing to say');
      },
    });
    expect(code).toBe(0);
    expect(runs).toHaveLength(1);
    expect(runs[0]?.[0]).toBe('/opt/electron/electron');
    expect(runs[0]?.[1][0]).toMatch(/dist[\\/]desktop[\\/]main\.cjs$/);
    expect(runs[0]?.[1].slice(1)).toEqual(['--db', 'shop.sqlite']);
  });

  it('says what to do, exit code 1, where Electron’s program could not be fetched', async () => {
    let said = '';
    const code = await desktopStart([], {
      electronPath: () => {
        throw new Error('Electron failed to install correctly.\n    at somewhere');
      },
      run: async () => {
        throw new Error('must not run');
      },
      stderr: (t) => (said += t),
    });
    expect(code).toBe(1);
    expect(said).toMatch(
      /needs Electron's program.*could not be here: Electron failed to install correctly\.$/m,
    );
    expect(said).toContain('npm run serve');
    expect(said).not.toContain('at somewhere');
  });
});
