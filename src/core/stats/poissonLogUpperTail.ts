import { logPoissonProbability } from '../special/logPoissonProbability';

/** Stop adding tail terms once they no longer change a double. */
const SERIES_RELATIVE_TOLERANCE = Number.EPSILON / 2;
/**
 * Cap on tail terms. Beyond k the terms fall at least like exp(−j²/(2μ)), so about √(75μ) terms reach
 * the tolerance: 3·10⁵ covers means up to about 10⁹, far beyond any count table.
 */
const MAX_SERIES_TERMS = 300_000;

/**
 * ln P(X ≥ k) for a Poisson variable with mean μ, accurate when the tail is tiny as well as when it
 * is near 1 (Johnson, Kemp & Kotz 2005, Univariate Discrete Distributions 3rd ed., §4.4 — direct
 * summation; common practice).
 *
 * Intuition: when k lies above the mean the tail is a quickly shrinking series and is summed
 * directly; otherwise it is one minus the (then small) sum below k.
 *
 * ## Method
 * For μ < k + 1: ln P(X ≥ k) = ln P(X = k) + ln Σⱼ tⱼ with t₀ = 1, tⱼ₊₁ = tⱼ μ/(k + j + 1), summed
 * until a term no longer changes the sum. Otherwise ln(1 − Σ_{i<k} P(X = i)) via log1p, where the
 * tail is at least about one half, so nothing cancels.
 *
 * @param k - a whole number ≥ 0
 * @param mean - μ > 0
 * @returns ln P(X ≥ k) (0 for k = 0)
 * @example Math.exp(poissonLogUpperTail(3, 1.5)) // ≈ 0.1912
 */
export function poissonLogUpperTail(k: number, mean: number): number {
  if (k <= 0) return 0;
  if (mean < k + 1) {
    let term = 1;
    let sum = 1;
    for (let j = 0; j < MAX_SERIES_TERMS; j++) {
      term *= mean / (k + j + 1);
      sum += term;
      if (term < sum * SERIES_RELATIVE_TOLERANCE) break;
    }
    return logPoissonProbability(k, mean) + Math.log(sum);
  }
  let below = 0;
  for (let i = 0; i < k; i++) below += Math.exp(logPoissonProbability(i, mean));
  return Math.log1p(-Math.min(below, 1));
}
