import type { MonteCarloStatistic } from './monteCarloOptions';

/** What every Monte Carlo job carries: enough to simulate any of its blocks anywhere. */
interface MonteCarloJobCommon {
  /** R, the run's total number of replicates (the last block holds the remainder). */
  replicates: number;
  /** The run's seed; block j draws from stream j of it. */
  seed: number;
  statistic: MonteCarloStatistic;
  /**
   * A replicate counts as extreme when its score is at least this: the observed score with the tie
   * tolerance already applied, computed once by the caller so every thread compares against the
   * same number (it may be +Infinity when the observed data are impossible under the hypothesis).
   */
  threshold: number;
}

/** r×c independence with both margins fixed (Patefield tables). */
export interface MonteCarloIndependenceJob extends MonteCarloJobCommon {
  kind: 'independence';
  rowTotals: number[];
  columnTotals: number[];
}

/** Goodness of fit: multinomial outcomes of `total` observations with the given (normalised) proportions. */
export interface MonteCarloGoodnessOfFitJob extends MonteCarloJobCommon {
  kind: 'goodness-of-fit';
  total: number;
  proportions: number[];
}

/**
 * A Monte Carlo job as plain data (numbers and arrays only), so it survives structured cloning to a
 * worker thread or a Web Worker unchanged, doubles and Infinity included.
 */
export type MonteCarloJobSpec = MonteCarloIndependenceJob | MonteCarloGoodnessOfFitJob;

/**
 * Extreme counts per requested block (same order), or why the blocks were not all simulated.
 * 'declined' hands the blocks back: the engine then runs them in its own thread (a job too small
 * to be worth another thread's start-up).
 */
export type MonteCarloBlockOutcome =
  | { ok: true; extreme: number[] }
  | { ok: false; reason: 'cancelled' }
  | { ok: false; reason: 'declined' }
  | { ok: false; reason: 'failed'; message: string };

/** Cancellation and progress as the engine passes them to a block hook. */
export interface MonteCarloBlockControl {
  /** Polled about every 50 ms; true stops the run with 'cancelled'. */
  isCancelled?: () => boolean;
  /** Fraction of the requested blocks' replicates done, at most about every 50 ms. */
  onProgress?: (fraction: number) => void;
}

/**
 * A synchronous stand-in for the engine's in-thread loop: simulates the given blocks of a job
 * (anywhere: worker threads, Web Workers) and returns their extreme counts. Synchronous so the
 * engine stays synchronous; a Node host waits with Atomics.wait (see src/node/monteCarloPool.ts).
 */
export type MonteCarloBlockHook = (spec: MonteCarloJobSpec, blocks: readonly number[], control: MonteCarloBlockControl) => MonteCarloBlockOutcome;
