import { monteCarloBlockRunner } from './monteCarloBlockRunner';
import { monteCarloCountBlocks } from './monteCarloCountBlocks';
import { monteCarloGoodnessOfFitSpec } from './monteCarloGoodnessOfFitSpec';
import { monteCarloLogFactorials } from './monteCarloLogFactorials';
import type { MonteCarloBlockRange, MonteCarloComputed, MonteCarloCount, MonteCarloOptions } from './monteCarloOptions';
import { DEFAULT_BUDGET } from './types';

/** Bytes per stored log-factorial and per category of work arrays. */
const BYTES_PER_LOG_FACTORIAL = 8;
const BYTES_PER_CATEGORY = 4 * 8 + 4;

/**
 * The simulation count b for some blocks of a Monte Carlo goodness-of-fit test: outcomes drawn
 * from the multinomial with the hypothesised proportions, counted when at least as extreme as the
 * observed counts. Counts over disjoint block ranges add up to the single-thread count exactly.
 *
 * Intuition: if the hypothesis holds, the observed counts are one draw from this multinomial, so
 * the share of simulated draws at least as extreme estimates the exact multinomial p-value.
 *
 * ## Method
 * 'probability' (default, as in the exact multinomial test): an outcome counts when its
 * multinomial probability is at most the observed one's times (1 + RELATIVE_TIE_TOLERANCE), i.e.
 * Σ (log x_j! − x_j log π_j) ≥ the observed sum − log(1 + tol). 'pearson': when
 * X² = Σ (x_j − Nπ_j)²/(Nπ_j) ≥ X²_obs (1 − tol). Proportions are normalised to sum to one. Counts
 * observed in a category of proportion zero are impossible under the hypothesis; no simulated
 * outcome is then as extreme, and p = 1/(R + 1).
 *
 * @param observed - counts per category (nonnegative integers)
 * @param expectedProportions - hypothesised proportions, same length, nonnegative, positive sum (any scale)
 * @param options - replicates R, seed, budget, statistic, and optionally a block hook (a worker pool)
 * @param range - which blocks of REPLICATES_PER_STREAM replicates to simulate (default: all)
 * @returns b and the replicates simulated, or why the budget (or the block hook) stopped it
 */
export function monteCarloGoodnessOfFitBlocks(
  observed: readonly number[],
  expectedProportions: readonly number[],
  options: MonteCarloOptions,
  range?: MonteCarloBlockRange,
): MonteCarloComputed<MonteCarloCount> {
  const startedAt = performance.now();
  const categories = observed.length;
  const weightSum = expectedProportions.reduce((sum, value) => sum + value, 0);
  if (
    categories === 0 ||
    expectedProportions.length !== categories ||
    observed.some((count) => !Number.isSafeInteger(count) || count < 0) ||
    expectedProportions.some((value) => !(value >= 0) || !Number.isFinite(value)) ||
    !(weightSum > 0 && Number.isFinite(weightSum))
  ) {
    throw new RangeError('monteCarloGoodnessOfFitBlocks: needs nonnegative integer counts and as many nonnegative proportions with a positive sum');
  }
  if (!Number.isSafeInteger(options.replicates) || options.replicates < 1) {
    throw new RangeError(`monteCarloGoodnessOfFitBlocks: replicates must be a positive integer (got ${options.replicates})`);
  }
  const total = observed.reduce((sum, count) => sum + count, 0);
  const memoryBytes = options.budget?.memoryBytes ?? DEFAULT_BUDGET.memoryBytes;
  if ((total + 1) * BYTES_PER_LOG_FACTORIAL + categories * BYTES_PER_CATEGORY > memoryBytes) {
    return { ok: false, reason: 'memory', elapsedMs: 0 };
  }
  const proportions = expectedProportions.map((value) => value / weightSum);
  const logFactorials = monteCarloLogFactorials(total);
  const spec = monteCarloGoodnessOfFitSpec(observed, proportions, options.statistic ?? 'probability', options.replicates, options.seed, logFactorials);
  return monteCarloCountBlocks(spec, () => monteCarloBlockRunner(spec, logFactorials), range, options.budget, options.runBlocks, startedAt);
}
