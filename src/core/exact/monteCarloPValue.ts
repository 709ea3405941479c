import { monteCarloInterval } from './monteCarloInterval';
import { MONTE_CARLO_INTERVAL_LEVEL, type MonteCarloCount } from './monteCarloOptions';
import type { ExactMethod, ExactPValue } from './types';

/**
 * The Monte Carlo p-value from a count, p = (b + 1)/(R + 1) (Phipson & Smyth, "Permutation p-values
 * should never be zero: calculating exact p-values when permutations are randomly drawn",
 * Statistical Applications in Genetics and Molecular Biology 9(1), art. 39, 2010).
 *
 * Intuition: the observed data are one more draw from the null distribution, so counting them
 * among the replicates gives a p that is never zero and never anti-conservative.
 *
 * @param count - b and R, possibly summed over block ranges run by several workers
 * @param seed - the run's seed, reported so the run can be repeated
 * @param method - which simulation produced the count
 * @param intervalLevel - level of the Clopper–Pearson interval on the exact p
 * @returns the p-value with its replicates, seed and interval
 */
export function monteCarloPValue(
  count: MonteCarloCount,
  seed: number,
  method: Extract<ExactMethod, 'monte-carlo-patefield' | 'monte-carlo-multinomial'>,
  intervalLevel = MONTE_CARLO_INTERVAL_LEVEL,
): ExactPValue {
  const p = (count.extreme + 1) / (count.replicates + 1);
  return {
    method,
    p,
    log10p: Math.log10(p),
    elapsedMs: count.elapsedMs,
    replicates: count.replicates,
    seed,
    interval: monteCarloInterval(count.extreme, count.replicates, intervalLevel),
  };
}
