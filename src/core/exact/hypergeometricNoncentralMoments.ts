import { HYPERGEOMETRIC_NEGLIGIBLE_SHARE } from './hypergeometricLogTail';
import type { HypergeometricMargins } from './hypergeometricMargins';

/** The mean of Fisher's noncentral hypergeometric distribution and its two tails at one point. */
export interface HypergeometricNoncentralMoments {
  mean: number;
  /** P(X ≤ x). */
  pAtMost: number;
  /** P(X ≥ x). */
  pAtLeast: number;
}

/**
 * Mean and tails at `x` of Fisher's noncentral hypergeometric distribution with odds ratio
 * ψ = exp(logOddsRatio): P(X = y) ∝ C(m, y)·C(n, k − y)·ψ^y over the support of the margins.
 *
 * Intuition: the distribution of the top-left count when the true odds ratio is ψ rather than 1;
 * the conditional estimate and exact interval of the odds ratio are the ψ that make it fit `x`.
 * Fisher (1935), "The logic of inductive inference", JRSS 98, 39–82; Johnson, Kemp & Kotz (2005),
 * Univariate Discrete Distributions, 3rd ed., §6.11.
 *
 * ## Method
 * The weights are log-concave in y with ratio w(y + 1)/w(y) = ψ·(m − y)(k − y) / ((y + 1)(n − k + y + 1)),
 * which falls with y; its mode is found by bisection on where the ratio drops to 1. Weights are
 * walked outward from the mode relative to the mode's weight (so nothing overflows, as a log-sum-exp
 * about the largest term would), stopping on each side once the rest is provably below
 * HYPERGEOMETRIC_NEGLIGIBLE_SHARE of the total. The mean is taken as mode + Σ(y − mode)·w / Σw,
 * which keeps the digits that mode + small correction needs.
 *
 * @param margins - From hypergeometricMargins, with lowest < highest.
 * @param logOddsRatio - log ψ (finite; |log ψ| beyond ~700 puts all mass on one end).
 * @param x - The point for the tails.
 * @returns the mean and P(X ≤ x), P(X ≥ x)
 */
export function hypergeometricNoncentralMoments(margins: HypergeometricMargins, logOddsRatio: number, x: number): HypergeometricNoncentralMoments {
  const { rowTotal: m, otherRowTotal: n, columnTotal: k, lowest, highest } = margins;
  const offset = n - k;
  const odds = Math.exp(logOddsRatio);
  const mode = noncentralMode(margins, odds);
  let total = 1;
  let firstMoment = 0;
  let atMost = mode <= x ? 1 : 0;
  let atLeast = mode >= x ? 1 : 0;
  let term = 1;
  for (let y = mode; y < highest; y++) {
    const ratio = (odds * ((m - y) * (k - y))) / ((y + 1) * (offset + y + 1));
    term *= ratio;
    total += term;
    firstMoment += (y + 1 - mode) * term;
    if (y + 1 <= x) atMost += term;
    if (y + 1 >= x) atLeast += term;
    if (ratio < 1 && term * ratio <= HYPERGEOMETRIC_NEGLIGIBLE_SHARE * (1 - ratio) * total) break;
  }
  term = 1;
  for (let y = mode; y > lowest; y--) {
    const ratio = (y * (offset + y)) / ((m - y + 1) * (k - y + 1)) / odds;
    term *= ratio;
    total += term;
    firstMoment += (y - 1 - mode) * term;
    if (y - 1 <= x) atMost += term;
    if (y - 1 >= x) atLeast += term;
    if (ratio < 1 && term * ratio <= HYPERGEOMETRIC_NEGLIGIBLE_SHARE * (1 - ratio) * total) break;
  }
  return { mean: mode + firstMoment / total, pAtMost: atMost / total, pAtLeast: atLeast / total };
}

/** Smallest y whose weight is not below the next one's: the first y where the up-ratio is at most 1. */
function noncentralMode(margins: HypergeometricMargins, odds: number): number {
  const { rowTotal: m, otherRowTotal: n, columnTotal: k, lowest, highest } = margins;
  let low = lowest;
  let high = highest;
  while (low < high) {
    const middle = Math.floor((low + high) / 2);
    // With odds = Infinity the left side is Infinity (never ≤), with odds = 0 it is 0: both are right.
    if (odds * ((m - middle) * (k - middle)) <= (middle + 1) * (n - k + middle + 1)) high = middle;
    else low = middle + 1;
  }
  return low;
}
