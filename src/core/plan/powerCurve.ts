import { chiSquareCriticalValue } from '../special/chiSquareCriticalValue';
import { noncentralChiSquareUpperTail } from '../special/noncentralChiSquareUpperTail';
import type { PowerPoint } from './types';

/** Points on a curve, as the issue asks. */
export const POWER_CURVE_POINTS = 100;

/**
 * Power of the chi-square test (df, alpha) at effect w over total sizes from `from` to `to`,
 * in `points` evenly spaced whole sizes (fewer when the range holds fewer whole numbers).
 * Cohen (1988), ch. 7: power at N is P(χ²(df, N·w²) > c_alpha).
 *
 * How the chance of a significant result grows with the sample.
 *
 * @param w - effect size (> 0)
 * @param df - degrees of freedom
 * @param alpha - significance level
 * @param from - smallest total size (whole, ≥ 1)
 * @param to - largest total size (whole, ≥ from)
 * @param points - number of points (default 100)
 * @returns points in increasing n
 */
export function powerCurve(w: number, df: number, alpha: number, from: number, to: number, points = POWER_CURVE_POINTS): PowerPoint[] {
  const critical = chiSquareCriticalValue(alpha, df);
  const curve: PowerPoint[] = [];
  let previous = -1;
  for (let k = 0; k < points; k++) {
    const n = Math.round(from + ((to - from) * k) / Math.max(1, points - 1));
    if (n === previous) continue;
    previous = n;
    curve.push({ n, power: noncentralChiSquareUpperTail(critical, df, n * w * w) });
  }
  return curve;
}
