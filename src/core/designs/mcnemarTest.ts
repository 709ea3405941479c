import { normalQuantile } from '../special/normalQuantile';
import { chiSquareUpperTail } from '../special/chiSquareUpperTail';
import { binomialLogPmf } from '../stats/binomialLogPmf';
import { binomialLogUpperTail } from '../stats/binomialLogUpperTail';
import { wilsonInterval } from '../stats/wilsonInterval';
import type { Interval, TailProbability } from '../types';

/** A paired 2×2 table: [[both yes, yes then no], [no then yes, both no]]. */
export type PairedTable = readonly [readonly [number, number], readonly [number, number]];

export interface McNemarResult {
  /** Number of pairs. */
  n: number;
  /** Discordant pairs b (yes → no) and c (no → yes). */
  discordant: { b: number; c: number };
  /** (b − c)²/(b + c), df 1. */
  chiSquare: TailProbability & { statistic: number; df: 1 };
  /** (|b − c| − 1)²/(b + c), df 1 (Edwards 1948). */
  chiSquareCorrected: TailProbability & { statistic: number; df: 1 };
  /** Two-sided exact conditional binomial p: 2 · P(X ≤ min(b, c)), X ~ Bin(b + c, ½), capped at 1. */
  exact: TailProbability;
  /** Mid-p: the exact p minus P(X = min(b, c)) (Fagerland, Lydersen & Laake 2013). */
  midP: TailProbability;
  /** Difference in paired proportions p₁ − p₂ = (b − c)/n with two intervals. */
  difference: { wald: Interval; newcombe: Interval };
}

/**
 * McNemar's test for paired binary outcomes, its exact and mid-p versions, and the difference in
 * paired proportions with Wald and Newcombe intervals (McNemar 1947, Psychometrika 12, 153–157;
 * Fagerland, Lydersen & Laake 2013, BMC Medical Research Methodology 13:91; Newcombe 1998,
 * Statistics in Medicine 17, 2635–2650, method 10; Agresti 2013, Categorical Data Analysis 3rd ed., §11.1).
 *
 * Intuition: pairs that agree say nothing about a change; under no change each discordant pair is
 * equally likely to go either way, so b is a fair-coin count out of b + c.
 *
 * ## Method
 * - X² = (b − c)²/(b + c) and (max(|b − c| − 1, 0))²/(b + c), upper chi-square tail with df 1.
 * - Exact: 2 · P(X ≥ max(b, c)) for X ~ Bin(b + c, ½) (equal to the lower tail at min by symmetry),
 *   summed in log space and capped at 1; mid-p = 2 · P(X ≥ max) − P(X = max).
 * - b + c = 0: statistics 0 and every p = 1.
 * - Wald: (b − c)/n ± z √((b + c)/n − ((b − c)/n)²)/√n (Agresti 2013, (11.2)), clipped to [−1, 1].
 * - Newcombe method 10: Wilson limits (l₁, u₁), (l₂, u₂) of the margins p₁ = (a + b)/n and
 *   p₂ = (a + c)/n, φ = C/√((a + b)(c + d)(a + c)(b + d)) (0 when a margin is 0) with Newcombe's
 *   C = ad − bc − n/2 if ad − bc > n/2, 0 if 0 ≤ ad − bc ≤ n/2, ad − bc if negative, and
 *   lower = θ − √((p₁ − l₁)² − 2φ(p₁ − l₁)(u₂ − p₂) + (u₂ − p₂)²),
 *   upper = θ + √((u₁ − p₁)² − 2φ(u₁ − p₁)(p₂ − l₂) + (p₂ − l₂)²).
 *
 * @param table - paired counts [[a, b], [c, d]]: non-negative whole numbers, n > 0
 * @param level - confidence level in (0, 1) for the intervals
 * @returns the statistics, p-values and intervals
 * @example mcnemarTest([[794, 150], [86, 570]]).chiSquare.statistic // ≈ 17.36
 */
