import gammaln from '@stdlib/math-base-special-gammaln';

/**
 * ln P(X = k) for a binomial variable with n trials and success probability p:
 * ln C(n, k) + k ln p + (n − k) ln(1 − p) (Johnson, Kemp & Kotz 2005, Univariate Discrete
 * Distributions 3rd ed., §3.2).
 *
 * Intuition: in log form the probability of an extreme count stays representable.
 *
 * @param k - whole number, 0 ≤ k ≤ n
 * @param trials - n ≥ 1
 * @param probability - p in (0, 1)
 * @returns ln P(X = k)
 * @example Math.exp(binomialLogPmf(2, 4, 0.5)) // 0.375
 */
export function binomialLogPmf(k: number, trials: number, probability: number): number {
  const logChoose = gammaln(trials + 1) - gammaln(k + 1) - gammaln(trials - k + 1);
  return logChoose + k * Math.log(probability) + (trials - k) * Math.log1p(-probability);
}
