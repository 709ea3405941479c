import { normalQuantile } from '../special/normalQuantile';
import type { Interval } from '../types';

// Every interval of one table shares the level, so its z is computed once (tables have up to 10,000 cells).
let cachedLevel = Number.NaN;
let cachedZ = Number.NaN;

function twoSidedZ(level: number): number {
  if (level !== cachedLevel) {
    cachedZ = -normalQuantile((1 - level) / 2);
    cachedLevel = level;
  }
  return cachedZ;
}

/**
 * Wilson's (1927) score interval for a binomial proportion (Wilson, "Probable inference, the law of
 * succession, and statistical inference", JASA 22, 209–212; method 3 in Newcombe 1998, Statistics in
 * Medicine 17, 857–872).
 *
 * Intuition: the interval holds every proportion π for which the observed share is within z standard
 * errors √(π(1 − π)/n) of π, so it never leaves [0, 1] and stays sensible at 0 or n successes.
 *
 * ## Method
 * Solving |p̂ − π| = z√(π(1 − π)/n) for π gives
 * (p̂ + z²/2n ± z√(p̂(1 − p̂)/n + z²/4n²)) / (1 + z²/n), with z the two-sided normal quantile.
 *
 * @param successes - count of the outcome, 0 ≤ successes ≤ n
 * @param n - number of trials (> 0)
 * @param level - confidence level in (0, 1), e.g. 0.95
 * @returns the proportion successes/n with its interval
 * @example wilsonInterval(81, 263, 0.95) // { estimate: 0.3080, lower: 0.2553, upper: 0.3662, ... }
 */
export function wilsonInterval(successes: number, n: number, level: number): Interval {
  if (!(n > 0) || !(successes >= 0 && successes <= n) || !(level > 0 && level < 1)) {
    throw new RangeError(`wilsonInterval: needs 0 ≤ successes ≤ n, n > 0 and 0 < level < 1 (got ${successes}, ${n}, ${level})`);
  }
  const z = twoSidedZ(level);
  const estimate = successes / n;
  const zz = (z * z) / n;
  const centre = (estimate + zz / 2) / (1 + zz);
  const halfWidth = (z / (1 + zz)) * Math.sqrt((estimate * (1 - estimate)) / n + zz / (4 * n));
  return {
    estimate,
    lower: successes === 0 ? 0 : Math.max(0, centre - halfWidth),
    upper: successes === n ? 1 : Math.min(1, centre + halfWidth),
    level,
    method: 'Wilson score',
  };
}
