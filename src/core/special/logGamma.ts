import gammaln from '@stdlib/math-base-special-gammaln';

/**
 * Natural logarithm of the gamma function, log Γ(x), for x > 0 (log |Γ(x)| elsewhere).
 *
 * Γ grows faster than any power, so it is handled in log space; this wraps @stdlib's port of the
 * FreeBSD msun `lgamma` (Sun Microsystems, 1993), accurate to about one unit in the last place.
 *
 * @param x - The argument.
 * @returns log Γ(x); Infinity at 0 and the negative integers; NaN for NaN.
 */
export function logGamma(x: number): number {
  return gammaln(x);
}
