import type { MessagePort } from 'node:worker_threads';
import type { MonteCarloJobSpec } from '../core/exact/monteCarloJobSpec';

/**
 * Slots of a run's shared Int32Array, written with Atomics by the pool (the caller's thread) and its
 * worker threads. One fresh buffer per run, so a worker still finishing a cancelled run can never
 * touch the next one.
 */
export const SLOT = {
  /** Index (into the run's block list) of the next block to claim: Atomics.add hands out each block once. */
  next: 0,
  /** Blocks finished; the caller sleeps on this slot and workers notify it. */
  done: 1,
  /** 1 asks the workers to abandon the run. */
  cancel: 2,
  /** 1 when a worker failed; its message is on its port. */
  failed: 3,
  /** Replicates finished, for progress. */
  replicates: 4,
  /** Bumped by every worker at least every REPLICATES_PER_POLL replicates: proof of life. */
  heartbeat: 5,
} as const;

export const SLOT_COUNT = 6;

/** What the pool posts to each worker for a run. */
export interface PoolRunMessage {
  type: 'run';
  spec: MonteCarloJobSpec;
  /** The run's block indices; workers claim positions in this list, counts go to the same positions. */
  blocks: number[];
  control: SharedArrayBuffer;
  /** Int32Array, one extreme count per position of `blocks`. */
  counts: SharedArrayBuffer;
}

/** What a worker posts on its report port when a run fails in it (read synchronously by the pool). */
export interface PoolFailureMessage {
  type: 'failed';
  message: string;
}

/** workerData of a pool worker. */
export interface PoolWorkerData {
  reportPort: MessagePort;
}
