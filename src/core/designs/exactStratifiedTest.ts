import { hypergeometricLogProbability } from '../exact/hypergeometricLogProbability';
import { hypergeometricMargins } from '../exact/hypergeometricMargins';
import { RELATIVE_TIE_TOLERANCE } from '../exact/types';
import type { TailProbability } from '../types';
import type { StratumTable } from './cochranMantelHaenszel';

/** The exact conditional test of no association in K strata, and where the observed sum stands. */
export interface ExactStratifiedResult extends TailProbability {
  /** Σ a over strata (the observed statistic). */
  observedSum: number;
  /** Smallest and largest Σ a the margins allow. */
  lowest: number;
  highest: number;
  /** One-sided p-values: P(Σa ≤ observed) and P(Σa ≥ observed). */
  pLess: number;
  pGreater: number;
}

/**
 * Support sizes beyond this (the sum of every stratum's range) are left to the CMH chi-square: the
 * log-space convolution costs about (support/2)² steps at worst, ~0.1 s at this size.
 */
export const MAX_EXACT_SUPPORT = 5_000;

/**
 * Exact conditional test that the common odds ratio of K 2×2 strata is 1: given every stratum's
 * margins, each a_k is hypergeometric and independent of the others, so the distribution of
 * T = Σ a_k is their convolution (Agresti 2013, Categorical Data Analysis 3rd ed., §7.3.5). The
 * two-sided p sums P(T = t) over the t no more probable than the observed sum (within
 * RELATIVE_TIE_TOLERANCE), as Fisher's test does for one stratum.
 *
 * Hand-written because no general-purpose library offers the convolution of hypergeometric laws;
 * checked in the tests by brute-force enumeration of all (a_1, …, a_K) and, for K = 1, against
 * Fisher's exact test. The convolution runs in log space so that log10p stays meaningful far below
 * the smallest double.
 *
 * @param strata - the strata's 2×2 tables; strata with n < 2 carry no information and are skipped
 * @returns the two-sided and one-sided p-values, or undefined when the support exceeds MAX_EXACT_SUPPORT
 */
export function exactStratifiedTest(strata: readonly StratumTable[]): ExactStratifiedResult | undefined {
  let logDistribution = [0];
  let lowest = 0;
  let observedSum = 0;
  let support = 0;
  for (const stratum of strata) {
    const [[a, b], [c, d]] = stratum;
    if (a + b + c + d < 2) continue;
    const margins = hypergeometricMargins(stratum);
    support += margins.highest - margins.lowest;
    if (support > MAX_EXACT_SUPPORT) return undefined;
    const logPmf: number[] = [];
    for (let x = margins.lowest; x <= margins.highest; x++) logPmf.push(hypergeometricLogProbability(x, margins));
    logDistribution = convolveLog(logDistribution, logPmf);
    lowest += margins.lowest;
    observedSum += a;
  }
  const highest = lowest + logDistribution.length - 1;
  const logThreshold = logDistribution[observedSum - lowest] + Math.log1p(RELATIVE_TIE_TOLERANCE);
  const logP = logSumExp(logDistribution.filter((value) => value <= logThreshold));
  const logLess = logSumExp(logDistribution.slice(0, observedSum - lowest + 1));
  const logGreater = logSumExp(logDistribution.slice(observedSum - lowest));
  const probability = (logValue: number) => Math.min(1, Math.exp(logValue));
  return {
    p: probability(logP),
    log10p: Math.min(0, logP / Math.LN10),
    observedSum,
    lowest,
    highest,
    pLess: probability(logLess),
    pGreater: probability(logGreater),
  };
}

/** log Σ exp(values), without overflow or underflow. */
function logSumExp(values: readonly number[]): number {
  const peak = Math.max(...values);
  if (peak === -Infinity) return -Infinity;
  return peak + Math.log(values.reduce((sum, value) => sum + Math.exp(value - peak), 0));
}

/** The convolution of two distributions given as log probabilities, each output term scaled by its own largest product. */
function convolveLog(left: readonly number[], right: readonly number[]): number[] {
  const length = left.length + right.length - 1;
  const peaks = new Array<number>(length).fill(-Infinity);
  for (let i = 0; i < left.length; i++) {
    for (let j = 0; j < right.length; j++) peaks[i + j] = Math.max(peaks[i + j], left[i] + right[j]);
  }
  const sums = new Float64Array(length);
  for (let i = 0; i < left.length; i++) {
    for (let j = 0; j < right.length; j++) sums[i + j] += Math.exp(left[i] + right[j] - peaks[i + j]);
  }
  return peaks.map((peak, k) => peak + Math.log(sums[k]));
}
