import assert from 'node:assert/strict';
import { tableMargins } from '../../../src/core/stats/tableMargins';

describe('tableMargins', () => {
  it('gives row total × column total / N (common practice)', () => {
    assert.deepEqual(tableMargins([[10, 20], [30, 40]]), { n: 100, rowTotals: [30, 70], columnTotals: [40, 60], expected: [[12, 18], [28, 42]] });
  });

  it('throws on programmer errors: empty, ragged, negative, non-finite, zero margins', () => {
    assert.throws(() => tableMargins([]), /empty/);
    assert.throws(() => tableMargins([[1, 2, 3], [4, 5]]), /row 2 has 2 cells/);
    assert.throws(() => tableMargins([[1, -2], [4, 5]]), /finite and non-negative/);
    assert.throws(() => tableMargins([[1, NaN], [4, 5]]), /finite and non-negative/);
    assert.throws(() => tableMargins([[1, 0], [4, 0]]), /column 2 totals zero/);
  });
});
