import { hypergeometricLogProbability } from './hypergeometricLogProbability';
import type { HypergeometricMargins } from './hypergeometricMargins';

/**
 * A tail walk stops once everything still ahead is provably below this share of the sum so far:
 * 2⁻⁵⁶ ≈ 1.4e-17 is under half a unit in the last place of a double, so the rest cannot change the sum.
 */
export const HYPERGEOMETRIC_NEGLIGIBLE_SHARE = 2 ** -56;

/** A tail sum Σ P(x) from `start` outward, as P(start)·(1 + rest), kept in log form so it never underflows. */
export interface HypergeometricTail {
  /** log P(X = start). */
  logStart: number;
  /** Σ over the tail beyond start of P(x) / P(start) (0 when start is the end of the support). */
  rest: number;
  /** log of the whole tail, start included: logStart + log1p(rest). */
  logTail: number;
}

/**
 * The hypergeometric tail from `start` outward: P(X ≤ start) for 'down', P(X ≥ start) for 'up',
 * where `start` lies on the falling side of the mode (start ≤ mode for 'down', start ≥ mode for 'up').
 *
 * Intuition: past the mode each probability is a fixed rational multiple of its neighbour, so the
 * tail is the first term times a sum of products of ratios below 1 that soon stops mattering.
 *
 * ## Method
 * P(start) comes from hypergeometricLogProbability; then the ratio recurrence
 * P(x + 1)/P(x) = (m − x)(k − x) / ((x + 1)(n − k + x + 1)) (or its inverse going down) multiplies
 * terms relative to P(start) (Johnson, Kemp & Kotz 2005, Univariate Discrete Distributions, §6.2).
 * The distribution is log-concave, so successive ratios fall; once the current ratio r < 1, all
 * that remains is below term·r/(1 − r), and the walk stops when that is below
 * HYPERGEOMETRIC_NEGLIGIBLE_SHARE of the sum. The walk is thus about 9 standard deviations long,
 * whatever N.
 *
 * @param margins - From hypergeometricMargins.
 * @param start - First value of the tail, within the support and on the falling side of the mode.
 * @param direction - 'down' for the lower tail, 'up' for the upper tail.
 * @param logStart - log P(start) when the caller has it already (computed here otherwise).
 * @returns the tail as log P(start) and the relative rest
 */
export function hypergeometricLogTail(
  margins: HypergeometricMargins,
  start: number,
  direction: 'down' | 'up',
  logStart = hypergeometricLogProbability(start, margins),
): HypergeometricTail {
  const { rowTotal: m, otherRowTotal: n, columnTotal: k, lowest, highest } = margins;
  const offset = n - k;
  let term = 1;
  let rest = 0;
  if (direction === 'up') {
    for (let x = start; x < highest; x++) {
      const ratio = ((m - x) * (k - x)) / ((x + 1) * (offset + x + 1));
      term *= ratio;
      rest += term;
      if (ratio < 1 && term * ratio <= HYPERGEOMETRIC_NEGLIGIBLE_SHARE * (1 - ratio) * (1 + rest)) break;
    }
  } else {
    for (let x = start; x > lowest; x--) {
      const ratio = (x * (offset + x)) / ((m - x + 1) * (k - x + 1));
      term *= ratio;
      rest += term;
      if (ratio < 1 && term * ratio <= HYPERGEOMETRIC_NEGLIGIBLE_SHARE * (1 - ratio) * (1 + rest)) break;
    }
  }
  return { logStart, rest, logTail: logStart + Math.log1p(rest) };
}
