import assert from 'node:assert/strict';
import fc from 'fast-check';
import { pairwiseComparisons } from '../../../src/core/designs/pairwiseComparisons';
import { assertClose } from '../../helpers/assertClose';
import { designCases } from './designFixture';

const PROPERTY_SEED = 20261202;

describe('pairwiseComparisons', () => {
  describe('against SciPy fixtures', () => {
    // test/fixtures/scipy/designs.json from generate_designs.py: scipy.stats.chi2_contingency(correction=False)
    // on each pair of rows; Holm and Bonferroni coded in the generator.
    for (const { name, input, expected, tolerance } of designCases('pairwise')) {
      it(`agrees with scipy 1.17.1 on ${name}`, () => {
        const table = input.table as number[][];
        const labels = table.map((_, index) => `row ${index + 1}`);
        const holm = pairwiseComparisons(table, labels, 'holm', input.alpha as number);
        const bonferroni = pairwiseComparisons(table, labels, 'bonferroni', input.alpha as number);
        const pairs = expected.pairs as [number, number][];
        assert.deepEqual(holm.comparisons.map((entry) => [entry.first, entry.second]), pairs);
        holm.comparisons.forEach((entry, index) => {
          const close = (actual: number, key: 'raw' | 'holm' | 'bonferroni'): void =>
            assertClose(actual, (expected[key] as number[])[index], { relative: tolerance, absolute: 1e-300 }, { table, pair: pairs[index] });
          close(entry.p.p, 'raw');
          close(entry.adjustedP, 'holm');
          close(bonferroni.comparisons[index].adjustedP, 'bonferroni');
          assert.equal(entry.differs, entry.adjustedP <= (input.alpha as number));
        });
        assert.deepEqual(
          holm.differing.map((entry) => [entry.first, entry.second]),
          holm.comparisons.filter((entry) => entry.differs).map((entry) => [entry.first, entry.second]),
        );
      });
    }
  });

  it('names the pairs that differ and drops columns empty in both rows', () => {
    // Invented greenhouse trays: seedlings that sprouted / wilted / did not come up.
    const trays = [
      [40, 10, 0],
      [38, 12, 0],
      [10, 40, 5],
    ];
    const result = pairwiseComparisons(trays, ['north', 'south', 'shade'], 'holm');
    assert.deepEqual(
      result.differing.map((entry) => `${entry.firstLabel}–${entry.secondLabel}`),
      ['north–shade', 'south–shade'],
    );
    assert.equal(result.comparisons[0].droppedColumns, 1);
    assert.equal(result.comparisons[0].df, 1);
  });

  it('gives p = 1 for a pair with an empty row', () => {
    const result = pairwiseComparisons([[5, 5], [0, 0], [2, 8]], ['a', 'b', 'c'], 'bonferroni');
    assert.equal(result.comparisons[0].p.p, 1);
    assert.equal(result.comparisons[0].df, 0);
  });

  it('throws RangeError on bad arguments', () => {
    assert.throws(() => pairwiseComparisons([[1, 2]], ['a'], 'holm'), RangeError);
    assert.throws(() => pairwiseComparisons([[1, 2], [3, 4]], ['a'], 'holm'), RangeError);
    assert.throws(() => pairwiseComparisons([[1, 2], [3, 4]], ['a', 'b'], 'holm', 0), RangeError);
  });

  it('keeps p and adjusted p in [0, 1] with adjusted ≥ raw', () => {
    const table = fc.array(fc.array(fc.integer({ min: 0, max: 30 }), { minLength: 3, maxLength: 3 }), { minLength: 2, maxLength: 5 });
    fc.assert(
      fc.property(table, (counts) => {
        const result = pairwiseComparisons(counts, counts.map((_, index) => String(index)), 'holm');
        assert.equal(result.comparisons.length, (counts.length * (counts.length - 1)) / 2);
        for (const entry of result.comparisons) assert.ok(entry.p.p >= 0 && entry.p.p <= entry.adjustedP && entry.adjustedP <= 1);
      }),
      { seed: PROPERTY_SEED, numRuns: 200 },
    );
  });
});
