import assert from 'node:assert/strict';
import { chiSquareCriticalValue } from '../../../src/core/special/chiSquareCriticalValue';
import { chiSquareUpperTail } from '../../../src/core/special/chiSquareUpperTail';
import { noncentralChiSquareUpperTail } from '../../../src/core/special/noncentralChiSquareUpperTail';
import { assertClose } from '../../helpers/assertClose';
import { readMpmathFixture, relativeError } from './mpmathFixture';

/** Values near 1 come from exp(log) and carry about 1e-14 of rounding. */
const ROUNDING = 1e-14;
const fixture = readMpmathFixture<{ x: number; df: number; lambda: number }, { cdf: string; upper: string }>('noncentralChiSquare');

describe('noncentralChiSquareUpperTail', () => {
  it('matches the 50-digit mpmath Poisson mixture to 1e-12 relative, small tails included', () => {
    let worst = 0;
    let smallTails = 0;
    for (const c of fixture.cases) {
      const { x, df, lambda } = c.input;
      const expected = Number(c.expected.upper);
      const actual = noncentralChiSquareUpperTail(x, df, lambda);
      assertClose(actual, expected, c.tolerance, c.input);
      worst = Math.max(worst, relativeError(actual, expected));
      if (expected < 1e-10) smallTails++;
    }
    assert.ok(smallTails > 100, `only ${smallTails} upper tails below 1e-10`);
    assert.ok(worst < 1e-12, `largest relative error ${worst}`);
  });

  it('equals the central upper tail at λ = 0, bit for bit', () => {
    for (const df of [1, 2, 5, 17, 300, 40000]) {
      for (const x of [0.01, 1, 3, 10, 40, 250, 400, 41000]) {
        assert.equal(noncentralChiSquareUpperTail(x, df, 0), chiSquareUpperTail(x, df).p);
      }
    }
  });

  it('is the power of the test: alpha at λ = 0, rising with λ toward 1', () => {
    for (const df of [1, 4, 12]) {
      const critical = chiSquareCriticalValue(0.05, df);
      assertClose(noncentralChiSquareUpperTail(critical, df, 0), 0.05, 1e-12, { df });
      let previous = 0.05;
      for (let lambda = 0.5; lambda <= 200; lambda *= 1.5) {
        const power = noncentralChiSquareUpperTail(critical, df, lambda);
        assert.ok(power > previous || power > 1 - ROUNDING, `power fell at λ=${lambda}, df=${df}`);
        previous = power;
      }
      assert.ok(previous > 0.999999);
    }
  });

  it('gives 1 for x ≤ 0, 0 at x = Infinity, and NaN for invalid input', () => {
    assert.equal(noncentralChiSquareUpperTail(0, 3, 5), 1);
    assert.equal(noncentralChiSquareUpperTail(Infinity, 3, 5), 0);
    for (const [x, df, lambda] of [[NaN, 3, 1], [2, 0, 1], [2, 3, -1], [2, 3, NaN]]) {
      assert.ok(Number.isNaN(noncentralChiSquareUpperTail(x, df, lambda)), `x=${x}, df=${df}, λ=${lambda}`);
    }
  });
});
