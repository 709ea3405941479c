import { monteCarloGoodnessOfFitBlocks } from './monteCarloGoodnessOfFitBlocks';
import type { MonteCarloComputed, MonteCarloOptions } from './monteCarloOptions';
import { monteCarloPValue } from './monteCarloPValue';
import type { ExactPValue } from './types';

/**
 * Monte Carlo p-value for goodness of fit: the share of multinomial outcomes, drawn under the
 * hypothesised proportions, at least as extreme as the observed counts, reported as (b + 1)/(R + 1)
 * (Phipson & Smyth 2010) with a Clopper–Pearson interval on the exact p.
 *
 * Intuition: when there are too many possible outcomes to add up exactly, simulating the
 * hypothesis many times and counting the extreme outcomes estimates the exact multinomial p.
 *
 * Deterministic: the same counts, proportions, seed and R give the same p on any machine; replicate i
 * uses stream ⌊i/1000⌋ of the seed (see monteCarloGoodnessOfFitBlocks for parallel blocks).
 *
 * @param observed - counts per category (nonnegative integers)
 * @param expectedProportions - hypothesised proportions (nonnegative, any scale, positive sum)
 * @param options - replicates R, seed, budget, statistic ('probability' default, or 'pearson'), intervalLevel, runBlocks (a worker pool)
 * @returns method 'monte-carlo-multinomial' with p, replicates, seed and interval; or why the budget (or a failed worker pool) stopped it
 */
export function monteCarloGoodnessOfFit(observed: readonly number[], expectedProportions: readonly number[], options: MonteCarloOptions): MonteCarloComputed<ExactPValue> {
  const count = monteCarloGoodnessOfFitBlocks(observed, expectedProportions, options);
  if (!count.ok) return count;
  return { ok: true, value: monteCarloPValue(count.value, options.seed, 'monte-carlo-multinomial', options.intervalLevel) };
}
