import { monteCarloIndependenceBlocks } from './monteCarloIndependenceBlocks';
import type { MonteCarloComputed, MonteCarloOptions } from './monteCarloOptions';
import { monteCarloPValue } from './monteCarloPValue';
import type { ExactPValue } from './types';

/**
 * Monte Carlo p-value for independence in an r×c table with both margins fixed: the share of
 * random tables (Patefield's AS 159, 1981) at least as extreme as the observed one, reported as
 * (b + 1)/(R + 1) (Phipson & Smyth 2010) with a Clopper–Pearson interval on the exact p.
 *
 * Intuition: when the table is too big to enumerate, drawing many tables with the same margins and
 * counting the extreme ones estimates the Freeman–Halton exact p, with a stated uncertainty.
 *
 * Deterministic: the same table, seed and R give the same p on any machine; replicate i uses stream
 * ⌊i/1000⌋ of the seed (see monteCarloIndependenceBlocks for running blocks in parallel).
 *
 * @param observed - rows of nonnegative integer counts
 * @param options - replicates R, seed, budget, statistic ('probability' default, or 'pearson'), intervalLevel, runBlocks (a worker pool)
 * @returns method 'monte-carlo-patefield' with p, replicates, seed and interval; or why the budget (or a failed worker pool) stopped it
 */
export function monteCarloIndependence(observed: readonly (readonly number[])[], options: MonteCarloOptions): MonteCarloComputed<ExactPValue> {
  const count = monteCarloIndependenceBlocks(observed, options);
  if (!count.ok) return count;
  return { ok: true, value: monteCarloPValue(count.value, options.seed, 'monte-carlo-patefield', options.intervalLevel) };
}
