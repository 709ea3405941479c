import { twoProduct } from './twoProduct';
import { twoSum } from './twoSum';

/** The series is used while |v| = |k − mean| / (k + mean) is below this (k / mean between 1/3 and 3). */
const SERIES_MAX_V = 0.5;
/** The series stops when its last term is below this share of the result (half a unit in the last place). */
const SERIES_TOLERANCE = 1e-17;
/** v² < 1/4, so terms shrink at least 4-fold: 30 terms take any start below 4^−30 ≈ 1e-18. */
const SERIES_MAX_TERMS = 30;
/** Above this the splitting could overflow; such sizes get the plain quotient. */
const SPLIT_SAFE_LIMIT = 1e290;

/**
 * The deviance term k·log(k / mean) + mean − k ≥ 0, to about one unit in the last place of itself.
 *
 * Loader (2000), "Fast and accurate computation of binomial probabilities" (his bd0): it measures
 * how far k lies from the mean, and is small and cancellation-prone exactly when k is near it.
 *
 * ## Method
 * Near the mean, with v = (k − mean)/(k + mean), the term is (k − mean)²/(k + mean) +
 * 2k·Σ_{j≥1} v^{2j+1}/(2j + 1) (Loader's series, here used out to |v| < ½). Its leading term is
 * formed in double-double arithmetic (Dekker 1971), so at a deviance of 700 (a p-value near 1e-300)
 * the error stays near 1e-13 rather than the 5e-13 of plain doubles. Farther out the direct form
 * cancels at most 3-fold.
 *
 * @param k - Where the term is evaluated, k ≥ 0 (real).
 * @param mean - The mean, mean > 0.
 * @returns The deviance term; `mean` at k = 0; NaN for invalid arguments.
 */
export function poissonDevianceTerm(k: number, mean: number): number {
  if (!(k >= 0) || !(mean > 0) || k === Infinity || mean === Infinity) return Number.NaN;
  if (k === 0) return mean;
  const difference = k - mean;
  const total = k + mean;
  const v = difference / total;
  if (!(Math.abs(v) < SERIES_MAX_V)) {
    const ratio = k / mean;
    // The quotient overflows or underflows only for subnormal arguments; the logs' difference then serves.
    const logRatio = ratio > 0 && ratio < Infinity ? Math.log(ratio) : Math.log(k) - Math.log(mean);
    return k * logRatio - difference;
  }

  const leading = total < SPLIT_SAFE_LIMIT ? squareOverSum(k, mean) : difference * v;
  const vSquared = v * v;
  let power = 2 * k * v * vSquared;
  let tail = power / 3;
  for (let j = 2; j <= SERIES_MAX_TERMS; j++) {
    power *= vSquared;
    const term = power / (2 * j + 1);
    tail += term;
    if (Math.abs(term) <= SERIES_TOLERANCE * leading) break;
  }
  return leading + tail;
}

/** (k − m)² / (k + m) with the difference, square, sum and quotient carried in double-double. */
function squareOverSum(k: number, m: number): number {
  const [differenceHigh, differenceLow] = twoSum(k, -m);
  const [squareHigh, squareLowExact] = twoProduct(differenceHigh, differenceHigh);
  const squareLow = squareLowExact + 2 * differenceHigh * differenceLow;
  const [sumHigh, sumLow] = twoSum(k, m);
  const quotient = squareHigh / sumHigh;
  const [productHigh, productLow] = twoProduct(quotient, sumHigh);
  const residual = squareHigh - productHigh - productLow + squareLow - quotient * sumLow;
  return quotient + residual / sumHigh;
}
