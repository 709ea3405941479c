import type { MonteCarloIndependenceJob } from './monteCarloJobSpec';
import type { MonteCarloStatistic } from './monteCarloOptions';
import { monteCarloIndependenceExpected } from './monteCarloIndependenceExpected';
import { RELATIVE_TIE_TOLERANCE } from './types';

/**
 * The serialisable job of a Monte Carlo test of independence: the margins, the statistic and the
 * observed table's score with the tie tolerance applied (see monteCarloIndependenceBlocks for the
 * criteria). The caller validates the table first.
 *
 * @param observed - rows of nonnegative integer counts
 * @param statistic - 'probability' (Σ log n_ij!) or 'pearson' (X²)
 * @param replicates - R
 * @param seed - the run's seed
 * @param logFactorials - log k! for k = 0..N
 * @returns the job, ready for any thread
 */
export function monteCarloIndependenceSpec(
  observed: readonly (readonly number[])[],
  statistic: MonteCarloStatistic,
  replicates: number,
  seed: number,
  logFactorials: Float64Array,
): MonteCarloIndependenceJob {
  const columns = observed[0].length;
  const rowTotals = observed.map((row) => row.reduce((sum, count) => sum + count, 0));
  const columnTotals = Array.from({ length: columns }, (_, j) => observed.reduce((sum, row) => sum + row[j], 0));
  let threshold: number;
  if (statistic === 'pearson') {
    const { expected, inverseExpected } = monteCarloIndependenceExpected(rowTotals, columnTotals);
    let sum = 0;
    for (let i = 0; i < observed.length; i++) {
      for (let j = 0; j < columns; j++) {
        const difference = observed[i][j] - expected[i * columns + j];
        sum += difference * difference * inverseExpected[i * columns + j];
      }
    }
    threshold = sum * (1 - RELATIVE_TIE_TOLERANCE);
  } else {
    let observedScore = 0;
    for (const row of observed) for (const count of row) observedScore += logFactorials[count];
    threshold = observedScore - Math.log1p(RELATIVE_TIE_TOLERANCE);
  }
  return { kind: 'independence', replicates, seed, statistic, threshold, rowTotals, columnTotals };
}
