import { describe, expect, it } from 'vitest';
import { csvCellText, csvFormat } from '../../core/units/csv';
import { barCsv, plotCsv } from '../../app/renderer/components/plot-data';
import { historyCsv } from '../../app/cli/commands/simulate';
import type { SimulationHistory } from '../../core/events/metrics';

describe('spreadsheet-safe CSV cells', () => {
  it('writes a text that a spreadsheet would run as a formula with a leading quote', () => {
    // [trade] OWASP "CSV Injection": prefix = + - @ (and tab, CR) with a single quote.
    expect(csvCellText('=1+1')).toBe("'=1+1");
    expect(csvCellText('+cmd|calc')).toBe("'+cmd|calc");
    expect(csvCellText('-2+3')).toBe("'-2+3");
    expect(csvCellText('@SUM(A1:A2)')).toBe("'@SUM(A1:A2)");
    expect(csvCellText('\t=1')).toBe("'\t=1");
    expect(csvCellText('=HYPERLINK("http://x","y")')).toBe('"\'=HYPERLINK(""http://x"",""y"")"');
  });

  it('leaves numbers, and texts that are plain numbers, as numbers', () => {
    expect(csvCellText(-0.25)).toBe('-0.25');
    expect(csvCellText(-1e-7)).toBe('-1e-7');
    expect(csvCellText('-0.25')).toBe('-0.25');
    expect(csvCellText('+3')).toBe('+3');
    expect(csvCellText(Number.NaN)).toBe('');
    expect(csvCellText('ride frequency')).toBe('ride frequency');
    expect(csvCellText('a,b')).toBe('"a,b"');
  });

  it('escapes a plot series named like a formula, and keeps its negative values numbers', () => {
    const text = plotCsv('speed (m/s)', 'force (N)', [{ name: '=cmd()', x: [-0.5, 0.5], y: [-800, 600] }]);
    expect(text).toBe("'=cmd(): speed (m/s),'=cmd(): force (N)\r\n-0.5,-800\r\n0.5,600\r\n");
    const bars = barCsv('setting', 'ζ', ['@bump 3', '-rebound 2'], [{ name: '+FL', values: [-0.1, 0.2] }]);
    expect(bars).toBe("setting,'+FL (ζ)\r\n'@bump 3,-0.1\r\n'-rebound 2,0.2\r\n");
    expect(csvFormat([['-x', -1]], '\n')).toBe("'-x,-1\n");
  });

  it('keeps the simulation CSV as it was: a header, then numbers with their signs', () => {
    const columns = [
      'time',
      'roadHeight',
      'bodyDisplacement',
      'wheelDisplacement',
      'travel',
      'bodyVelocity',
      'wheelVelocity',
      'bodyAccel',
      'damperVelocity',
      'tireLoad',
      'bumpStopForce',
    ] as const;
    const h = Object.fromEntries(
      columns.map((c, i) => [c, [0, -(i + 1) / 3]]),
    ) as unknown as SimulationHistory;
    const lines = historyCsv(h).split('\n');
    expect(lines[0]).toMatch(/^time_s,road_height_m,/);
    expect(lines[2]?.split(',')[0]).toBe('-0.3333333333');
    expect(lines[2]?.startsWith("'")).toBe(false);
    expect(lines).toHaveLength(4);
  });
});
