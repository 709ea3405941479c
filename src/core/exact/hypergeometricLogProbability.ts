import { poissonDevianceTerm } from '../special/poissonDevianceTerm';
import { stirlingError } from '../special/stirlingError';
import type { HypergeometricMargins } from './hypergeometricMargins';

const LOG_TWO_PI = Math.log(2 * Math.PI);
/** Loader's switch for the end points x = 0 and x = size: below it log(q) would lose digits to cancellation. */
const SMALL_PROBABILITY = 0.1;

/**
 * log P(X = x) for the hypergeometric distribution of the top-left cell of a 2×2 table with the given
 * margins: log[C(m, x)·C(n, k − x) / C(N, k)].
 *
 * Intuition: the chance that, of the k items in the first column, exactly x come from the first row.
 * Loader (2000), "Fast and accurate computation of binomial probabilities", §4, writes it as a
 * ratio of three binomial probabilities, each accurate to a few units in the last place.
 *
 * ## Method
 * With p = k/N, P(x) = b(x; m, p)·b(k − x; n, p) / b(k; N, p), where each binomial log probability
 * is −stirlingError and deviance terms (Loader's bd0) plus ½·log(size / (2π x (size − x))). No
 * large logarithms are subtracted, so the absolute error is about eps·|log P| even at N = 10⁷, where
 * log-factorial differences would lose about eps·N·log N (≈ 2e-8).
 *
 * @param x - The top-left count (an integer).
 * @param margins - From hypergeometricMargins.
 * @returns log P(X = x); −Infinity outside [lowest, highest]; 0 when the support is a single point.
 */
export function hypergeometricLogProbability(x: number, margins: HypergeometricMargins): number {
  const { rowTotal, otherRowTotal, columnTotal, total, lowest, highest } = margins;
  if (!(x >= lowest && x <= highest)) return -Infinity;
  if (lowest === highest) return 0;
  const p = columnTotal / total;
  const q = (total - columnTotal) / total;
  return (
    logBinomialProbability(x, rowTotal, p, q) +
    logBinomialProbability(columnTotal - x, otherRowTotal, p, q) -
    logBinomialProbability(columnTotal, total, p, q)
  );
}

/** Loader's (2000) dbinom_raw in log form, for 0 < p < 1 and q = 1 − p. */
function logBinomialProbability(x: number, size: number, p: number, q: number): number {
  if (size === 0) return 0;
  if (x === 0) return p < SMALL_PROBABILITY ? -poissonDevianceTerm(size, size * q) - size * p : size * Math.log(q);
  if (x === size) return q < SMALL_PROBABILITY ? -poissonDevianceTerm(size, size * p) - size * q : size * Math.log(p);
  const exponent =
    stirlingError(size) -
    stirlingError(x) -
    stirlingError(size - x) -
    poissonDevianceTerm(x, size * p) -
    poissonDevianceTerm(size - x, size * q);
  return exponent - 0.5 * (LOG_TWO_PI + Math.log(x) + Math.log1p(-x / size));
}
