import { parentPort } from 'node:worker_threads';
import { valvingEvaluatorOf, type ValvingEvaluator } from '../../core/valving/valving-evaluate';
import { valvingChunkEvaluate } from '../../core/valving/valving-sweep';
import type { ValvingWorkerReply, ValvingWorkerRequest } from './valving-pool';

/**
 * A sweep worker of ValvingPool: it takes a job, then evaluates the ranges it is sent and
 * hands back each chunk. The pool runs it bundled into one script (valvingWorkerCode).
 */
const port = parentPort;
if (!port) throw new Error('valving-worker.ts runs as a worker thread (see valving-pool.ts)');
let current: { sweep: number; evaluator: ValvingEvaluator; stop: Int32Array } | null = null;
const reply = (m: ValvingWorkerReply) => port.postMessage(m);
port.on('message', (m: ValvingWorkerRequest) => {
  if (m.type === 'job') {
    current = { sweep: m.sweep, evaluator: valvingEvaluatorOf(m.job), stop: new Int32Array(m.stop) };
    return;
  }
  const c = current;
  if (!c || c.sweep !== m.sweep) throw new Error(`range of sweep ${m.sweep} came before its job`);
  const chunk = valvingChunkEvaluate(c.evaluator, m.start, m.end, {
    // The caller's stop, seen between combinations even while this thread is busy.
    shouldStop: () => Atomics.load(c.stop, 0) !== 0,
  });
  reply({ type: 'chunk', sweep: m.sweep, chunk });
});
reply({ type: 'ready' });
