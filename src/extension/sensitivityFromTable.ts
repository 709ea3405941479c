import { smallestDetectableDifference } from '../core/plan/smallestDetectableDifference';
import { smallestDetectableEffect } from '../core/plan/smallestDetectableEffect';
import type { SensitivityResult } from '../core/plan/types';
import type { Result } from '../core/types';
import type { TableForPlan } from './planFromTable';

/**
 * What the study behind a table of counts could detect: the smallest w its total detects with the
 * target power on the table's own test (independence: (r − 1)(c − 1) df; a single row or column:
 * goodness of fit, k − 1 df), and for a 2×2 table the nearest second-row proportions of the first
 * column that it detects, with the first row's observed proportion as the baseline. A sensitivity
 * analysis in place of "observed power", which only restates the p-value.
 *
 * @param table - the table as read for planning (its counts and labels)
 * @param alpha - significance level
 * @param power - target power
 * @returns the sensitivity, or the engine's input problem (e.g. too few observations for the df)
 */
export function sensitivityFromTable(table: Pick<TableForPlan, 'observed'>, alpha: number, power: number): Result<SensitivityResult> {
  const { observed } = table;
  const rowTotals = observed.map((row) => row.reduce((sum, count) => sum + count, 0));
  const n = rowTotals.reduce((sum, total) => sum + total, 0);
  const rows = observed.length;
  const columns = observed[0].length;
  const df = rows === 1 || columns === 1 ? rows * columns - 1 : (rows - 1) * (columns - 1);
  if (rows === 2 && columns === 2) {
    const baseline = observed[0][0] / rowTotals[0];
    // A first row with no observations in one column has no proportion strictly inside (0, 1) to move from.
    if (baseline > 0 && baseline < 1) return smallestDetectableDifference(rowTotals[0], rowTotals[1], baseline, alpha, power);
  }
  return smallestDetectableEffect(n, df, alpha, power);
}
