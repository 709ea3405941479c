import { fail, ok, type Result } from '../types';
import { binomialLogPmf } from './binomialLogPmf';
import { binomialLogUpperTail } from './binomialLogUpperTail';
import { findRootBracketed } from './findRootBracketed';

/** Absolute accuracy of the estimated probability, well below what expected counts can show. */
const PROBABILITY_TOLERANCE = 1e-14;
/** Halvings of the gap to 1 when bracketing; 2⁻⁶⁰ is below the spacing of doubles near 1. */
const MAX_BRACKET_HALVINGS = 60;

/**
 * The maximum-likelihood success probability of a binomial with n trials for counts in categories
 * 0, 1, …, K (K ≤ n), where the last category may be open-ended ("K or more") (Fisher 1922; censored
 * likelihood as in Johnson, Kemp & Kotz 2005, Univariate Discrete Distributions 3rd ed., §3.8).
 *
 * Intuition: with exact categories the estimate is the mean count over n; with "K or more" at the
 * top, those observations count for more than K, by as much as the likelihood says.
 *
 * ## Method
 * Exact: p = mean/n. Open-ended (K < n): the score
 * s(p) = Σ_{k<K} O_k (k/p − (n − k)/(1 − p)) + O_K · n P(Y = K − 1)/P(X ≥ K), Y ~ Bin(n − 1, p),
 * decreases in p (binomial probabilities and beta cdfs are log-concave), so it has one root between
 * the mean that counts "K+" as K and 1; the upper end moves toward 1 until the score turns negative,
 * and Brent's method finds the root.
 *
 * @param observed - counts for the values 0, 1, …, K
 * @param trials - n ≥ K
 * @param openEnded - whether the last category means "K or more" (only meaningful when K < n)
 * @returns the estimated probability, or an issue when it is 0 or 1 (nothing to fit) or cannot be estimated
 * @example fitBinomialProbability([5, 10, 5], 2, false) // ok(0.5)
 */
export function fitBinomialProbability(observed: number[], trials: number, openEnded: boolean): Result<number> {
  const top = observed.length - 1;
  const n = observed.reduce((sum, count) => sum + count, 0);
  const valueSum = observed.reduce((sum, count, value) => sum + count * value, 0);
  const naive = valueSum / (n * trials);
  if (!(naive > 0)) {
    return fail({ code: 'bad-expected', message: 'Every count is in category 0, so the estimated binomial probability is 0 and there is nothing to fit.' });
  }
  const censored = openEnded && top < trials && observed[top] > 0;
  if (!censored) {
    if (naive >= 1) {
      return fail({ code: 'bad-expected', message: `Every count is in the top category ${trials}, so the estimated binomial probability is 1 and there is nothing to fit.` });
    }
    return ok(naive);
  }
  const exactSum = valueSum - top * observed[top];
  const exactCount = n - observed[top];
  if (exactCount === 0) {
    return fail({ code: 'bad-expected', message: `Every count is in the open-ended category ${top}+, so the binomial probability cannot be estimated; give the top values separately.` });
  }
  const score = (p: number) =>
    exactSum / p - (exactCount * trials - exactSum) / (1 - p) +
    observed[top] * trials * Math.exp(binomialLogPmf(top - 1, trials - 1, p) - binomialLogUpperTail(top, trials, p));
  if (score(naive) <= 0) return ok(naive);
  let low = naive;
  let high = (1 + naive) / 2;
  for (let halving = 0; score(high) > 0; halving++) {
    if (halving >= MAX_BRACKET_HALVINGS) throw new RangeError('fitBinomialProbability: no bracket for the probability');
    low = high;
    high = (1 + high) / 2;
  }
  return ok(findRootBracketed(score, low, high, PROBABILITY_TOLERANCE));
}
