import erfc from '@stdlib/math-base-special-erfc';
import { twoProduct } from './twoProduct';

/** 1/√2 − Math.SQRT1_2, the part of 1/√2 a double drops (computed with mpmath 1.3.0 at 40 digits). */
const SQRT1_2_LOW = -4.833646656726457e-17;
const TWO_OVER_SQRT_PI = 2 / Math.sqrt(Math.PI);

/**
 * Standard normal upper tail P(Z > z), accurate in relative terms far into the tail (z up to 37.5,
 * where it is about 5e-309), since it is never formed as 1 − cdf.
 *
 * The one-sided p-value of a z statistic. Abramowitz & Stegun 26.2.29: P(Z > z) = ½·erfc(z/√2);
 * erfc is @stdlib's port of the FreeBSD msun routine.
 *
 * ## Method
 * Rounding u = z/√2 would cost a relative error of about z²·eps/2 (1e-13 at z = 30), so the part δ
 * of z/√2 that u misses is kept (Dekker's exact product) and the first-order correction
 * erfc(u + δ) = erfc(u) − (2/√π)·e^(−u²)·δ is applied.
 *
 * @param z - The standard normal deviate.
 * @returns P(Z > z) in [0, 1]; NaN for NaN.
 */
export function normalUpperTail(z: number): number {
  if (!Number.isFinite(z)) return 0.5 * erfc(z);
  const [u, productError] = twoProduct(z, Math.SQRT1_2);
  const missed = productError + z * SQRT1_2_LOW;
  return 0.5 * (erfc(u) - TWO_OVER_SQRT_PI * Math.exp(-u * u) * missed);
}
