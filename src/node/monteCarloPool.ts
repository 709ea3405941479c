import * as fs from 'node:fs';
import * as path from 'node:path';
import { MessageChannel, Worker, receiveMessageOnPort, type MessagePort } from 'node:worker_threads';
import type { MonteCarloBlockControl, MonteCarloBlockHook, MonteCarloBlockOutcome, MonteCarloJobSpec } from '../core/exact/monteCarloJobSpec';
import { REPLICATES_PER_STREAM } from '../core/exact/random';
import { SLOT, SLOT_COUNT, type PoolFailureMessage, type PoolRunMessage, type PoolWorkerData } from './monteCarloPoolLayout';

/** The caller wakes at least this often to report progress and check cancellation (the engine's ~50 ms contract). */
const WAKE_INTERVAL_MS = 50;
/**
 * A run whose workers show no sign of life for this long is given up as failed. Workers prove life
 * every 64 replicates (milliseconds even for large tables); the margin covers a slow thread start
 * on a busy machine.
 */
export const DEFAULT_STALL_MS = 15_000;

export interface MonteCarloPoolOptions {
  /** Worker threads to run (at least 1). */
  threads: number;
  /** The worker entry; default monteCarloPoolWorker.js beside this module (dist/ when bundled). */
  workerFile?: string;
  /** How long a run may show no progress before it is reported as failed (default DEFAULT_STALL_MS). */
  stallMs?: number;
}

export interface MonteCarloPool {
  readonly threads: number;
  /** The engine's block hook (SearchControl.runBlocks): synchronous, it sleeps with Atomics.wait. */
  readonly runBlocks: MonteCarloBlockHook;
  /** Stops the worker threads. */
  close(): Promise<void>;
}

interface PoolMember {
  worker: Worker;
  reportPort: MessagePort;
  /** Set by the worker's 'error' or 'exit' event (delivered only while the caller is not waiting). */
  lost?: string;
}

/** The worker file's default place: beside this module, which esbuild inlines into dist/*.js. */
export function defaultPoolWorkerFile(): string {
  return path.join(__dirname, 'monteCarloPoolWorker.js');
}

/**
 * A pool of worker threads that simulates Monte Carlo blocks for the synchronous engine: the caller
 * posts a run to the workers, then sleeps on shared memory (Atomics.wait, allowed in worker threads
 * and in Node's main thread), waking every 50 ms to report progress and check cancellation. Workers
 * claim blocks one at a time from a shared counter, so faster threads take more; block j always
 * uses stream j of the seed, so the counts, and the p, do not depend on the number of threads.
 *
 * Failures are data: a worker that throws, a missing worker file or a run that stops showing signs
 * of life ends the run with reason 'failed' and a message, and the next run starts fresh workers.
 * Workers start on the first run and are unref'ed, so they never keep a process alive.
 *
 * @param options - threads, and for tests the worker file and stall limit
 * @returns the pool; its runBlocks goes into the engine's SearchControl
 */
