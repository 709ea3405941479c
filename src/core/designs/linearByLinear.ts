import { chiSquareUpperTail } from '../special/chiSquareUpperTail';
import type { TailProbability } from '../types';

export interface LinearByLinearResult {
  n: number;
  rowScores: number[];
  columnScores: number[];
  /** Pearson correlation of the row and column scores over the N observations. */
  correlation: number;
  /** M² = (N − 1) r². */
  statistic: number;
  df: 1;
  p: TailProbability;
}

/**
 * Linear-by-linear association test for an r×c table with ordered rows and columns
 * (Mantel 1963, JASA 58, 690–700; Agresti 2013, Categorical Data Analysis 3rd ed., §3.4.1).
 *
 * Intuition: give each row and column a score, correlate them over all N observations, and ask
 * whether that correlation is further from zero than chance allows.
 *
 * ## Method
 * ū = Σ uᵢnᵢ₊/N, v̄ = Σ vⱼn₊ⱼ/N; r = Σ (uᵢ − ū)(vⱼ − v̄)nᵢⱼ / √(Σ (uᵢ − ū)²nᵢ₊ · Σ (vⱼ − v̄)²n₊ⱼ);
 * M² = (N − 1) r², upper chi-square tail with df 1. For a 2×k table M² is the Cochran–Armitage
 * Z² with the conditional variance.
 *
 * @param table - r×c counts (r, c ≥ 2), non-negative whole numbers
 * @param rowScores - one finite score per row; default 0, 1, …, r − 1
 * @param columnScores - one finite score per column; default 0, 1, …, c − 1
 * @returns r, M² and its p
 */
export function linearByLinear(table: readonly (readonly number[])[], rowScores?: readonly number[], columnScores?: readonly number[]): LinearByLinearResult {
  const rows = table.length;
  const columns = rows > 0 ? table[0].length : 0;
  if (rows < 2 || columns < 2 || table.some((row) => row.length !== columns)) throw new RangeError('linearByLinear: needs a rectangular table of at least 2×2');
  for (const row of table) {
    for (const count of row) {
      if (!Number.isInteger(count) || count < 0) throw new RangeError(`linearByLinear: counts must be non-negative whole numbers (got ${count})`);
    }
  }
  const u = rowScores ? [...rowScores] : Array.from({ length: rows }, (_, index) => index);
  const v = columnScores ? [...columnScores] : Array.from({ length: columns }, (_, index) => index);
  if (u.length !== rows || v.length !== columns || [...u, ...v].some((score) => !Number.isFinite(score))) {
    throw new RangeError('linearByLinear: needs one finite score per row and per column');
  }

  const rowTotals = table.map((row) => row.reduce((sum, count) => sum + count, 0));
  const columnTotals = table[0].map((_, column) => table.reduce((sum, row) => sum + row[column], 0));
  const n = rowTotals.reduce((sum, total) => sum + total, 0);
  const meanU = rowTotals.reduce((sum, total, row) => sum + total * u[row], 0) / n;
  const meanV = columnTotals.reduce((sum, total, column) => sum + total * v[column], 0) / n;
  let covariance = 0;
  for (let row = 0; row < rows; row++) {
    for (let column = 0; column < columns; column++) covariance += (u[row] - meanU) * (v[column] - meanV) * table[row][column];
  }
  const spreadU = rowTotals.reduce((sum, total, row) => sum + total * (u[row] - meanU) ** 2, 0);
  const spreadV = columnTotals.reduce((sum, total, column) => sum + total * (v[column] - meanV) ** 2, 0);
  if (!(spreadU > 0 && spreadV > 0)) throw new RangeError('linearByLinear: the row or column scores do not vary over the non-empty rows or columns');

  const correlation = Math.max(-1, Math.min(1, covariance / Math.sqrt(spreadU * spreadV)));
  const statistic = (n - 1) * correlation * correlation;
  return { n, rowScores: u, columnScores: v, correlation, statistic, df: 1, p: chiSquareUpperTail(statistic, 1) };
}
