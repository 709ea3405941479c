import assert from 'node:assert/strict';
import { logGamma } from '../../../src/core/special/logGamma';
import { stirlingError } from '../../../src/core/special/stirlingError';
import { assertClose } from '../../helpers/assertClose';
import { readMpmathFixture } from './mpmathFixture';

const fixture = readMpmathFixture<{ a: number }, string, { relative: number; absolute: number }>('stirlingError');

describe('stirlingError', () => {
  it('matches mpmath to 1e-13 relative or 1e-14 absolute from a = 1e-8 to 1e10', () => {
    for (const c of fixture.cases) assertClose(stirlingError(c.input.a), Number(c.expected), c.tolerance, c.input);
  });

  it('is continuous where it switches to the asymptotic series (a = 10)', () => {
    const below = stirlingError(10 - 1e-9);
    const above = stirlingError(10);
    assertClose(below, above, 1e-9, { a: 10 });
  });

  it('agrees with @stdlib gammaln (run live) through its definition where that does not cancel badly', () => {
    for (const a of [12, 20, 55.5, 100]) {
      const definition = logGamma(a + 1) - (a + 0.5) * Math.log(a) + a - 0.5 * Math.log(2 * Math.PI);
      assertClose(stirlingError(a), definition, { absolute: 1e-13 }, { a });
    }
  });

  it('gives NaN for a ≤ 0 and 0 at Infinity', () => {
    assert.ok(Number.isNaN(stirlingError(0)));
    assert.ok(Number.isNaN(stirlingError(-2)));
    assert.equal(stirlingError(Infinity), 0);
  });
});
