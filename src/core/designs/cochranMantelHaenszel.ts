import { chiSquareUpperTail } from '../special/chiSquareUpperTail';
import { normalQuantile } from '../special/normalQuantile';
import type { Interval, TailProbability } from '../types';

/** One stratum's 2×2 table [[a, b], [c, d]]: rows are the groups, columns the outcomes. */
export type StratumTable = readonly [readonly [number, number], readonly [number, number]];

export interface StratumSummary {
  /** 0-based position in the input. */
  index: number;
  n: number;
  /** ad/(bc); undefined when b·c = 0. */
  oddsRatio: number | undefined;
}

export interface BreslowDayResult {
  /** Σ (a − A)²/Var(a | ψ̂), A the expected a under the common odds ratio ψ̂ (Mantel–Haenszel). */
  statistic: number;
  /** Breslow–Day minus Tarone's term (Σa − ΣA)²/ΣVar(a | ψ̂). */
  taroneStatistic: number;
  /** Informative strata − 1. */
  df: number;
  /** p of the uncorrected statistic. */
  p: number;
  /** p of Tarone's corrected statistic, the one to report. */
  tarone: TailProbability;
  /** Strata with a zero margin carry no information on homogeneity and are left out. */
  informativeStrata: number;
}

export interface CochranMantelHaenszelResult {
  /** Strata used (n ≥ 2). */
  strataUsed: number;
  /** Strata skipped because n ≤ 1 (their variance is undefined). */
  strataSkipped: number;
  /** (Σa − ΣE)²/ΣV, df 1. */
  statistic: TailProbability & { value: number; df: 1 };
  /** (max(|Σa − ΣE| − ½, 0))²/ΣV, df 1. */
  corrected: TailProbability & { value: number; df: 1 };
  /** Mantel–Haenszel common odds ratio with the Robins–Breslow–Greenland interval; undefined when ΣR or ΣS is 0. */
  pooledOddsRatio: Interval | undefined;
  /** Per stratum, in input order, skipped strata included. */
  strata: StratumSummary[];
  /** Undefined when the pooled odds ratio is undefined or fewer than 2 strata are informative. */
  breslowDay: BreslowDayResult | undefined;
}

/**
 * Cochran–Mantel–Haenszel test of conditional independence in K stratified 2×2 tables, the
 * Mantel–Haenszel common odds ratio with the Robins–Breslow–Greenland interval, and the Breslow–Day
 * test of a common odds ratio with Tarone's correction (Mantel & Haenszel 1959, JNCI 22, 719–748;
 * Robins, Breslow & Greenland 1986, Biometrics 42, 311–323; Breslow & Day 1980, Statistical Methods in
 * Cancer Research I, §4.4; Tarone 1985, Biometrika 72, 91–95; Agresti 2013, Categorical Data Analysis 3rd ed., §6.4).
 *
 * Intuition: compare each stratum's top-left count with what its margins lead one to expect if
 * group and outcome were unrelated, and add up the surprises over strata.
 *
 * ## Method
 * - Per stratum, n₁ = a + b, n₂ = c + d, m₁ = a + c, m₂ = b + d: E = n₁m₁/n,
 *   V = n₁n₂m₁m₂/(n²(n − 1)) (hypergeometric). CMH = (Σa − ΣE)²/ΣV; ΣV = 0 gives 0 and p = 1.
 * - ψ̂ = ΣR/ΣS with R = ad/n, S = bc/n; P = (a + d)/n, Q = (b + c)/n;
 *   Var(ln ψ̂) = ΣPR/(2(ΣR)²) + Σ(PS + QR)/(2ΣRΣS) + ΣQS/(2(ΣS)²); interval exp(ln ψ̂ ± z√Var).
 * - Breslow–Day: A solves A(n₂ − m₁ + A) = ψ̂(n₁ − A)(m₁ − A) within [max(0, m₁ − n₂), min(n₁, m₁)];
 *   Var = 1/(1/A + 1/B + 1/C + 1/D) over the fitted cells; df = informative strata − 1.
 *
 * @param strata - the 2×2 tables; counts non-negative whole numbers; at least one stratum with n ≥ 2
 * @param level - confidence level in (0, 1) for the pooled odds ratio
 * @returns the test, pooled odds ratio, per-stratum odds ratios and homogeneity test
 */
