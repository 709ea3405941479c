import { normalUpperTail } from './normalUpperTail';

/** Halley's iteration stops when a step is below this share of |z| (a few eps). */
const STEP_TOLERANCE = 1e-15;
/** From the start's error of 4.5e-4, cubic convergence needs 3 steps; the cap leaves room. */
const MAX_ITERATIONS = 20;
/** Abramowitz & Stegun 26.2.23 rational approximation coefficients (absolute error below 4.5e-4). */
const C0 = 2.515517;
const C1 = 0.802853;
const C2 = 0.010328;
const D1 = 1.432788;
const D2 = 0.189269;
const D3 = 0.001308;
const LOG_SQRT_TWO_PI = 0.5 * Math.log(2 * Math.PI);

/**
 * Standard normal quantile: the z with P(Z ≤ z) = p, to a relative error of a few eps from
 * p = 1e-300 to 1 − 1e-16 (@stdlib's quantile, via erfinv(2p − 1), returns −Infinity below p ≈ 1e-17).
 *
 * Turns a probability into a z value (0.975 → 1.959964). References: Abramowitz & Stegun (1964)
 * 26.2.23 for the start; Halley's method.
 *
 * ## Method
 * For p ≤ ½ solve f(z) = log Φ(z) − log p = 0 with Φ(z) = P(Z > −z) from the accurate upper tail;
 * f′ = h = φ/Φ and f″ = −h(z + h), so a Halley step is z − 2f/(2h + f(z + h)). For p > ½,
 * z(p) = −z(1 − p), where 1 − p is exact.
 *
 * @param p - A probability in [0, 1].
 * @returns The quantile; −Infinity at 0 and Infinity at 1; NaN outside [0, 1] or for NaN.
 */
export function normalQuantile(p: number): number {
  if (!(p >= 0 && p <= 1)) return Number.NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  if (p === 0.5) return 0;
  if (p > 0.5) return -lowerHalfQuantile(1 - p);
  return lowerHalfQuantile(p);
}

function lowerHalfQuantile(p: number): number {
  const t = Math.sqrt(-2 * Math.log(p));
  let z = -(t - (C0 + t * (C1 + t * C2)) / (1 + t * (D1 + t * (D2 + t * D3))));
  const logP = Math.log(p);
  for (let iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
    const logLower = Math.log(normalUpperTail(-z));
    const f = logLower - logP;
    const hazard = Math.exp(-0.5 * z * z - LOG_SQRT_TWO_PI - logLower);
    const step = (2 * f) / (2 * hazard + f * (z + hazard));
    z -= step;
    if (!(Math.abs(step) > STEP_TOLERANCE * Math.abs(z))) break;
  }
  return z;
}
