import gammaln from '@stdlib/math-base-special-gammaln';

/**
 * ln P(X = k) for a Poisson variable with mean μ: k ln μ − μ − ln k! (Johnson, Kemp & Kotz 2005,
 * Univariate Discrete Distributions 3rd ed., §4.2).
 *
 * Intuition: in log form the probability of a far-off count stays representable long after the
 * probability itself would underflow.
 *
 * @param k - a whole number ≥ 0
 * @param mean - μ > 0
 * @returns ln P(X = k)
 * @example Math.exp(poissonLogPmf(2, 1.5)) // ≈ 0.2510
 */
export function poissonLogPmf(k: number, mean: number): number {
  return k * Math.log(mean) - mean - gammaln(k + 1);
}