export function cochranMantelHaenszel(strata: readonly StratumTable[], level = 0.95): CochranMantelHaenszelResult {
  if (!(level > 0 && level < 1)) throw new RangeError(`cochranMantelHaenszel: level must be in (0, 1) (got ${level})`);
  const used: { a: number; b: number; c: number; d: number; n: number }[] = [];
  const summaries: StratumSummary[] = strata.map(([[a, b], [c, d]], index) => {
    for (const count of [a, b, c, d]) {
      if (!Number.isInteger(count) || count < 0) throw new RangeError(`cochranMantelHaenszel: counts must be non-negative whole numbers (stratum ${index}: ${count})`);
    }
    const n = a + b + c + d;
    if (n > 1) used.push({ a, b, c, d, n });
    return { index, n, oddsRatio: b * c === 0 ? undefined : (a * d) / (b * c) };
  });
  if (used.length === 0) throw new RangeError('cochranMantelHaenszel: needs at least one stratum with n ≥ 2');

  let observedSum = 0;
  let expectedSum = 0;
  let varianceSum = 0;
  let sumR = 0;
  let sumS = 0;
  let sumPR = 0;
  let sumPSQR = 0;
  let sumQS = 0;
  for (const { a, b, c, d, n } of used) {
    const rowFirst = a + b;
    const rowSecond = c + d;
    const columnFirst = a + c;
    const columnSecond = b + d;
    observedSum += a;
    expectedSum += (rowFirst * columnFirst) / n;
    varianceSum += (rowFirst * rowSecond * columnFirst * columnSecond) / (n * n * (n - 1));
    const r = (a * d) / n;
    const s = (b * c) / n;
    const p = (a + d) / n;
    const q = (b + c) / n;
    sumR += r;
    sumS += s;
    sumPR += p * r;
    sumPSQR += p * s + q * r;
    sumQS += q * s;
  }
  const deviation = Math.abs(observedSum - expectedSum);
  const value = varianceSum === 0 ? 0 : deviation ** 2 / varianceSum;
  const correctedValue = varianceSum === 0 ? 0 : Math.max(deviation - 0.5, 0) ** 2 / varianceSum;

  let pooledOddsRatio: Interval | undefined;
  let breslowDay: BreslowDayResult | undefined;
  if (sumR > 0 && sumS > 0) {
    const estimate = sumR / sumS;
    const logVariance = sumPR / (2 * sumR * sumR) + sumPSQR / (2 * sumR * sumS) + sumQS / (2 * sumS * sumS);
    const halfWidth = normalQuantile(1 - (1 - level) / 2) * Math.sqrt(logVariance);
    pooledOddsRatio = {
      estimate,
      lower: Math.exp(Math.log(estimate) - halfWidth),
      upper: Math.exp(Math.log(estimate) + halfWidth),
      level,
      method: 'Mantel–Haenszel, Robins–Breslow–Greenland variance',
    };
    breslowDay = breslowDayTest(used, estimate);
  }

  return {
    strataUsed: used.length,
    strataSkipped: strata.length - used.length,
    statistic: { value, df: 1, ...chiSquareUpperTail(value, 1) },
    corrected: { value: correctedValue, df: 1, ...chiSquareUpperTail(correctedValue, 1) },
    pooledOddsRatio,
    strata: summaries,
    breslowDay,
  };
}

function breslowDayTest(used: readonly { a: number; b: number; c: number; d: number }[], commonOddsRatio: number): BreslowDayResult | undefined {
  let statistic = 0;
  let observedSum = 0;
  let fittedSum = 0;
  let varianceSum = 0;
  let informativeStrata = 0;
  for (const { a, b, c, d } of used) {
    const rowFirst = a + b;
    const rowSecond = c + d;
    const columnFirst = a + c;
    const fitted = fittedTopLeft(rowFirst, rowSecond, columnFirst, commonOddsRatio);
    const cells = [fitted, rowFirst - fitted, columnFirst - fitted, rowSecond - columnFirst + fitted];
    if (cells.some((cell) => !(cell > 0))) continue;
    const variance = 1 / cells.reduce((sum, cell) => sum + 1 / cell, 0);
    informativeStrata += 1;
    statistic += (a - fitted) ** 2 / variance;
    observedSum += a;
    fittedSum += fitted;
    varianceSum += variance;
  }
  if (informativeStrata < 2) return undefined;
  const df = informativeStrata - 1;
  const taroneStatistic = Math.max(statistic - (observedSum - fittedSum) ** 2 / varianceSum, 0);
  return {
    statistic,
    taroneStatistic,
    df,
    p: chiSquareUpperTail(statistic, df).p,
    tarone: chiSquareUpperTail(taroneStatistic, df),
    informativeStrata,
  };
}

/** Slack (relative to the table size) for accepting a quadratic root at the edge of its feasible range; a few ulps of rounding. */
const ROOT_RANGE_SLACK = 1e-9;

/** The root in the feasible range of (1 − ψ)A² + (n₂ − m₁ + ψ(n₁ + m₁))A − ψn₁m₁ = 0. */
function fittedTopLeft(rowFirst: number, rowSecond: number, columnFirst: number, psi: number): number {
  const lowest = Math.max(0, columnFirst - rowSecond);
  const highest = Math.min(rowFirst, columnFirst);
  const quadratic = 1 - psi;
  const linear = rowSecond - columnFirst + psi * (rowFirst + columnFirst);
  const constant = -psi * rowFirst * columnFirst;
  let root: number;
  if (quadratic === 0) {
    root = -constant / linear;
  } else {
    // Numerical Recipes §5.6: q = −½(b + sign(b)√disc) avoids cancellation; the roots are q/a and c/q.
    const discriminant = Math.max(linear * linear - 4 * quadratic * constant, 0);
    const q = -0.5 * (linear + Math.sign(linear || 1) * Math.sqrt(discriminant));
    const candidates = [q / quadratic, q === 0 ? lowest : constant / q];
    const inside = candidates.find((x) => x >= lowest - ROOT_RANGE_SLACK * (1 + highest) && x <= highest + ROOT_RANGE_SLACK * (1 + highest));
    root = inside ?? candidates[0];
  }
  return Math.min(Math.max(root, lowest), highest);
}
