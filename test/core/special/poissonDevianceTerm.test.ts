import assert from 'node:assert/strict';
import { poissonDevianceTerm } from '../../../src/core/special/poissonDevianceTerm';
import { assertClose } from '../../helpers/assertClose';
import { readMpmathFixture, relativeError } from './mpmathFixture';

const fixture = readMpmathFixture<{ k: number; mean: number }, string>('poissonDevianceTerm');

describe('poissonDevianceTerm', () => {
  it('matches mpmath to a few units in the last place, near the mean and far from it', () => {
    let worst = 0;
    for (const c of fixture.cases) {
      const actual = poissonDevianceTerm(c.input.k, c.input.mean);
      const expected = Number(c.expected);
      if (expected === 0) {
        assert.equal(actual, 0, c.name);
        continue;
      }
      assertClose(actual, expected, c.tolerance, c.input);
      worst = Math.max(worst, relativeError(actual, expected));
    }
    assert.ok(worst < 1e-15, `largest relative error ${worst}`);
  });

  it('stays finite when k / mean overflows (subnormal mean)', () => {
    const k = 0.5;
    const mean = 5e-321;
    assertClose(poissonDevianceTerm(k, mean), k * (Math.log(k) - Math.log(mean)) - (k - mean), 1e-15, { k, mean });
  });

  it('is mean at k = 0 and NaN for invalid input', () => {
    assert.equal(poissonDevianceTerm(0, 3.5), 3.5);
    for (const [k, mean] of [[-1, 1], [1, 0], [1, -1], [NaN, 1], [1, NaN], [Infinity, 1]]) {
      assert.ok(Number.isNaN(poissonDevianceTerm(k, mean)), `k=${k}, mean=${mean}`);
    }
  });
});