export function createMonteCarloPool(options: MonteCarloPoolOptions): MonteCarloPool {
  if (!Number.isInteger(options.threads) || options.threads < 1) throw new RangeError(`createMonteCarloPool: threads must be a positive integer (got ${options.threads})`);
  const workerFile = options.workerFile ?? defaultPoolWorkerFile();
  const stallMs = options.stallMs ?? DEFAULT_STALL_MS;
  let members: PoolMember[] = [];

  function spawn(): PoolMember {
    const channel = new MessageChannel();
    const data: PoolWorkerData = { reportPort: channel.port2 };
    const worker = new Worker(workerFile, { workerData: data, transferList: [channel.port2] });
    worker.unref();
    channel.port1.unref();
    const member: PoolMember = { worker, reportPort: channel.port1 };
    worker.on('error', (error) => (member.lost = error.message));
    worker.on('exit', (code) => (member.lost ??= `it exited with code ${code}`));
    return member;
  }

  function discard(): void {
    const old = members;
    members = [];
    for (const member of old) {
      member.reportPort.close();
      void member.worker.terminate();
    }
  }

  function failed(reason: string): MonteCarloBlockOutcome {
    return {
      ok: false,
      reason: 'failed',
      message: `The Monte Carlo simulation on ${options.threads} threads stopped unexpectedly (${reason}). Set tallywise.monteCarloThreads (or the command line's --threads) to 1 to simulate on one thread, and please report it with the table.`,
    };
  }

  function runBlocks(spec: MonteCarloJobSpec, blocks: readonly number[], control: MonteCarloBlockControl): MonteCarloBlockOutcome {
    if (blocks.length === 0) return { ok: true, extreme: [] };
    if (members.some((member) => member.lost !== undefined)) discard();
    if (!fs.existsSync(workerFile)) return failed(`its worker file ${workerFile} is missing`);
    const used = Math.min(options.threads, blocks.length);
    try {
      while (members.length < used) members.push(spawn());
    } catch (error) {
      discard();
      return failed(`a worker thread could not start: ${error instanceof Error ? error.message : String(error)}`);
    }
    const shared = new SharedArrayBuffer(SLOT_COUNT * Int32Array.BYTES_PER_ELEMENT);
    const countsBuffer = new SharedArrayBuffer(blocks.length * Int32Array.BYTES_PER_ELEMENT);
    const slots = new Int32Array(shared);
    const counts = new Int32Array(countsBuffer);
    const message: PoolRunMessage = { type: 'run', spec, blocks: [...blocks], control: shared, counts: countsBuffer };
    // A failure report left over from an abandoned run must not be read as this run's reason.
    for (const member of members) while (receiveMessageOnPort(member.reportPort) !== undefined);
    for (const member of members.slice(0, used)) member.worker.postMessage(message);

    const planned = blocks.reduce((sum, block) => sum + Math.min(spec.replicates, (block + 1) * REPLICATES_PER_STREAM) - block * REPLICATES_PER_STREAM, 0);
    let heartbeat = -1;
    let lastSignOfLife = performance.now();
    let lastReport = lastSignOfLife;
    for (;;) {
      const done = Atomics.load(slots, SLOT.done);
      if (done >= blocks.length) break;
      if (Atomics.load(slots, SLOT.failed) === 1) {
        Atomics.store(slots, SLOT.cancel, 1);
        const reason = members.map((member) => receiveMessageOnPort(member.reportPort)?.message as PoolFailureMessage | undefined).find((m) => m !== undefined);
        discard();
        return failed(`a worker thread reported: ${reason?.message ?? 'no reason given'}`);
      }
      if (control.isCancelled?.()) {
        Atomics.store(slots, SLOT.cancel, 1);
        return { ok: false, reason: 'cancelled' };
      }
      const now = performance.now();
      const beat = Atomics.load(slots, SLOT.heartbeat);
      if (beat !== heartbeat) {
        heartbeat = beat;
        lastSignOfLife = now;
      } else if (now - lastSignOfLife > stallMs) {
        Atomics.store(slots, SLOT.cancel, 1);
        discard();
        return failed(`no worker thread showed progress for ${(stallMs / 1000).toLocaleString('en-US')} s`);
      }
      if (now - lastReport >= WAKE_INTERVAL_MS) {
        lastReport = now;
        control.onProgress?.(Atomics.load(slots, SLOT.replicates) / planned);
      }
      Atomics.wait(slots, SLOT.done, done, WAKE_INTERVAL_MS);
    }
    return { ok: true, extreme: Array.from(counts) };
  }

  return {
    threads: options.threads,
    runBlocks,
    close: async () => {
      const old = members;
      members = [];
      for (const member of old) member.reportPort.close();
      await Promise.all(old.map((member) => member.worker.terminate()));
    },
  };
}
