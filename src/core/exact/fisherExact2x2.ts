import type { Interval } from '../types';
import { conditionalOddsRatio } from './conditionalOddsRatio';
import { hypergeometricLogProbability } from './hypergeometricLogProbability';
import { hypergeometricLogTail } from './hypergeometricLogTail';
import { hypergeometricMargins, type HypergeometricMargins } from './hypergeometricMargins';
import { RELATIVE_TIE_TOLERANCE, type ExactPValue } from './types';

/** A mirror-image guess is usually within a few steps of the other side's boundary; beyond this many, bisect. */
const MAX_BOUNDARY_STEPS = 32;

/** Mid-p values: each p with half the probability of the tables tied with the observed one taken off. */
export interface FisherMidP {
  /** Two-sided: P(tables less probable than the observed) + ½·P(tables as probable, the observed included). */
  p: number;
  /** pLess − ½·P(observed). */
  pLess: number;
  /** pGreater − ½·P(observed). */
  pGreater: number;
}

export interface FisherResult extends ExactPValue {
  method: 'fisher-2x2';
  /** One-sided P(A ≤ a): evidence that the odds ratio is below 1. */
  pLess: number;
  /** One-sided P(A ≥ a): evidence that the odds ratio is above 1. */
  pGreater: number;
  /** Present when requested with `midP: true`. */
  midP?: FisherMidP;
  /** Conditional maximum-likelihood odds ratio and exact interval; null when a margin is 0 or when not requested. */
  oddsRatio: Interval | null;
  /** ad / bc (Infinity when only bc is 0); null when a margin is 0, where it is 0/0. */
  sampleOddsRatio: number | null;
}

export interface FisherOptions {
  /** Also report mid-p values (default false). */
  midP?: boolean;
  /** Compute the conditional odds ratio and its interval (default true; it costs more than the p-values). */
  oddsRatio?: boolean;
  /** Confidence level of the odds-ratio interval, in (0, 1) (default 0.95). */
  level?: number;
}

/**
 * Fisher's exact test for a 2×2 table [[a, b], [c, d]]: two-sided and one-sided p-values, optional
 * mid-p values, and the conditional odds ratio with its exact interval.
 *
 * Intuition: with both row and both column totals fixed, every possible table is one value of a, with
 * a hypergeometric probability; p is the share of tables at least as surprising as the one observed.
 * Fisher (1935), The Design of Experiments, ch. II; Agresti (2013), Categorical Data Analysis, 3rd ed., §3.5.
 *
 * ## Method
 * Two-sided p sums the probabilities P(x) ≤ P(a)·(1 + RELATIVE_TIE_TOLERANCE); since P rises to the
 * mode and then falls, these are two tails: a's own (stretched toward the mode by any ties) and the
 * other side's from its first counted value U. U is found from a's mirror image about the mean by a
 * few steps of the ratio recurrence, or by bisection on log P when that guess is far off (log P from
 * hypergeometricLogProbability, accurate for N up to 10⁷ and beyond). Each tail is summed by
 * hypergeometricLogTail from its inner end outward, relative to its first term, and the two are
 * combined by log-sum-exp, so log10p stays right where p underflows. a's own tail is also one
 * one-sided p; the other one-sided p is 1 minus the part of that tail beyond a.
 *
 * Mid-p (Lancaster 1961, "Significance tests in discrete distributions", JASA 56, 223–234; Agresti
 * 2013, §3.5): the one-sided mid-p is p − ½·P(a); the two-sided mid-p is the sum over
 * tables strictly less probable than the observed one plus half the sum over tables tied with it
 * (within RELATIVE_TIE_TOLERANCE either way), the observed table included: p − ½·P(ties).
 *
 * @param table - [[a, b], [c, d]] of non-negative integers
 * @param options - mid-p, odds ratio and confidence level (see FisherOptions)
 * @returns the p-values, log10 of the two-sided p, and the odds ratios
 * @throws RangeError for a cell that is negative, not an integer or not finite, or a level outside (0, 1)
 *   (programmer errors: the engine validates first)
 * @example fisherExact2x2([[3, 1], [1, 3]]).p // 34/70 ≈ 0.4857
 */
