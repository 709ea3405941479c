import { normalQuantile } from '../special/normalQuantile';

/**
 * The two-sided Bonferroni critical value z₁₋α/(2m) for m standard-normal residuals (Dunn 1961,
 * "Multiple comparisons among means", JASA 56, 52–64; used for adjusted residuals by Agresti 2013,
 * Categorical Data Analysis 3rd ed., §2.4.5 — common practice).
 *
 * Intuition: looking at every cell gives m chances for a large residual by luck, so each cell must
 * clear a higher bar for the whole set to keep the error rate alpha.
 *
 * @param alpha - family-wise significance level in (0, 1)
 * @param comparisons - number of residuals examined (≥ 1)
 * @returns the critical |z|
 * @example bonferroniCriticalValue(0.05, 6) // ≈ 2.638
 */
export function bonferroniCriticalValue(alpha: number, comparisons: number): number {
  if (!(alpha > 0 && alpha < 1) || !(comparisons >= 1)) {
    throw new RangeError(`bonferroniCriticalValue: needs 0 < alpha < 1 and comparisons ≥ 1 (got ${alpha}, ${comparisons})`);
  }
  // The lower quantile of a small probability is more accurate than the upper one of 1 − small.
  return -normalQuantile(alpha / (2 * comparisons));
}
