import { noncentralChiSquareCdf } from '../special/noncentralChiSquareCdf';
import type { Interval } from '../types';
import { findRootBracketed } from './findRootBracketed';

/** Relative accuracy of the noncentrality limits: far finer than any V a report prints. */
const NONCENTRALITY_RELATIVE_TOLERANCE = 1e-10;
/** Doublings of the search bracket before giving up; 2^200 exceeds any X² a double can hold. */
const MAX_BRACKET_DOUBLINGS = 200;

/**
 * Confidence interval for Cramér's V by inverting the noncentral chi-square distribution in its
 * noncentrality λ (Smithson 2003, Confidence Intervals, Sage QASS 140, ch. 4; Steiger & Fouladi 1997,
 * "Noncentrality interval estimation", in What If There Were No Significance Tests?, ch. 9).
 *
 * Intuition: the limits are the two population effects under which the observed X² would sit exactly
 * at the upper and the lower α/2 tail.
 *
 * ## Method
 * X² is approximately noncentral χ²(df, λ) with λ = N(k − 1)V², so w² = λ/N and V = √(λ / (N(k − 1))),
 * k = min(r, c). P(χ²(df, λ) ≥ X²) grows with λ; λ_L makes that upper tail α/2 and λ_U makes it
 * 1 − α/2, each found by Brent's method on the cdf after doubling a bracket. A limit that would need
 * λ < 0 is 0. Two guards keep the interval printable beside the point estimate: limits are capped at
 * V = 1, and when X² is so small against its df that λ_U maps below the sample V (the sample V overstates
 * tiny effects) the upper limit is raised to the sample V — an interval [0, V] says the
 * data cannot tell V from 0. The form V = √(λ/(N(k − 1))) is the one consistent with w² = λ/N; the
 * alternative √((λ + df)/(N(k − 1))) would not give 0 at λ = 0.
 *
 * @param statistic - Pearson's X² (uncorrected), ≥ 0
 * @param df - (r − 1)(c − 1)
 * @param n - total count N
 * @param smallerDimension - k = min(r, c) ≥ 2
 * @param level - confidence level in (0, 1)
 * @returns V with its interval
 * @example cramersVInterval(30.07, 2, 2757, 2, 0.95) // V ≈ 0.104, interval ≈ [0.065, 0.140]
 */
export function cramersVInterval(statistic: number, df: number, n: number, smallerDimension: number, level: number): Interval {
  if (!(statistic >= 0) || !(df >= 1) || !(n > 0) || !(smallerDimension >= 2) || !(level > 0 && level < 1)) {
    throw new RangeError(`cramersVInterval: bad arguments (${statistic}, ${df}, ${n}, ${smallerDimension}, ${level})`);
  }
  const scale = n * (smallerDimension - 1);
  const toV = (lambda: number) => Math.min(1, Math.sqrt(lambda / scale));
  const estimate = toV(statistic);
  const tail = (1 - level) / 2;
  const lambdaLower = noncentralityWithCdf(statistic, df, 1 - tail);
  const lambdaUpper = noncentralityWithCdf(statistic, df, tail);
  return {
    estimate,
    lower: Math.min(toV(lambdaLower), estimate),
    upper: Math.max(toV(lambdaUpper), estimate),
    level,
    method: 'noncentral chi-square inversion',
  };
}

/** The λ ≥ 0 with P(χ²(df, λ) ≤ x) = target, or 0 when even λ = 0 leaves the cdf at or below target. */
function noncentralityWithCdf(x: number, df: number, target: number): number {
  const gap = (lambda: number) => noncentralChiSquareCdf(x, df, lambda) - target;
  if (x <= 0 || gap(0) <= 0) return 0;
  let low = 0;
  let high = Math.max(x, df, 1);
  for (let doubling = 0; gap(high) > 0; doubling++) {
    if (doubling >= MAX_BRACKET_DOUBLINGS) throw new RangeError(`cramersVInterval: no noncentrality bracket for X² = ${x}`);
    low = high;
    high *= 2;
  }
  return findRootBracketed(gap, low, high, NONCENTRALITY_RELATIVE_TOLERANCE * high);
}
