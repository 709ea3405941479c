import { freemanHaltonExact } from '../exact/network/freemanHaltonExact';
import type { Budget } from '../exact/types';
import { testIndependence } from '../stats/testIndependence';
import type { TailProbability } from '../types';
import { adjustPValues, type AdjustmentMethod } from './adjustPValues';

export interface PairComparison {
  /** 0-based row indices, first < second. */
  first: number;
  second: number;
  firstLabel: string;
  secondLabel: string;
  /** Pearson X² of the 2×c sub-table (columns empty in both rows left out). */
  statistic: number;
  /** (c' − 1) with c' the columns kept; 0 when fewer than 2 columns or a row is empty (then p = 1). */
  df: number;
  p: TailProbability;
  /** Where p comes from: Pearson's chi-square, or the exact test when the sub-table fails Cochran's rule and `exactWhenSparse` is set. */
  pMethod: 'pearson' | 'exact';
  adjustedP: number;
  /** adjustedP ≤ alpha. */
  differs: boolean;
  /** Columns left out because both rows have 0 there. */
  droppedColumns: number;
}

export interface PairwiseOptions {
  /**
   * Use the Freeman–Halton exact p (Fisher's for 2×2) for a pair whose sub-table fails Cochran's
   * rule; a search that exceeds its budget keeps the chi-square p (then `pMethod` stays 'pearson').
   */
  exactWhenSparse?: boolean;
  /** Budget for each exact search (default 1 s, 64 MB). */
  budget?: Partial<Budget>;
}

/** Per-pair exact searches are follow-ups: they get a small share of the time an overall test gets. */
const PAIR_BUDGET: Partial<Budget> = { timeMs: 1000, memoryBytes: 64 * 1024 * 1024 };

export interface PairwiseResult {
  method: AdjustmentMethod;
  alpha: number;
  comparisons: PairComparison[];
  /** The pairs with adjustedP ≤ alpha, in row order. */
  differing: { first: number; second: number; firstLabel: string; secondLabel: string }[];
}

/**
 * Every pair of rows of an r×c table compared by Pearson's chi-square on its 2×c sub-table, with
 * p-values adjusted for the r(r − 1)/2 comparisons (Holm 1979; Agresti 2013, Categorical Data
 * Analysis 3rd ed., §3.3 on partitioning and follow-up comparisons; common practice).
 *
 * Intuition: after an overall test says the rows differ, ask which rows differ from which, paying
 * for the number of questions asked.
 *
 * ## Method
 * For rows i < j, the sub-table [row i, row j] loses columns that are 0 in both; X² and its p come
 * from `testIndependence` (uncorrected Pearson). A pair with an empty row or fewer than 2 columns
 * left carries no information: X² = 0, df = 0, p = 1. p-values are adjusted by `adjustPValues`.
 *
 * @param observed - r×c counts (r ≥ 2, c ≥ 2), non-negative whole numbers
 * @param labels - one label per row
 * @param method - 'holm' or 'bonferroni'
 * @param alpha - family-wise level in (0, 1) for `differs`
 * @param options - exact p-values for sparse pairs
 * @returns one comparison per pair, in order (0,1), (0,2), …, (1,2), …
 */
export function pairwiseComparisons(observed: readonly (readonly number[])[], labels: readonly string[], method: AdjustmentMethod, alpha = 0.05, options: PairwiseOptions = {}): PairwiseResult {
  const rows = observed.length;
  const columns = rows > 0 ? observed[0].length : 0;
  if (rows < 2 || columns < 2 || observed.some((row) => row.length !== columns)) throw new RangeError('pairwiseComparisons: needs a rectangular table of at least 2×2');
  if (labels.length !== rows) throw new RangeError(`pairwiseComparisons: needs one label per row (got ${labels.length} for ${rows})`);
  if (!(alpha > 0 && alpha < 1)) throw new RangeError(`pairwiseComparisons: alpha must be in (0, 1) (got ${alpha})`);
  for (const row of observed) {
    for (const count of row) {
      if (!Number.isInteger(count) || count < 0) throw new RangeError(`pairwiseComparisons: counts must be non-negative whole numbers (got ${count})`);
    }
  }

  const tests: Omit<PairComparison, 'adjustedP' | 'differs'>[] = [];
  for (let first = 0; first < rows; first++) {
    for (let second = first + 1; second < rows; second++) {
      const kept = observed[first].map((_, column) => column).filter((column) => observed[first][column] + observed[second][column] > 0);
      const subTable = [kept.map((column) => observed[first][column]), kept.map((column) => observed[second][column])];
      const informative = kept.length >= 2 && subTable.every((row) => row.some((count) => count > 0));
      const test = informative ? testIndependence(subTable) : undefined;
      const pearson = test ? test.pearson : { statistic: 0, p: 1, log10p: 0 };
      const exact = test && options.exactWhenSparse && !test.validity.ok ? freemanHaltonExact(subTable, { ...PAIR_BUDGET, ...options.budget }) : undefined;
      const p = exact?.ok ? { p: exact.value.p, log10p: exact.value.log10p } : { p: pearson.p, log10p: pearson.log10p };
      tests.push({
        first,
        second,
        firstLabel: labels[first],
        secondLabel: labels[second],
        statistic: pearson.statistic,
        df: informative ? kept.length - 1 : 0,
        p,
        pMethod: exact?.ok ? 'exact' : 'pearson',
        droppedColumns: columns - kept.length,
      });
    }
  }
  const adjusted = adjustPValues(
    tests.map((test) => test.p.p),
    method,
  );
  const comparisons = tests.map((test, index) => ({ ...test, adjustedP: adjusted[index], differs: adjusted[index] <= alpha }));
  return {
    method,
    alpha,
    comparisons,
    differing: comparisons.filter((entry) => entry.differs).map(({ first, second, firstLabel, secondLabel }) => ({ first, second, firstLabel, secondLabel })),
  };
}
