import assert from 'node:assert/strict';
import { bergsmaCorrectedV } from '../../../src/core/stats/bergsmaCorrectedV';
import { assertClose } from '../../helpers/assertClose';

describe('bergsmaCorrectedV', () => {
  it('follows Bergsma (2013) eqs. for a 2×3 table worked by hand', () => {
    // Bergsma (2013), J. Korean Statistical Society 42, 323–328: φ̃² = max(0, φ² − (r−1)(c−1)/(N−1)),
    // r̃ = r − (r−1)²/(N−1), c̃ = c − (c−1)²/(N−1), Ṽ = √(φ̃²/min(r̃−1, c̃−1)).
    // X² = 30.07, N = 2757: φ² = 0.0109068, minus 2/2756 = 0.0101811; r̃ − 1 = 0.9996372; Ṽ = 0.100919 (hand).
    assertClose(bergsmaCorrectedV(30.07, 2757, 2, 3), 0.100919, { absolute: 2e-6 });
  });

  it('is 0 when X² does not exceed its expectation under independence', () => {
    assert.equal(bergsmaCorrectedV(0.5, 100, 2, 2), 0);
    assert.equal(bergsmaCorrectedV(0, 50, 3, 4), 0);
  });

  it('is 1 for a perfectly associated square table', () => {
    // A 3×3 diagonal table with 10 per diagonal cell has X² = N(k − 1) = 60.
    assertClose(bergsmaCorrectedV(60, 30, 3, 3), 1, 1e-12);
  });

  it('is 0 rather than dividing by nothing when N equals the number of rows', () => {
    assert.equal(bergsmaCorrectedV(2, 2, 2, 2), 0);
  });
});
