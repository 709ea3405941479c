import type { SearchControl } from '../core/exact/choosePValue';
import { createMonteCarloPool, type MonteCarloPool } from './monteCarloPool';
import { worthSpreading } from './worthSpreading';

/** A search control that may hand Monte Carlo blocks to a pool, and how to release the pool. */
export interface PooledControl {
  control: SearchControl;
  /** Stops the pool's threads (a no-op when none were started). */
  close(): Promise<void>;
}

/**
 * Adds a worker pool's block hook to a search control when more than one thread is wanted; with one
 * thread the engine keeps its in-thread loop. Threads start only when a simulation of at least
 * POOL_MIN_CELL_REPLICATES runs; smaller ones are declined and the engine runs them in the calling thread.
 *
 * @param control - cancellation and progress of the caller
 * @param threads - from monteCarloThreadCount (the setting or --threads)
 * @param workerFile - the pool's worker entry (default: beside this module)
 * @returns the control to pass to the engine, and close()
 */
export function searchControlWithPool(control: SearchControl, threads: number, workerFile?: string): PooledControl {
  if (threads <= 1) return { control, close: async () => undefined };
  const pool: MonteCarloPool = createMonteCarloPool({ threads, workerFile });
  // Small simulations are declined, so the engine keeps them in this thread: the pool's threads start only for work that repays them.
  const runBlocks: SearchControl['runBlocks'] = (spec, blocks, blockControl) =>
    worthSpreading(spec) ? pool.runBlocks(spec, blocks, blockControl) : { ok: false, reason: 'declined' };
  return { control: { ...control, runBlocks }, close: () => pool.close() };
}
