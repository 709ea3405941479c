import * as os from 'node:os';

/** The automatic thread count never passes this: beyond it the caller's other work and memory bandwidth dominate (our choice). */
export const AUTOMATIC_THREAD_CAP = 4;
/** The most threads a person may ask for. */
export const MAX_MONTE_CARLO_THREADS = 64;

/**
 * How many threads simulate Monte Carlo blocks: the requested number, or with 0 (automatic) the
 * available cores, at most AUTOMATIC_THREAD_CAP. Any count gives the same p for the same seed.
 *
 * @param requested - 0 or undefined for automatic, else a whole number from 1 to MAX_MONTE_CARLO_THREADS
 * @param cores - the cores available (default os.availableParallelism())
 * @returns a whole number of threads, at least 1
 */
export function monteCarloThreadCount(requested: number | undefined, cores = os.availableParallelism()): number {
  if (requested !== undefined && Number.isInteger(requested) && requested > 0) return Math.min(requested, MAX_MONTE_CARLO_THREADS);
  return Math.max(1, Math.min(cores, AUTOMATIC_THREAD_CAP));
}
