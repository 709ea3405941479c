import { normalQuantile } from '../special/normalQuantile';
import { REPLICATES_PER_STREAM } from './random';

/**
 * The number of Monte Carlo replicates R that pins p down to ±targetHalfWidth near pNear.
 *
 * Intuition: b/R has standard error √(p(1 − p)/R), so halving the interval's width takes four times
 * the replicates; the default asks for ±0.002 at p = 0.05, enough to tell 0.046 from 0.054.
 *
 * ## Method
 * The normal-approximation (Wald) half-width z√(p(1 − p)/R) = h gives R = z²p(1 − p)/h², with z the
 * two-sided normal quantile of `level`. R is then rounded up so that R + 1 is a whole number of
 * blocks of REPLICATES_PER_STREAM (1,000), which keeps (b + 1)/(R + 1) a round fraction. With the
 * defaults: 1.959964² · 0.05 · 0.95 / 0.002² = 45,617.6, so R = 45,999.
 *
 * @param targetHalfWidth - wanted half-width of the interval on p (in (0, 0.5])
 * @param pNear - the p where the precision matters (in (0, 1))
 * @param level - confidence level of that interval (in (0, 1))
 * @returns R, an integer of the form k·1000 − 1 (at least 999)
 */
export function monteCarloDefaultReplicates(targetHalfWidth = 0.002, pNear = 0.05, level = 0.95): number {
  if (!(targetHalfWidth > 0 && targetHalfWidth <= 0.5) || !(pNear > 0 && pNear < 1) || !(level > 0 && level < 1)) {
    throw new RangeError(`monteCarloDefaultReplicates: needs 0 < halfWidth ≤ 0.5, 0 < p < 1, 0 < level < 1 (got ${targetHalfWidth}, ${pNear}, ${level})`);
  }
  const z = -normalQuantile((1 - level) / 2);
  const needed = (z * z * pNear * (1 - pNear)) / (targetHalfWidth * targetHalfWidth);
  return Math.ceil((needed + 1) / REPLICATES_PER_STREAM) * REPLICATES_PER_STREAM - 1;
}
