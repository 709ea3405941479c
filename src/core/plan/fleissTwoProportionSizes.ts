import { normalQuantile } from '../special/normalQuantile';
import type { NormalApproximationSizes } from './types';

/**
 * Group sizes to compare two proportions with a two-sided test at level alpha and the given power,
 * by the normal approximation of Fleiss, Levin & Paik (2003), Statistical Methods for Rates and
 * Proportions, 3rd ed., ch. 4: eq. 4.14 (no continuity correction) and the continuity correction of
 * eq. 4.15/4.16, generalised to unequal groups (n2 = r·n1) as written under Method. The equation
 * numbers and the unequal-allocation form are from memory, not checked against the book; the formula
 * itself is checked against the same formula computed with scipy, and at r = 1 against 435 / 474 per
 * group for p1 = .05, p2 = .10 (from memory).
 *
 * How many per group so that the difference p2 − p1 stands out of the sampling noise often enough.
 *
 * ## Method
 * With p̄ = (p1 + r·p2)/(1 + r), q = 1 − p and z the standard normal upper quantiles,
 *   m′ = [z_{α/2} √((r + 1) p̄ q̄) + z_β √(r p1 q1 + p2 q2)]² / (r (p2 − p1)²)   (group 1, uncorrected),
 *   m  = (m′/4) [1 + √(1 + 2(r + 1) / (r m′ |p2 − p1|))]²                          (continuity corrected),
 * and group 2 gets r·m′ (r·m). For r = 1 these are 4.14 and 4.15. Each size is rounded up.
 *
 * @param p1 - proportion in group 1, in (0, 1)
 * @param p2 - proportion in group 2, in (0, 1), ≠ p1
 * @param alpha - two-sided significance level
 * @param power - target power
 * @param ratio - n2 / n1 (> 0)
 * @returns the rounded-up sizes with and without the correction
 */
export function fleissTwoProportionSizes(p1: number, p2: number, alpha: number, power: number, ratio = 1): NormalApproximationSizes {
  const zAlpha = -normalQuantile(alpha / 2);
  const zBeta = -normalQuantile(1 - power);
  const pooled = (p1 + ratio * p2) / (1 + ratio);
  const gap = Math.abs(p2 - p1);
  const root = zAlpha * Math.sqrt((ratio + 1) * pooled * (1 - pooled)) + zBeta * Math.sqrt(ratio * p1 * (1 - p1) + p2 * (1 - p2));
  const uncorrected = (root * root) / (ratio * gap * gap);
  const boost = 1 + Math.sqrt(1 + (2 * (ratio + 1)) / (ratio * uncorrected * gap));
  const corrected = (uncorrected / 4) * boost * boost;
  const perGroup: [number, number] = [roundUp(uncorrected), roundUp(ratio * uncorrected)];
  const correctedPerGroup: [number, number] = [roundUp(corrected), roundUp(ratio * corrected)];
  return { perGroup, n: perGroup[0] + perGroup[1], correctedPerGroup, correctedN: correctedPerGroup[0] + correctedPerGroup[1] };
}

/** Round up, but not past a value that is whole up to floating-point noise. */
function roundUp(value: number): number {
  return Math.ceil(value - 1e-9 * Math.max(1, value));
}
