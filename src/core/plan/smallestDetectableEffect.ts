import { chiSquareCriticalValue } from '../special/chiSquareCriticalValue';
import { fail, ok } from '../types';
import type { Result } from '../types';
import { DEFAULT_PLAN_ALPHA, DEFAULT_PLAN_POWER } from './planStudy';
import { requiredNoncentrality } from './requiredNoncentrality';
import type { SensitivityResult } from './types';
import { checkAlpha, checkDf, checkPower, checkSampleSize } from './validatePlanInputs';

/**
 * The smallest effect size w a chi-square test of n observations detects with the target power:
 * w = √(λ* / n), where λ* gives P(χ²(df, λ*) > c_alpha) = power (Cohen 1988, Statistical Power
 * Analysis for the Behavioral Sciences, 2nd ed., ch. 7). A sensitivity analysis, in place of the
 * "observed power" of a finished study, which only restates its p-value.
 *
 * Effects smaller than this would often be missed by a study of this size.
 *
 * @param n - total sample size, a whole number above df
 * @param df - degrees of freedom
 * @param alpha - significance level (default 0.05)
 * @param power - target power (default 0.8)
 * @returns the sensitivity, or the input problem ('bad-option')
 */
export function smallestDetectableEffect(n: number, df: number, alpha = DEFAULT_PLAN_ALPHA, power = DEFAULT_PLAN_POWER): Result<SensitivityResult> {
  const issue = checkAlpha(alpha) ?? checkPower(power, alpha) ?? checkDf(df) ?? checkSampleSize(n, df);
  if (issue) return fail(issue);
  const lambda = requiredNoncentrality(df, alpha, power);
  return ok({
    design: 'sensitivity', n, df, alpha, power, w: Math.sqrt(lambda / n), criticalValue: chiSquareCriticalValue(alpha, df), lambda,
    assumptions: [
      `A study of ${n} observations tested by chi-square with ${df} degree${df === 1 ? '' : 's'} of freedom.`,
      'Observations are independent; the effect is the true one in the population, not one estimated from these data.',
    ],
  });
}
