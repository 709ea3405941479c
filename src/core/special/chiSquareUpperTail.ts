import type { TailProbability } from '../types';
import { regularizedIncompleteGamma } from './regularizedIncompleteGamma';

/**
 * Upper tail P(X > x) of the chi-square distribution with `df` degrees of freedom, with its
 * base-10 logarithm kept exact even where p underflows (x = 5000, df = 1 gives log10p ≈ −1088).
 *
 * The p-value of a chi-square statistic: the chance that chance alone gives a value above x.
 * Hand-written because jstat's cdf is good to about 1e-6 only and @stdlib's gammainc 0.3.1 is off
 * by up to 2% near the mean for df above about 2,500. Reference: Press et al., Numerical Recipes
 * (3rd ed.) §6.2, with Loader's (2000) log-space prefactor; see `regularizedIncompleteGamma`.
 *
 * ## Method
 * p = Q(df/2, x/2), evaluated directly (never as 1 − cdf); log10p = log Q / ln 10.
 * Relative error, measured against mpmath at 50 digits (755 cases, df 0.1…100,000): at most 1.4e-13
 * in p (p ≥ 1e-300) and 2.3e-13 in log10p, p down to 1e-1088 included. For df below 0.1 the error
 * grows like eps/df (3e-11 at df = 1e-4), from 1 − P in `regularizedIncompleteGamma`.
 *
 * @param x - The statistic; x ≤ 0 gives p = 1.
 * @param df - Degrees of freedom, any positive real.
 * @returns p and log10p; both NaN for NaN input or df ≤ 0 (callers validate).
 */
export function chiSquareUpperTail(x: number, df: number): TailProbability {
  if (Number.isNaN(x) || !(df > 0) || df === Infinity) return { p: NaN, log10p: NaN };
  if (x <= 0) return { p: 1, log10p: 0 };
  const gamma = regularizedIncompleteGamma(df / 2, x / 2);
  return { p: gamma.upper, log10p: gamma.logUpper / Math.LN10 };
}
