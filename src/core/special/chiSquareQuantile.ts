import { jStat } from 'jstat';

/** TEMPORARY placeholder: the critical value c with P(X > c) = alpha for the chi-square with df. */
export function chiSquareCriticalValue(alpha: number, df: number): number {
  return jStat.chisquare.inv(1 - alpha, df);
}
