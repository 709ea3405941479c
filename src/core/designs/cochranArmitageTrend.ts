import { chiSquareUpperTail } from '../special/chiSquareUpperTail';
import type { TailProbability } from '../types';

export interface TrendResult {
  /** Scores used, one per column. */
  scores: number[];
  n: number;
  /** Cochran–Armitage Z with the binomial variance (divisor N); positive when row 1 rises with the score. */
  z: number;
  /** Two-sided p of z: P(|Z| ≥ |z|) = P(χ²₁ ≥ z²). */
  p: TailProbability;
  /** Z with the conditional (hypergeometric) variance: z·√((N − 1)/N); its square is M² of `linearByLinear`. */
  zConditional: number;
  /** Two-sided p of zConditional. */
  pConditional: TailProbability;
}

/**
 * Cochran–Armitage test for a trend in the proportion of row 1 across k ordered columns
 * (Cochran 1954, Biometrics 10, 417–451; Armitage 1955, Biometrics 11, 375–386; Agresti 2013,
 * Categorical Data Analysis 3rd ed., §5.3.5).
 *
 * Intuition: fit a straight line to the column proportions against the scores and ask whether its
 * slope is further from zero than chance allows.
 *
 * ## Method
 * With p̄ = n₁₊/N and x̄ = Σ n₊ⱼxⱼ/N, T = Σ n₁ⱼ(xⱼ − x̄) and Z = T/√(p̄(1 − p̄) Σ n₊ⱼ(xⱼ − x̄)²).
 * This is Armitage's binomial variance (divisor N); Z² = N r², r the Pearson correlation of the
 * row indicator and the scores. Agresti's M² = (N − 1) r² uses the conditional variance (divisor
 * N − 1) and is returned as zConditional. Both p-values are two-sided.
 *
 * @param table - 2×k counts (k ≥ 2), non-negative whole numbers; both rows non-empty
 * @param scores - one finite score per column, not all equal over non-empty columns; default 0, 1, …, k − 1
 * @returns Z, its conditional version and two-sided p-values
 * @example cochranArmitageTrend([[2, 5, 9], [18, 15, 11]]).z // ≈ 2.503 (p ≈ 0.0123)
 */
export function cochranArmitageTrend(table: readonly (readonly number[])[], scores?: readonly number[]): TrendResult {
  if (table.length !== 2) throw new RangeError(`cochranArmitageTrend: needs 2 rows (got ${table.length})`);
  const columns = table[0].length;
  if (columns < 2 || table[1].length !== columns) throw new RangeError('cochranArmitageTrend: needs two rows of equal length ≥ 2');
  for (const count of [...table[0], ...table[1]]) {
    if (!Number.isInteger(count) || count < 0) throw new RangeError(`cochranArmitageTrend: counts must be non-negative whole numbers (got ${count})`);
  }
  const used = scores ? [...scores] : Array.from({ length: columns }, (_, index) => index);
  if (used.length !== columns || used.some((score) => !Number.isFinite(score))) throw new RangeError('cochranArmitageTrend: needs one finite score per column');

  const columnTotals = table[0].map((count, column) => count + table[1][column]);
  const n = columnTotals.reduce((sum, total) => sum + total, 0);
  const firstRowTotal = table[0].reduce((sum, count) => sum + count, 0);
  const meanScore = columnTotals.reduce((sum, total, column) => sum + total * used[column], 0) / n;
  const trend = table[0].reduce((sum, count, column) => sum + count * (used[column] - meanScore), 0);
  const spread = columnTotals.reduce((sum, total, column) => sum + total * (used[column] - meanScore) ** 2, 0);
  const share = firstRowTotal / n;
  const variance = share * (1 - share) * spread;
  if (!(variance > 0)) throw new RangeError('cochranArmitageTrend: a row is empty or the scores do not vary over the non-empty columns');

  const z = trend / Math.sqrt(variance);
  const zConditional = z * Math.sqrt((n - 1) / n);
  return { scores: used, n, z, p: chiSquareUpperTail(z * z, 1), zConditional, pConditional: chiSquareUpperTail(zConditional * zConditional, 1) };
}
