import type { MonteCarloGoodnessOfFitJob } from './monteCarloJobSpec';
import type { MonteCarloStatistic } from './monteCarloOptions';
import { RELATIVE_TIE_TOLERANCE } from './types';

/**
 * The serialisable job of a Monte Carlo goodness-of-fit test: N, the normalised proportions, the
 * statistic and the observed score with the tie tolerance applied (see monteCarloGoodnessOfFitBlocks
 * for the criteria). The caller validates the counts and proportions first.
 *
 * @param observed - counts per category
 * @param proportions - hypothesised proportions, already normalised to sum to one
 * @param statistic - 'probability' (Σ log x_j! − x_j log π_j) or 'pearson' (X²)
 * @param replicates - R
 * @param seed - the run's seed
 * @param logFactorials - log k! for k = 0..N
 * @returns the job, ready for any thread
 */
export function monteCarloGoodnessOfFitSpec(
  observed: readonly number[],
  proportions: readonly number[],
  statistic: MonteCarloStatistic,
  replicates: number,
  seed: number,
  logFactorials: Float64Array,
): MonteCarloGoodnessOfFitJob {
  const categories = observed.length;
  const total = observed.reduce((sum, count) => sum + count, 0);
  let threshold: number;
  if (statistic === 'pearson') {
    let observedStatistic = 0;
    for (let j = 0; j < categories; j++) {
      const expected = proportions[j] * total;
      const difference = observed[j] - expected;
      observedStatistic += expected > 0 ? difference * difference * (1 / expected) : observed[j] > 0 ? Infinity : 0;
    }
    threshold = observedStatistic * (1 - RELATIVE_TIE_TOLERANCE);
  } else {
    let score = 0;
    for (let j = 0; j < categories; j++) {
      const x = observed[j];
      if (x > 0) score += proportions[j] > 0 ? logFactorials[x] - x * Math.log(proportions[j]) : Infinity;
    }
    threshold = score - Math.log1p(RELATIVE_TIE_TOLERANCE);
  }
  return { kind: 'goodness-of-fit', replicates, seed, statistic, threshold, total, proportions: [...proportions] };
}