export function fisherExact2x2(table: readonly [readonly [number, number], readonly [number, number]], options: FisherOptions = {}): FisherResult {
  const started = performance.now();
  const margins = hypergeometricMargins(table);
  const level = options.level ?? 0.95;
  if (!(level > 0 && level < 1)) throw new RangeError(`the confidence level must lie in (0, 1), got ${level}`);
  const [[a, b], [c, d]] = table;
  const { lowest, highest, mode } = margins;
  const logObserved = hypergeometricLogProbability(a, margins);
  const observed = Math.exp(logObserved);

  let logP = 0;
  let pLess = 1;
  let pGreater = 1;
  let ties = observed;
  if (lowest !== highest) {
    // The observed value's own tail, walked once: it is one one-sided p and one part of the two-sided p.
    const side = a <= mode ? -1 : 1;
    const tail = hypergeometricLogTail(margins, a, side < 0 ? 'down' : 'up', logObserved);
    const ownTail = Math.min(1, Math.exp(tail.logTail));
    // Everything beyond a on its own side is P(a)·rest, so the other one-sided p needs no subtraction of P(a).
    const complement = clamp01(1 - observed * tail.rest);
    pLess = side < 0 ? ownTail : complement;
    pGreater = side < 0 ? complement : ownTail;

    const logThreshold = logObserved + Math.log1p(RELATIVE_TIE_TOLERANCE);
    const logTieFloor = logObserved - Math.log1p(RELATIVE_TIE_TOLERANCE);
    const logMode = a === mode ? logObserved : hypergeometricLogProbability(mode, margins);
    if (logMode <= logThreshold) {
      if (options.midP) ties = tieMass(margins, mode, mode + 1, logTieFloor);
    } else {
      // P rises to the mode and falls after it: the counted tables are a's tail, stretched toward the
      // mode by any ties, and the other side's tail from its first counted value.
      const own = tiesTowardMode(margins, a, side < 0 ? 1 : -1);
      const other = otherSideStart(margins, side < 0 ? 1 : -1, mirrorGuess(margins, a), logThreshold);
      const logOwn = logObserved + Math.log1p(tail.rest + own.extra);
      const logOther = other ? hypergeometricLogTail(margins, other.x, side < 0 ? 'up' : 'down', other.logProbability).logTail : -Infinity;
      logP = Math.min(0, logSumExp(logOwn, logOther));
      if (options.midP) {
        const otherStart = other ? other.x : side < 0 ? highest + 1 : lowest - 1;
        ties = side < 0 ? tieMass(margins, own.end, otherStart, logTieFloor) : tieMass(margins, otherStart, own.end, logTieFloor);
      }
    }
  }

  const p = Math.exp(logP);
  const sampleOddsRatio = lowest === highest ? null : b * c === 0 ? Infinity : (a * d) / (b * c);
  const oddsRatio = options.oddsRatio === false ? null : conditionalOddsRatio(table, level);
  const result: FisherResult = {
    method: 'fisher-2x2',
    p,
    log10p: logP / Math.LN10,
    pLess,
    pGreater,
    oddsRatio,
    sampleOddsRatio,
    elapsedMs: 0,
  };
  if (options.midP) {
    result.midP = {
      p: Math.max(0, p - 0.5 * ties),
      pLess: Math.max(0, pLess - 0.5 * observed),
      pGreater: Math.max(0, pGreater - 0.5 * observed),
    };
  }
  result.elapsedMs = performance.now() - started;
  return result;
}

/** P(x + step)/P(x) by the ratio recurrence (step = 1 or −1). */
function neighbourRatio(margins: HypergeometricMargins, x: number, step: 1 | -1): number {
  const { rowTotal: m, otherRowTotal: n, columnTotal: k } = margins;
  return step > 0 ? ((m - x) * (k - x)) / ((x + 1) * (n - k + x + 1)) : (x * (n - k + x)) / ((m - x + 1) * (k - x + 1));
}

/**
 * From a toward the mode, the values whose probability is within the tie tolerance of P(a) (usually
 * none): the last such value and their summed probability relative to P(a).
 */
