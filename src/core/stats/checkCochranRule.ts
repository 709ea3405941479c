import type { ValidityCheck } from '../types';

/** Cochran's thresholds: no expected count below 1, at most a fifth of them below 5. */
const SMALL_EXPECTED = 5;
const TINY_EXPECTED = 1;
const MAX_SHARE_BELOW_SMALL = 0.2;
/**
 * Expected counts computed from proportions (e.g. 556 · 9/16) can land a rounding error below a
 * threshold they meet exactly; this relative slack (far above double rounding, far below any count
 * that matters) keeps such a cell from being called sparse.
 */
const THRESHOLD_RELATIVE_SLACK = 1e-12;

/**
 * Cochran's (1954) rule for the chi-square approximation (Cochran, "Some methods for strengthening
 * the common χ² tests", Biometrics 10, 417–451): no expected count below 1 and at most 20% below 5.
 *
 * Intuition: the chi-square distribution describes X² well only when few cells have so few expected
 * counts that their discreteness shows.
 *
 * @param expected - expected counts, one array per row (a goodness-of-fit test passes one row or one column)
 * @returns the rule's verdict with the sparse cells listed row by row
 * @example checkCochranRule([[4, 6], [10, 12]]).ok // false: 1 of 4 cells (25%) below 5
 */
export function checkCochranRule(expected: number[][]): ValidityCheck {
  const sparseCells: ValidityCheck['sparseCells'] = [];
  let cellsBelow1 = 0;
  let cellCount = 0;
  let minExpected = Infinity;
  expected.forEach((values, row) => {
    values.forEach((value, column) => {
      cellCount++;
      minExpected = Math.min(minExpected, value);
      if (value < SMALL_EXPECTED * (1 - THRESHOLD_RELATIVE_SLACK)) sparseCells.push({ row, column, expected: value });
      if (value < TINY_EXPECTED * (1 - THRESHOLD_RELATIVE_SLACK)) cellsBelow1++;
    });
  });
  if (cellCount === 0) throw new RangeError('checkCochranRule: no expected counts given');
  const shareBelow5 = sparseCells.length / cellCount;
  return {
    rule: 'cochran-1954',
    minExpected,
    shareBelow5,
    cellsBelow5: sparseCells.length,
    cellsBelow1,
    cellCount,
    ok: cellsBelow1 === 0 && shareBelow5 <= MAX_SHARE_BELOW_SMALL,
    sparseCells,
  };
}
