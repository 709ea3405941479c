import { chiSquareUpperTail } from '../special/chiSquareUpperTail';
import type { GTest } from './types';

/**
 * The likelihood-ratio statistic G² = 2 Σ O ln(O/E) with its chi-square p, plain and divided by
 * Williams' (1976) correction q (Williams, "Improved likelihood ratio tests for complete contingency
 * tables", Biometrika 63, 33–37).
 *
 * Intuition: G² is twice the log of how much more likely the counts are under their own proportions
 * than under the hypothesis; q shrinks it toward its chi-square reference in small samples.
 *
 * A cell with O = 0 adds nothing (O ln O → 0). Rounding can make a G² of zero come out a hair below
 * zero; it is reported as 0.
 *
 * @param observed - observed counts, any layout, flattened
 * @param expected - the matching expected counts (> 0)
 * @param df - degrees of freedom
 * @param williamsQ - Williams' divisor q ≥ 1 for this design
 * @returns G², q, G²/q and their p-values
 * @example gTest([315, 108, 101, 32], [312.75, 104.25, 104.25, 34.75], 3, 1.0015).statistic // ≈ 0.4754
 */
export function gTest(observed: number[], expected: number[], df: number, williamsQ: number): GTest {
  let sum = 0;
  observed.forEach((count, i) => {
    if (count > 0) sum += count * Math.log(count / expected[i]);
  });
  const statistic = Math.max(0, 2 * sum);
  const corrected = statistic / williamsQ;
  return {
    statistic,
    ...chiSquareUpperTail(statistic, df),
    williamsQ,
    corrected: { statistic: corrected, ...chiSquareUpperTail(corrected, df) },
  };
}
