import assert from 'node:assert/strict';
import fc from 'fast-check';
import { adjustPValues } from '../../../src/core/designs/adjustPValues';
import { assertClose } from '../../helpers/assertClose';

const PROPERTY_SEED = 20261202;

function assertAllClose(actual: number[], expected: number[]): void {
  assert.equal(actual.length, expected.length);
  actual.forEach((value, index) => assertClose(value, expected[index], 1e-12, { index }));
}

describe('adjustPValues', () => {
  // Holm (1979) step-down, computed by hand: sort, multiply the j-th smallest by m − j + 1, running maximum.
  it('gives Holm [0.03, 0.06, 0.06] for [0.01, 0.04, 0.03]', () => {
    // 0.01·3 = 0.03; 0.03·2 = 0.06; 0.04·1 = 0.04, raised to 0.06 by monotonicity.
    assertAllClose(adjustPValues([0.01, 0.04, 0.03], 'holm'), [0.03, 0.06, 0.06]);
  });

  it('gives Holm [0.4, 0.004, 0.5, 0.06] for [0.2, 0.001, 0.5, 0.02]', () => {
    // 0.001·4 = 0.004; 0.02·3 = 0.06; 0.2·2 = 0.4; 0.5·1 = 0.5.
    assertAllClose(adjustPValues([0.2, 0.001, 0.5, 0.02], 'holm'), [0.4, 0.004, 0.5, 0.06]);
  });

  it('caps at 1 and keeps monotonicity past the cap', () => {
    // 0.6·2 = 1.2 → 1; 0.7·1 = 0.7, raised to 1.
    assert.deepEqual(adjustPValues([0.6, 0.7], 'holm'), [1, 1]);
  });

  it('gives Bonferroni min(1, m·p)', () => {
    assertAllClose(adjustPValues([0.2, 0.001, 0.5, 0.02], 'bonferroni'), [0.8, 0.004, 1, 0.08]);
  });

  it('throws RangeError on a p outside [0, 1]', () => {
    assert.throws(() => adjustPValues([0.2, 1.5], 'holm'), RangeError);
    assert.throws(() => adjustPValues([NaN], 'bonferroni'), RangeError);
  });

  it('keeps raw ≤ Holm ≤ Bonferroni ≤ 1 and the order of the raw p-values', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 12 }), (ps) => {
        const holm = adjustPValues(ps, 'holm');
        const bonferroni = adjustPValues(ps, 'bonferroni');
        ps.forEach((p, i) => {
          assert.ok(p <= holm[i] && holm[i] <= bonferroni[i] && bonferroni[i] <= 1);
          ps.forEach((q, j) => {
            if (p < q) assert.ok(holm[i] <= holm[j]);
          });
        });
      }),
      { seed: PROPERTY_SEED, numRuns: 300 },
    );
  });
});
