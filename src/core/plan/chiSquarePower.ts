import { chiSquareCriticalValue } from '../special/chiSquareCriticalValue';
import { noncentralChiSquareUpperTail } from '../special/noncentralChiSquareUpperTail';

/**
 * Power of a chi-square test with `df` degrees of freedom at level `alpha` when the statistic follows
 * the noncentral chi-square with noncentrality λ = N·w² (Cohen 1988, Statistical Power Analysis for
 * the Behavioral Sciences, 2nd ed., ch. 7).
 *
 * The chance that a study of N observations with true effect w gives a significant result.
 *
 * @param lambda - noncentrality N·w² (≥ 0)
 * @param df - degrees of freedom (≥ 1)
 * @param alpha - significance level in (0, 1)
 * @param criticalValue - the critical value for (alpha, df), when the caller already has it
 * @returns P(χ²(df, λ) > c_alpha)
 */
export function chiSquarePower(lambda: number, df: number, alpha: number, criticalValue = chiSquareCriticalValue(alpha, df)): number {
  return noncentralChiSquareUpperTail(criticalValue, df, lambda);
}
