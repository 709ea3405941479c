import { jStat } from 'jstat';
import type { TailProbability } from '../types';

/**
 * TEMPORARY placeholder (jstat, accurate to about 1e-6 only) until the accurate version lands.
 * Upper tail P(X > x) of the chi-square distribution with `df` degrees of freedom.
 */
export function chiSquareUpperTail(x: number, df: number): TailProbability {
  const p = x <= 0 ? 1 : Math.max(0, 1 - jStat.chisquare.cdf(x, df));
  return { p, log10p: Math.log10(p) };
}
