// Worker-thread entry of the Monte Carlo pool (dist/monteCarloPoolWorker.js): claims blocks of a run
// from shared memory, simulates them with the core's block runner and writes their counts back.
import { parentPort, workerData } from 'node:worker_threads';
import { monteCarloBlockRunner } from '../core/exact/monteCarloBlockRunner';
import { SLOT, type PoolFailureMessage, type PoolRunMessage, type PoolWorkerData } from './monteCarloPoolLayout';

const { reportPort } = workerData as PoolWorkerData;

function run(message: PoolRunMessage): void {
  const control = new Int32Array(message.control);
  const counts = new Int32Array(message.counts);
  Atomics.add(control, SLOT.heartbeat, 1);
  const runner = monteCarloBlockRunner(message.spec);
  const poll = (): boolean => {
    Atomics.add(control, SLOT.heartbeat, 1);
    return Atomics.load(control, SLOT.cancel) === 1;
  };
  while (Atomics.load(control, SLOT.cancel) !== 1) {
    const position = Atomics.add(control, SLOT.next, 1);
    if (position >= message.blocks.length) return;
    const block = message.blocks[position];
    const extreme = runner.countBlock(block, poll);
    if (extreme < 0) return;
    Atomics.store(counts, position, extreme);
    Atomics.add(control, SLOT.replicates, runner.blockReplicates(block));
    Atomics.add(control, SLOT.done, 1);
    Atomics.notify(control, SLOT.done);
  }
}

parentPort?.on('message', (message: PoolRunMessage) => {
  try {
    run(message);
  } catch (error) {
    // The message goes first, so the pool finds it on the port as soon as it sees the flag.
    const failure: PoolFailureMessage = { type: 'failed', message: error instanceof Error ? error.message : String(error) };
    reportPort.postMessage(failure);
    const control = new Int32Array(message.control);
    Atomics.store(control, SLOT.failed, 1);
    Atomics.notify(control, SLOT.done);
  }
});
