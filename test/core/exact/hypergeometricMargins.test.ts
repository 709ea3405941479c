import assert from 'node:assert/strict';
import fc from 'fast-check';
import { hypergeometricMargins } from '../../../src/core/exact/hypergeometricMargins';
import { binomial } from './fisherExactRational';

describe('hypergeometricMargins', () => {
  it('gives the support and totals of [[a, b], [c, d]]', () => {
    assert.deepEqual(hypergeometricMargins([[3, 1], [1, 3]]), {
      rowTotal: 4,
      otherRowTotal: 4,
      columnTotal: 4,
      total: 8,
      lowest: 0,
      highest: 4,
      mode: 2,
    });
    const skewed = hypergeometricMargins([[1, 2], [9, 0]]);
    assert.deepEqual([skewed.lowest, skewed.highest], [1, 3]);
  });

  it('finds a most probable value, checked against exact binomial weights', () => {
    const cell = fc.integer({ min: 0, max: 60 });
    fc.assert(
      fc.property(fc.tuple(cell, cell, cell, cell), ([a, b, c, d]) => {
        const margins = hypergeometricMargins([[a, b], [c, d]]);
        const { rowTotal: m, otherRowTotal: n, columnTotal: k } = margins;
        const weight = (x: number) => binomial(m, x) * binomial(n, k - x);
        for (let x = margins.lowest; x <= margins.highest; x++) assert.ok(weight(x) <= weight(margins.mode), `${x} vs mode ${margins.mode}`);
      }),
      { seed: 20250611, numRuns: 300 },
    );
  });

  it('finds the mode for N beyond 10^8, where the textbook formula rounds', () => {
    const margins = hypergeometricMargins([[60000001, 39999999], [40000000, 60000000]]);
    const ratio = (x: number) => ((margins.rowTotal - x) * (margins.columnTotal - x)) / ((x + 1) * (margins.otherRowTotal - margins.columnTotal + x + 1));
    assert.ok(ratio(margins.mode) <= 1 && ratio(margins.mode - 1) >= 1);
  });

  it('throws a RangeError for cells that are not non-negative safe integers, or a shape that is not 2×2', () => {
    for (const bad of [-1, 0.5, Number.NaN, -Infinity]) assert.throws(() => hypergeometricMargins([[1, 2], [bad, 4]]), RangeError);
    assert.throws(() => hypergeometricMargins([[2 ** 52, 2 ** 52], [2 ** 52, 2 ** 52]]), RangeError);
    assert.throws(() => hypergeometricMargins([[1, 2, 3], [4, 5, 6]]), RangeError);
  });
});
