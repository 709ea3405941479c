import assert from 'node:assert/strict';
import { findRootBracketed } from '../../../src/core/stats/findRootBracketed';
import { assertClose } from '../../helpers/assertClose';

describe('findRootBracketed', () => {
  it('finds √2 as the root of x² − 2', () => {
    assertClose(findRootBracketed((x) => x * x - 2, 0, 2, 1e-15), Math.SQRT2, 1e-14);
  });

  it('finds the fixed point of cos, 0.7390851332151607 (the Dottie number, from memory)', () => {
    assertClose(findRootBracketed((x) => Math.cos(x) - x, 0, 1, 1e-15), 0.7390851332151607, 1e-14);
  });

  it('handles a decreasing function and a root at an end', () => {
    assertClose(findRootBracketed((x) => Math.exp(-x) - 0.5, 0, 5, 1e-14), Math.LN2, 1e-13);
    assert.equal(findRootBracketed((x) => x - 3, 3, 7, 1e-12), 3);
  });

  it('throws when the ends do not bracket a sign change', () => {
    assert.throws(() => findRootBracketed((x) => x * x + 1, -1, 1, 1e-12), /do not bracket/);
    assert.throws(() => findRootBracketed(() => NaN, -1, 1, 1e-12), /do not bracket/);
  });
});
