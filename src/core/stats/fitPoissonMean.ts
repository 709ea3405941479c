import { fail, ok, type Result } from '../types';
import { findRootBracketed } from './findRootBracketed';
import { logPoissonProbability } from '../special/logPoissonProbability';
import { poissonLogUpperTail } from './poissonLogUpperTail';

/** Relative accuracy of the estimated mean; expected counts then agree to about 12 digits. */
const MEAN_RELATIVE_TOLERANCE = 1e-13;
/** Doublings of the upper bracket; the estimate lies within a few of the naive mean in practice. */
const MAX_BRACKET_DOUBLINGS = 100;

/**
 * The maximum-likelihood Poisson mean for counts in categories 0, 1, …, K, where the last category
 * may be open-ended ("K+" = K or more) (Fisher 1922, "On the mathematical foundations of theoretical
 * statistics"; censored-data likelihood as in Johnson, Kemp & Kotz 2005, Univariate Discrete
 * Distributions 3rd ed., §4.7.2).
 *
 * Intuition: when the top category is exact the estimate is the sample mean; when it is "K or more"
 * those observations average more than K, so the estimate is the mean at which the likelihood of
 * "at least K" for them balances the exact counts below.
 *
 * ## Method
 * Open-ended: the log-likelihood Σ_{k<K} O_k ln P(X = k) + O_K ln P(X ≥ K) is concave in μ
 * (Poisson probabilities and gamma cdfs are log-concave), so its score
 * s(μ) = Σ_{k<K} O_k (k/μ − 1) + O_K P(X = K − 1)/P(X ≥ K) falls from + to − through one root. The
 * mean that counts "K+" as K is a lower bound (an EM step from it can only go up); the upper
 * bound doubles until the score is negative; Brent's method finds the root.
 *
 * @param observed - counts for the values 0, 1, …, K
 * @param openEnded - whether the last category means "K or more"
 * @returns the estimated mean, or an issue when the data cannot give one (all counts at 0, or all in the open top)
 * @example fitPoissonMean([10, 20, 15, 5], true) // ≈ 1.341 (counting "3+" as 3 would give 1.3)
 */
export function fitPoissonMean(observed: number[], openEnded: boolean): Result<number> {
  const top = observed.length - 1;
  const n = observed.reduce((sum, count) => sum + count, 0);
  const valueSum = observed.reduce((sum, count, value) => sum + count * value, 0);
  const naiveMean = valueSum / n;
  if (!(naiveMean > 0)) {
    return fail({ code: 'bad-expected', message: 'Every count is in category 0, so the estimated Poisson mean is 0 and there is nothing to fit.' });
  }
  if (!openEnded || observed[top] === 0) return ok(naiveMean);
  const exactSum = valueSum - top * observed[top];
  const exactCount = n - observed[top];
  if (exactCount === 0) {
    return fail({ code: 'bad-expected', message: `Every count is in the open-ended category ${top}+, so the Poisson mean cannot be estimated; give the top values separately.` });
  }
  const score = (mean: number) =>
    exactSum / mean - exactCount + observed[top] * Math.exp(logPoissonProbability(top - 1, mean) - poissonLogUpperTail(top, mean));
  if (score(naiveMean) <= 0) return ok(naiveMean);
  let low = naiveMean;
  let high = 2 * naiveMean;
  for (let doubling = 0; score(high) > 0; doubling++) {
    if (doubling >= MAX_BRACKET_DOUBLINGS) throw new RangeError('fitPoissonMean: no bracket for the mean');
    low = high;
    high *= 2;
  }
  return ok(findRootBracketed(score, low, high, MEAN_RELATIVE_TOLERANCE * high));
}
