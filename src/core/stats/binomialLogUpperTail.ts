import { binomialLogPmf } from './binomialLogPmf';

/**
 * ln P(X ≥ k) for a binomial variable with n trials and success probability p, by summing the
 * probabilities from k to n in log space (Johnson, Kemp & Kotz 2005, Univariate Discrete
 * Distributions 3rd ed., §3.3 — direct summation; common practice).
 *
 * Intuition: there are only n − k + 1 terms, so summing them is exact enough and never cancels.
 *
 * @param k - whole number, 0 ≤ k ≤ n
 * @param trials - n ≥ 1
 * @param probability - p in (0, 1)
 * @returns ln P(X ≥ k) (0 for k = 0)
 * @example Math.exp(binomialLogUpperTail(3, 4, 0.5)) // 0.3125
 */
export function binomialLogUpperTail(k: number, trials: number, probability: number): number {
  if (k <= 0) return 0;
  let largest = -Infinity;
  let scaledSum = 0;
  for (let i = k; i <= trials; i++) {
    const log = binomialLogPmf(i, trials, probability);
    if (log > largest) {
      scaledSum = scaledSum * Math.exp(largest - log) + 1;
      largest = log;
    } else {
      scaledSum += Math.exp(log - largest);
    }
  }
  return largest + Math.log(scaledSum);
}
