import assert from 'node:assert/strict';
import { chiSquareUpperTail } from '../../../src/core/special/chiSquareUpperTail';
import { noncentralChiSquareCdf } from '../../../src/core/special/noncentralChiSquareCdf';
import { noncentralChiSquareUpperTail } from '../../../src/core/special/noncentralChiSquareUpperTail';
import { regularizedIncompleteGamma } from '../../../src/core/special/regularizedIncompleteGamma';
import { assertClose } from '../../helpers/assertClose';
import { readMpmathFixture, relativeError } from './mpmathFixture';

/** Values near 1 come from exp(log) and carry about 1e-14 of rounding; monotonicity is checked up to that. */
const ROUNDING = 1e-14;
const fixture = readMpmathFixture<{ x: number; df: number; lambda: number }, { cdf: string; upper: string }>('noncentralChiSquare');

describe('noncentralChiSquareCdf', () => {
  it('matches the 50-digit mpmath Poisson mixture to 1e-12 relative (df 1…100, λ 0…100,000)', () => {
    let worst = 0;
    for (const c of fixture.cases) {
      const { x, df, lambda } = c.input;
      const actual = noncentralChiSquareCdf(x, df, lambda);
      assertClose(actual, Number(c.expected.cdf), c.tolerance, c.input);
      worst = Math.max(worst, relativeError(actual, Number(c.expected.cdf)));
    }
    assert.ok(fixture.cases.length > 1000);
    assert.ok(worst < 1e-12, `largest relative error ${worst}`);
  });

  it('equals the central distribution function at λ = 0', () => {
    for (const df of [1, 2, 5, 17, 300]) {
      for (const x of [0.01, 0.5, 1, 3, 10, 40, 250, 400]) {
        assert.equal(noncentralChiSquareCdf(x, df, 0), regularizedIncompleteGamma(df / 2, x / 2).lower);
        assertClose(1 - noncentralChiSquareCdf(x, df, 0), chiSquareUpperTail(x, df).p, { absolute: 1e-15 }, { x, df });
      }
    }
  });

  it('adds up with the upper tail to 1', () => {
    for (const df of [1, 4, 30, 99]) {
      for (const lambda of [0.3, 7, 150, 4000, 60000]) {
        const mean = df + lambda;
        const spread = Math.sqrt(2 * (df + 2 * lambda));
        for (let k = -5; k <= 8; k++) {
          const x = mean + k * spread;
          if (x <= 0) continue;
          assertClose(noncentralChiSquareCdf(x, df, lambda) + noncentralChiSquareUpperTail(x, df, lambda), 1, 1e-13, { x, df, lambda });
        }
      }
    }
  });

  it('rises with x and falls as λ grows (up to rounding, 1e-14 relative, where it is near 1)', () => {
    for (const [df, lambda] of [[1, 2], [3, 40], [20, 900], [50, 20000]]) {
      let previous = 0;
      for (let step = 1; step <= 300; step++) {
        const x = (step / 100) * (df + lambda);
        const current = noncentralChiSquareCdf(x, df, lambda);
        assert.ok(current >= previous * (1 - ROUNDING), `cdf fell at x=${x}, df=${df}, λ=${lambda}`);
        previous = current;
      }
    }
    for (const [x, df] of [[3, 1], [25, 6], [700, 40]]) {
      let previous = 1;
      for (let lambda = 0; lambda <= 5 * x; lambda += x / 20) {
        const current = noncentralChiSquareCdf(x, df, lambda);
        assert.ok(current <= previous * (1 + ROUNDING), `cdf rose at λ=${lambda}, x=${x}, df=${df}`);
        previous = current;
      }
    }
  });

  it('gives 0 for x ≤ 0, 1 at x = Infinity, and NaN for invalid input', () => {
    assert.equal(noncentralChiSquareCdf(0, 3, 5), 0);
    assert.equal(noncentralChiSquareCdf(-1, 3, 5), 0);
    assert.equal(noncentralChiSquareCdf(Infinity, 3, 5), 1);
    for (const [x, df, lambda] of [[NaN, 3, 1], [2, 0, 1], [2, -1, 1], [2, 3, -1], [2, 3, NaN], [2, NaN, 1], [2, 3, Infinity]]) {
      assert.ok(Number.isNaN(noncentralChiSquareCdf(x, df, lambda)), `x=${x}, df=${df}, λ=${lambda}`);
    }
  });
});
