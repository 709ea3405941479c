import { monteCarloCountBlocks } from './monteCarloCountBlocks';
import { monteCarloLogFactorials } from './monteCarloLogFactorials';
import type { MonteCarloBlockRange, MonteCarloCount, MonteCarloOptions } from './monteCarloOptions';
import { randomMultinomialSampler } from './randomMultinomialSampler';
import { DEFAULT_BUDGET, RELATIVE_TIE_TOLERANCE, type Computed } from './types';

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
 * @param options - replicates R, seed, budget, statistic
 * @param range - which blocks of REPLICATES_PER_STREAM replicates to simulate (default: all)
 * @returns b and the replicates simulated, or why the budget stopped it
 */
export function monteCarloGoodnessOfFitBlocks(
  observed: readonly number[],
  expectedProportions: readonly number[],
  options: MonteCarloOptions,
  range?: MonteCarloBlockRange,
): Computed<MonteCarloCount> {
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
  const sampler = randomMultinomialSampler(proportions, total, logFactorials);
  const counts = new Int32Array(categories);
  const isExtreme = (options.statistic ?? 'probability') === 'pearson' ? pearsonCriterion() : probabilityCriterion();
  return monteCarloCountBlocks(options.replicates, options.seed, range, options.budget, startedAt, (random) => {
    sampler.sample(random, counts);
    return isExtreme();
  });

  function probabilityCriterion(): () => boolean {
    const logProportion = Float64Array.from(proportions, (value) => (value > 0 ? Math.log(value) : 0));
    const score = (count: (j: number) => number): number => {
      let sum = 0;
      for (let j = 0; j < categories; j++) {
        const x = count(j);
        if (x > 0) sum += proportions[j] > 0 ? logFactorials[x] - x * logProportion[j] : Infinity;
      }
      return sum;
    };
    const threshold = score((j) => observed[j]) - Math.log1p(RELATIVE_TIE_TOLERANCE);
    return () => {
      let sum = 0;
      for (let j = 0; j < categories; j++) {
        const x = counts[j];
        if (x > 0) sum += logFactorials[x] - x * logProportion[j];
      }
      return sum >= threshold;
    };
  }

  function pearsonCriterion(): () => boolean {
    const expected = Float64Array.from(proportions, (value) => value * total);
    const inverseExpected = Float64Array.from(expected, (value) => (value > 0 ? 1 / value : 0));
    let observedStatistic = 0;
    for (let j = 0; j < categories; j++) {
      const difference = observed[j] - expected[j];
      observedStatistic += expected[j] > 0 ? difference * difference * inverseExpected[j] : observed[j] > 0 ? Infinity : 0;
    }
    const threshold = observedStatistic * (1 - RELATIVE_TIE_TOLERANCE);
    return () => {
      let sum = 0;
      for (let j = 0; j < categories; j++) {
        const difference = counts[j] - expected[j];
        sum += difference * difference * inverseExpected[j];
      }
      return sum >= threshold;
    };
  }
}
