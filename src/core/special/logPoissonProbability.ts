import { poissonDevianceTerm } from './poissonDevianceTerm';
import { stirlingError } from './stirlingError';

const LOG_TWO_PI = Math.log(2 * Math.PI);

/**
 * log(mean^k·e^(−mean) / Γ(k + 1)): the Poisson log probability, for real k ≥ 0 as well.
 *
 * Loader (2000), "Fast and accurate computation of binomial probabilities". For real k it is also
 * the prefactor z^a·e^(−z)/Γ(a + 1) of the incomplete gamma function (k = a, mean = z).
 *
 * ## Method
 * −stirlingError(k) − poissonDevianceTerm(k, mean) − ½·log(2πk): every piece is small or has
 * a relative error of a few eps, so the result's absolute error is about eps·|result|, where the
 * naive k·log(mean) − mean − logΓ(k + 1) would lose eps·k (1e-11 relative at k = 50,000).
 *
 * @param k - The count, k ≥ 0 (any real).
 * @param mean - The Poisson mean, mean ≥ 0.
 * @returns The log probability (≤ 0 for whole k); −Infinity when mean = 0 < k; NaN for invalid input.
 */
export function logPoissonProbability(k: number, mean: number): number {
  if (!(k >= 0) || !(mean >= 0) || k === Infinity) return Number.NaN;
  if (k === 0) return -mean;
  if (mean === 0 || mean === Infinity) return -Infinity;
  return -stirlingError(k) - poissonDevianceTerm(k, mean) - 0.5 * (LOG_TWO_PI + Math.log(k));
}
