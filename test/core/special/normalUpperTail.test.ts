import assert from 'node:assert/strict';
import { jStat } from 'jstat';
import { normalUpperTail } from '../../../src/core/special/normalUpperTail';
import { assertClose } from '../../helpers/assertClose';
import { readMpmathFixture, relativeError } from './mpmathFixture';

const fixture = readMpmathFixture<{ z: number }, string>('normalUpperTail');

describe('normalUpperTail', () => {
  it('matches mpmath erfc to 1e-13 relative, out to z = 37.5 (p ≈ 5e-309)', () => {
    let worst = 0;
    for (const c of fixture.cases) {
      const actual = normalUpperTail(c.input.z);
      assertClose(actual, Number(c.expected), c.tolerance, c.input);
      worst = Math.max(worst, relativeError(actual, Number(c.expected)));
    }
    assert.ok(worst < 1e-13, `largest relative error ${worst}`);
  });

  it('agrees with jstat (run live) to 1e-12 absolute in the body of the distribution', () => {
    for (let z = -6; z <= 6; z += 0.25) assertClose(normalUpperTail(z), 1 - jStat.normal.cdf(z, 0, 1), { absolute: 1e-12 }, { z });
  });

  it('is symmetric, ½ at 0 and NaN for NaN', () => {
    for (const z of [0.3, 1.7, 4]) assertClose(normalUpperTail(z) + normalUpperTail(-z), 1, 1e-15, { z });
    assert.equal(normalUpperTail(0), 0.5);
    assert.ok(Number.isNaN(normalUpperTail(NaN)));
  });
});