export function mcnemarTest(table: PairedTable, level = 0.95): McNemarResult {
  const [[a, b], [c, d]] = table;
  for (const count of [a, b, c, d]) {
    if (!Number.isInteger(count) || count < 0) throw new RangeError(`mcnemarTest: counts must be non-negative whole numbers (got ${count})`);
  }
  if (!(level > 0 && level < 1)) throw new RangeError(`mcnemarTest: level must be in (0, 1) (got ${level})`);
  const n = a + b + c + d;
  if (n === 0) throw new RangeError('mcnemarTest: the table is empty');

  const discordantTotal = b + c;
  const statistic = discordantTotal === 0 ? 0 : (b - c) ** 2 / discordantTotal;
  const corrected = discordantTotal === 0 ? 0 : Math.max(Math.abs(b - c) - 1, 0) ** 2 / discordantTotal;
  const { exact, midP } = exactBinomialPValues(Math.max(b, c), discordantTotal);

  const z = normalQuantile(1 - (1 - level) / 2);
  const theta = (b - c) / n;
  const waldHalfWidth = (z * Math.sqrt(Math.max(discordantTotal / n - theta * theta, 0))) / Math.sqrt(n);
  const wald: Interval = {
    estimate: theta,
    lower: Math.max(theta - waldHalfWidth, -1),
    upper: Math.min(theta + waldHalfWidth, 1),
    level,
    method: 'Wald',
  };

  return {
    n,
    discordant: { b, c },
    chiSquare: { statistic, df: 1, ...chiSquareUpperTail(statistic, 1) },
    chiSquareCorrected: { statistic: corrected, df: 1, ...chiSquareUpperTail(corrected, 1) },
    exact,
    midP,
    difference: { wald, newcombe: newcombePairedInterval(a, b, c, d, level) },
  };
}

function exactBinomialPValues(larger: number, trials: number): { exact: TailProbability; midP: TailProbability } {
  if (trials === 0) return { exact: { p: 1, log10p: 0 }, midP: { p: 1, log10p: 0 } };
  const logTail = binomialLogUpperTail(larger, trials, 0.5);
  const logPoint = binomialLogPmf(larger, trials, 0.5);
  const logExact = Math.min(Math.LN2 + logTail, 0);
  // 2T − f = T(2 − f/T) keeps the log finite when T underflows.
  const logMid = Math.min(logTail + Math.log(2 - Math.exp(logPoint - logTail)), 0);
  return {
    exact: { p: Math.exp(logExact), log10p: logExact / Math.LN10 },
    midP: { p: Math.exp(logMid), log10p: logMid / Math.LN10 },
  };
}

function newcombePairedInterval(a: number, b: number, c: number, d: number, level: number): Interval {
  const n = a + b + c + d;
  const first = wilsonInterval(a + b, n, level);
  const second = wilsonInterval(a + c, n, level);
  const p1 = (a + b) / n;
  const p2 = (a + c) / n;
  const marginProduct = (a + b) * (c + d) * (a + c) * (b + d);
  const crossDifference = a * d - b * c;
  // Newcombe's continuity-adjusted numerator: shrink a positive ad − bc by n/2, never past 0.
  const adjusted = crossDifference > n / 2 ? crossDifference - n / 2 : crossDifference < 0 ? crossDifference : 0;
  const phi = marginProduct === 0 ? 0 : adjusted / Math.sqrt(marginProduct);
  const theta = (b - c) / n;
  const below = Math.sqrt(Math.max((p1 - first.lower) ** 2 - 2 * phi * (p1 - first.lower) * (second.upper - p2) + (second.upper - p2) ** 2, 0));
  const above = Math.sqrt(Math.max((first.upper - p1) ** 2 - 2 * phi * (first.upper - p1) * (p2 - second.lower) + (p2 - second.lower) ** 2, 0));
  return {
    estimate: theta,
    lower: Math.max(theta - below, -1),
    upper: Math.min(theta + above, 1),
    level,
    method: 'Newcombe paired (method 10)',
  };
}
