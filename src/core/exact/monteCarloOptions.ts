import type { MonteCarloBlockHook } from './monteCarloJobSpec';
import type { Budget, Computed } from './types';

/** What makes a simulated table or outcome "at least as extreme" as the observed one. */
export type MonteCarloStatistic = 'probability' | 'pearson';

export interface MonteCarloOptions {
  /** Number of simulated tables or outcomes R (a positive integer). */
  replicates: number;
  /** Any integer; reported with the result so the run can be repeated exactly. */
  seed: number;
  budget?: Partial<Budget>;
  /** 'probability' (default): no more probable than the observed; 'pearson': X² at least the observed. */
  statistic?: MonteCarloStatistic;
  /** Confidence level of the reported Monte Carlo interval (default MONTE_CARLO_INTERVAL_LEVEL). */
  intervalLevel?: number;
  /** Simulates blocks elsewhere (a worker pool); without it they run in this thread. Same counts either way. */
  runBlocks?: MonteCarloBlockHook;
}

/** The block hook could not finish (a worker thread failed): the message says why, for an Issue. */
export type MonteCarloFailed = { ok: false; reason: 'failed'; message: string; elapsedMs: number };

/** A Monte Carlo result, or why it stopped: the budget's reasons, or a failed block hook. */
export type MonteCarloComputed<T> = Computed<T> | MonteCarloFailed;

/** A run of whole blocks of REPLICATES_PER_STREAM replicates: blocks firstBlock .. firstBlock + blockCount − 1. */
export interface MonteCarloBlockRange {
  firstBlock: number;
  blockCount: number;
}

/** The raw simulation count for a block range; counts over disjoint ranges add up. */
export interface MonteCarloCount {
  /** Replicates at least as extreme as the observed data (b). */
  extreme: number;
  /** Replicates simulated in the range. */
  replicates: number;
  elapsedMs: number;
}

/**
 * Default confidence level of the Monte Carlo interval on p: 99%, wider than the usual 95% because
 * it answers "could more replicates move p across a threshold?" (our choice).
 */
export const MONTE_CARLO_INTERVAL_LEVEL = 0.99;
