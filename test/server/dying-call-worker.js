// A stand-in thread for the call pool's tests: answers every call with the body and its thread,
// holds its thread for 200 ms on "hold", and ends its thread on "die".
import { parentPort, threadId } from 'node:worker_threads';

parentPort.postMessage({ ready: true });
parentPort.on('message', (m) => {
  if (m.name === 'die') process.exit(3);
  if (m.name === 'hold') Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 200);
  parentPort.postMessage({ id: m.id, ok: true, value: { echoed: m.body, threadId } });
});
