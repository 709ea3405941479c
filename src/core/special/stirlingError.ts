import { logGamma } from './logGamma';

const LOG_SQRT_TWO_PI = 0.5 * Math.log(2 * Math.PI);
/** From here up the asymptotic series below is used: its first omitted term is below 3e-17. */
const SERIES_FROM = 10;
/** Coefficients B_{2k} / (2k(2k − 1)) of the Stirling series (Abramowitz & Stegun 6.1.40). */
const S1 = 1 / 12;
const S2 = 1 / 360;
const S3 = 1 / 1260;
const S4 = 1 / 1680;
const S5 = 1 / 1188;
const S6 = 691 / 360360;
const S7 = 1 / 156;

/**
 * Stirling's error term: log Γ(a + 1) − [(a + ½)·log a − a + ½·log 2π], for a > 0.
 *
 * Loader (2000), "Fast and accurate computation of binomial probabilities". It is the small
 * correction to Stirling's formula, so densities built from it avoid subtracting huge logarithms.
 *
 * ## Method
 * For a ≥ 10 the asymptotic series 1/(12a) − 1/(360a³) + … (seven terms, error below 3e-17);
 * below, the definition through log Γ, whose absolute error there is below 1e-14.
 *
 * @param a - The argument, a > 0 (any real, not only integers).
 * @returns The error term (≈ 1/(12a) for large a); NaN for a ≤ 0 or NaN.
 */
export function stirlingError(a: number): number {
  if (!(a > 0)) return Number.NaN;
  if (a < SERIES_FROM) return logGamma(a + 1) - (a + 0.5) * Math.log(a) + a - LOG_SQRT_TWO_PI;
  if (a === Infinity) return 0;
  const inverseSquare = 1 / (a * a);
  return (
    (S1 - inverseSquare * (S2 - inverseSquare * (S3 - inverseSquare * (S4 - inverseSquare * (S5 - inverseSquare * (S6 - inverseSquare * S7)))))) / a
  );
}
