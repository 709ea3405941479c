import { chiSquareCriticalValue } from '../special/chiSquareCriticalValue';
import { noncentralChiSquareUpperTail } from '../special/noncentralChiSquareUpperTail';
import { findRootBracketed } from '../stats/findRootBracketed';

/** λ is wanted to a relative 1e-12: far below the 1e-4 that would move a rounded-up N (N·w² ≥ λ). */
const RELATIVE_TOLERANCE = 1e-12;
/** Doublings of the upper bracket end; power 1 − 1e-15 needs λ of a few hundred for df ≤ 1000, so 60 is ample. */
const MAX_DOUBLINGS = 60;

/**
 * The noncentrality λ at which a chi-square test (df, alpha) has exactly the target power:
 * P(χ²(df, λ) > c_alpha) = power. Sample sizes follow as N = λ / w² (Cohen 1988, ch. 7, eq. 7.4.1).
 *
 * How far from "no effect" the statistic's distribution must move for the test to reject that often.
 *
 * ## Method
 * Power rises strictly with λ. Start the bracket at [0, df + c_alpha], double its upper end until
 * the power there exceeds the target, then solve with Brent's method (`findRootBracketed`).
 *
 * @param df - degrees of freedom (≥ 1)
 * @param alpha - significance level in (0, 1)
 * @param power - target power in (alpha, 1)
 * @returns λ > 0, or NaN when the inputs do not allow one (power ≤ alpha)
 */
export function requiredNoncentrality(df: number, alpha: number, power: number): number {
  if (!(power > alpha && power < 1) || !(df > 0)) return Number.NaN;
  const critical = chiSquareCriticalValue(alpha, df);
  const shortfall = (lambda: number) => noncentralChiSquareUpperTail(critical, df, lambda) - power;
  let high = df + critical;
  for (let doubling = 0; shortfall(high) < 0; doubling++) {
    if (doubling >= MAX_DOUBLINGS) return Number.NaN;
    high *= 2;
  }
  return findRootBracketed(shortfall, 0, high, RELATIVE_TOLERANCE * high);
}