function tiesTowardMode(margins: HypergeometricMargins, a: number, step: 1 | -1): { end: number; extra: number } {
  const limit = 1 + RELATIVE_TIE_TOLERANCE;
  let end = a;
  let relative = 1;
  let extra = 0;
  while (end + step !== margins.mode) {
    const next = relative * neighbourRatio(margins, end, step);
    if (next > limit) break;
    relative = next;
    extra += relative;
    end += step;
  }
  return { end, extra };
}

/** Where a's mirror image about the mean would sit: a first guess for the other side's boundary. */
function mirrorGuess(margins: HypergeometricMargins, a: number): number {
  return Math.round((2 * margins.columnTotal * margins.rowTotal) / margins.total - a);
}

/**
 * On the given side of the mode (step = 1: above it), the first value with log P ≤ logThreshold, or
 * null if there is none. Walks from the guess with the ratio recurrence (a few steps for a good
 * guess), and falls back to bisection on log P when the guess is far off.
 */
function otherSideStart(
  margins: HypergeometricMargins,
  step: 1 | -1,
  guess: number,
  logThreshold: number,
): { x: number; logProbability: number } | null {
  const inner = margins.mode + step;
  const end = step > 0 ? margins.highest : margins.lowest;
  if ((end - inner) * step < 0) return null;
  let x = step > 0 ? Math.min(end, Math.max(inner, guess)) : Math.max(end, Math.min(inner, guess));
  const logGuess = hypergeometricLogProbability(x, margins);
  const limit = Math.exp(logThreshold - logGuess);
  if (!(limit > 0 && limit < Infinity)) return bisectFirstCounted(margins, inner, end, step, logThreshold);
  let relative = 1;
  if (logGuess <= logThreshold) {
    // Counted: step back toward the mode while the next value in is counted too.
    for (let steps = 0; x !== inner; steps++) {
      if (steps === MAX_BOUNDARY_STEPS) return bisectFirstCounted(margins, inner, x, step, logThreshold);
      const next = relative * neighbourRatio(margins, x, step > 0 ? -1 : 1);
      if (next > limit) break;
      relative = next;
      x -= step;
    }
    return { x, logProbability: logGuess + Math.log(relative) };
  }
  for (let steps = 0; x !== end; steps++) {
    if (steps === MAX_BOUNDARY_STEPS) return bisectFirstCounted(margins, x + step, end, step, logThreshold);
    relative *= neighbourRatio(margins, x, step);
    x += step;
    if (relative <= limit) return { x, logProbability: logGuess + Math.log(relative) };
  }
  return null;
}

/** The first x from `from` to `to` (moving by step, away from the mode) with log P(x) ≤ logThreshold, or null. */
function bisectFirstCounted(
  margins: HypergeometricMargins,
  from: number,
  to: number,
  step: 1 | -1,
  logThreshold: number,
): { x: number; logProbability: number } | null {
  const logAt = (x: number) => hypergeometricLogProbability(x, margins);
  if (logAt(to) > logThreshold) return null;
  // Invariant: `to` is counted and nothing nearer the mode than `from` is.
  let near = from;
  let far = to;
  while (near !== far) {
    const middle = step > 0 ? Math.floor((near + far) / 2) : Math.ceil((near + far) / 2);
    if (logAt(middle) <= logThreshold) far = middle;
    else near = middle + step;
  }
  return { x: far, logProbability: logAt(far) };
}

/** Probability of the counted tables tied with the observed: runs downward from lowerEnd and upward from upperStart. */
function tieMass(margins: HypergeometricMargins, lowerEnd: number, upperStart: number, logTieFloor: number): number {
  let mass = 0;
  for (let x = lowerEnd; x >= margins.lowest; x--) {
    const logProbability = hypergeometricLogProbability(x, margins);
    if (logProbability < logTieFloor) break;
    mass += Math.exp(logProbability);
  }
  for (let x = upperStart; x <= margins.highest; x++) {
    const logProbability = hypergeometricLogProbability(x, margins);
    if (logProbability < logTieFloor) break;
    mass += Math.exp(logProbability);
  }
  return mass;
}

function logSumExp(x: number, y: number): number {
  const larger = Math.max(x, y);
  if (larger === -Infinity) return -Infinity;
  return larger + Math.log(Math.exp(x - larger) + Math.exp(y - larger));
}

function clamp01(value: number): number {
  return Math.min(1, Math.max(0, value));
}
