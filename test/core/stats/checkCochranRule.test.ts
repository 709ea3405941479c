import assert from 'node:assert/strict';
import { checkCochranRule } from '../../../src/core/stats/checkCochranRule';

describe('checkCochranRule', () => {
  // Cochran (1954), Biometrics 10, 417–451: no expected count below 1, at most 20% below 5.
  it('passes when exactly 20% of cells are below 5 and none below 1', () => {
    const check = checkCochranRule([[4, 6, 7, 8, 9]]);
    assert.equal(check.ok, true);
    assert.equal(check.shareBelow5, 0.2);
    assert.deepEqual(check.sparseCells, [{ row: 0, column: 0, expected: 4 }]);
  });

  it('fails when more than 20% are below 5', () => {
    const check = checkCochranRule([[4, 6], [10, 12]]);
    assert.equal(check.ok, false);
    assert.equal(check.cellsBelow5, 1);
    assert.equal(check.cellCount, 4);
  });

  it('fails on any expected count below 1 even when few are below 5', () => {
    const check = checkCochranRule([[0.9, 10, 10, 10, 10, 10, 10, 10, 10, 10]]);
    assert.equal(check.ok, false);
    assert.equal(check.cellsBelow1, 1);
    assert.equal(check.minExpected, 0.9);
  });

  it('does not call an expected count of 5 that is off by rounding sparse', () => {
    const check = checkCochranRule([[5 - 1e-14, 5, 20]]);
    assert.equal(check.cellsBelow5, 0);
  });

  it('lists sparse cells row by row with their positions', () => {
    const check = checkCochranRule([[10, 2], [3, 10]]);
    assert.deepEqual(check.sparseCells.map((cell) => [cell.row, cell.column]), [[0, 1], [1, 0]]);
  });
});
