import { chiSquareUpperTail } from '../special/chiSquareUpperTail';
import type { TailProbability } from '../types';
import { tableMargins } from './tableMargins';
import type { ContinuityPolicy } from './types';
import { yatesStatistic } from './yatesStatistic';

/**
 * Pearson's X² for independence with its df and p, Yates-corrected for a 2×2 table when the policy
 * says so (Pearson 1900; Fisher 1922 for the df; Yates 1934).
 *
 * Intuition: the squared gaps between observed and expected counts, each measured against the
 * expected count, summed over the table.
 *
 * This is the test alone, without effect sizes or residuals, for re-testing a merged table.
 *
 * @param observed - r×c counts with no zero row or column
 * @param continuity - 'yates' applies Yates' correction to a 2×2 table; larger tables are never corrected
 * @returns X², df = (r − 1)(c − 1) and the upper-tail p
 * @example independenceStatistic([[10, 20], [30, 40]], 'none').statistic // ≈ 0.794
 */
export function independenceStatistic(
  observed: number[][],
  continuity: ContinuityPolicy,
): TailProbability & { statistic: number; df: number } {
  const { expected } = tableMargins(observed);
  const df = (observed.length - 1) * (observed[0].length - 1);
  let statistic = 0;
  if (continuity === 'yates' && df === 1) {
    statistic = yatesStatistic(observed);
  } else {
    observed.forEach((values, i) => values.forEach((count, j) => {
      statistic += (count - expected[i][j]) ** 2 / expected[i][j];
    }));
  }
  return { statistic, df, ...chiSquareUpperTail(statistic, df) };
}
