/**
 * `npm run bench:analysis`: what the Ride figures screen asks of its worker, measured on this
 * machine — the whole analysis of a four-corner demo revision (figures, modes, the linear step
 * and its history, the frequency response, the random road, the nonlinear bump and its
 * history) and the tables and plots made from it. A benchmark, not a test: it prints medians
 * and exits 1 when the 200 ms budget for a whole analysis is missed (the worker keeps the page
 * responsive whatever it takes; the budget is how long the figures keep the user waiting).
 * Profile it with `node --cpu-prof --import tsx test/bench/analysis-bench.ts`.
 */
import { readFileSync, readdirSync } from 'node:fs';
import { analysisCornersOf, setupAnalyze } from '../../app/renderer/analysis-result';
import { analysisFigureGroups } from '../../app/renderer/analysis-figures';
import {
  analysisOptionTextsDefault,
  analysisOptionsRead,
  type AnalysisOptions,
} from '../../app/renderer/analysis-options';
import { analysisPlots } from '../../app/renderer/analysis-plots';

const dir = new URL('../../assets/demo/setups/', import.meta.url);
const files = readdirSync(dir, { recursive: true })
  .map(String)
  .filter((f) => f.endsWith('.json'))
  .sort();
const revisions = files.map((f) => analysisCornersOf(JSON.parse(readFileSync(new URL(f, dir), 'utf8'))));
const options = (analysisOptionsRead(analysisOptionTextsDefault('si'), 'si') as { options: AnalysisOptions })
  .options;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] as number;
}

function timed(rounds: number, fn: () => unknown): number {
  fn(); // warm-up: JIT
  const ms: number[] = [];
  for (let i = 0; i < rounds; i++) {
    const t = performance.now();
    fn();
    ms.push(performance.now() - t);
  }
  return median(ms);
}

let k = 0;
const next = () => revisions[k++ % revisions.length] as (typeof revisions)[number];
const analysis = timed(30, () => setupAnalyze(next(), options));
const result = setupAnalyze(revisions[0] as (typeof revisions)[number], options);
const shown = timed(30, () => {
  analysisFigureGroups(result, 'us');
  analysisPlots(result, 'us');
});
const rows = [
  {
    what: `whole analysis of a revision (median of 30 over ${revisions.length} demo revisions)`,
    ms: analysis,
    budget: 200,
  },
  { what: 'figures table and plot series from a result, in US units', ms: shown, budget: 20 },
];
for (const r of rows) console.log(`${r.ms.toFixed(1).padStart(8)} ms  (budget ${r.budget} ms)  ${r.what}`);
if (rows.some((r) => r.ms > r.budget)) process.exitCode = 1;
