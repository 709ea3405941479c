import assert from 'node:assert/strict';
import { noncentralChiSquareMixture, type Tail } from '../../../src/core/special/noncentralChiSquareMixture';
import { assertClose } from '../../helpers/assertClose';
import { readMpmathFixture } from './mpmathFixture';

const farTails = readMpmathFixture<{ x: number; df: number; lambda: number; tail: Tail }, string>('noncentralChiSquareFarTails');

describe('noncentralChiSquareMixture', () => {
  it('keeps the log of tails far from the Poisson mode, where every term underflows, to 1e-12 (mpmath)', () => {
    for (const c of farTails.cases) {
      const { x, df, lambda, tail } = c.input;
      assertClose(noncentralChiSquareMixture(x, df, lambda, tail).log, Number(c.expected), c.tolerance, c.input);
    }
    assert.ok(farTails.cases.length >= 10);
  });

  it('returns the value as the exponential of the log', () => {
    for (const tail of ['lower', 'upper'] as const) {
      const { value, log } = noncentralChiSquareMixture(12, 3, 9, tail);
      assert.equal(value, Math.exp(log));
    }
  });
});
