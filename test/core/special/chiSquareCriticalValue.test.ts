import assert from 'node:assert/strict';
import { chiSquareCriticalValue } from '../../../src/core/special/chiSquareCriticalValue';
import { chiSquareUpperTail } from '../../../src/core/special/chiSquareUpperTail';
import { assertClose } from '../../helpers/assertClose';
import { readMpmathFixture, relativeError } from './mpmathFixture';

const fixture = readMpmathFixture<{ alpha: number; df: number }, string>('chiSquareCriticalValue');

/**
 * Upper critical values at alpha = .05, .01, .001 for df 1…10, to the three decimals printed in the
 * NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.4 "Critical Values of the Chi-Square
 * Distribution". From memory; the same values are checked to 1e-10 against mpmath by the fixture.
 */
const HANDBOOK_TABLE: [df: number, at05: number, at01: number, at001: number][] = [
  [1, 3.841, 6.635, 10.828],
  [2, 5.991, 9.21, 13.816],
  [3, 7.815, 11.345, 16.266],
  [4, 9.488, 13.277, 18.467],
  [5, 11.07, 15.086, 20.515],
  [6, 12.592, 16.812, 22.458],
  [7, 14.067, 18.475, 24.322],
  [8, 15.507, 20.09, 26.124],
  [9, 16.919, 21.666, 27.877],
  [10, 18.307, 23.209, 29.588],
];
/** The table rounds to three decimals. */
const TABLE_ROUNDING = 0.0005 + 1e-12;

describe('chiSquareCriticalValue', () => {
  it('matches 50-digit mpmath roots to 1e-10 relative for alpha 1e-12…0.5, df 1…100,000', () => {
    let worst = 0;
    for (const c of fixture.cases) {
      const actual = chiSquareCriticalValue(c.input.alpha, c.input.df);
      assertClose(actual, Number(c.expected), c.tolerance, c.input);
      worst = Math.max(worst, relativeError(actual, Number(c.expected)));
    }
    assert.ok(fixture.cases.length > 200);
    assert.ok(worst < 1e-10, `largest relative error ${worst}`);
  });

  it('reproduces the NIST/SEMATECH handbook table at .05, .01 and .001 for df 1 to 10', () => {
    for (const [df, ...values] of HANDBOOK_TABLE) {
      [0.05, 0.01, 0.001].forEach((alpha, column) => {
        assertClose(chiSquareCriticalValue(alpha, df), values[column], { absolute: TABLE_ROUNDING }, { alpha, df });
      });
    }
  });

  it('inverts the upper tail: P(X > c) = alpha', () => {
    for (const df of [1, 2.5, 7, 40, 900, 20000]) {
      for (const alpha of [0.9, 0.5, 0.05, 1e-4, 1e-9, 1e-30, 1e-200]) {
        const c = chiSquareCriticalValue(alpha, df);
        assertClose(chiSquareUpperTail(c, df).p, alpha, 1e-11, { alpha, df, c });
      }
    }
  });

  it('falls as alpha grows and rises with df', () => {
    for (const df of [1, 10, 1000]) {
      let previous = Infinity;
      for (const alpha of [1e-12, 1e-6, 0.001, 0.01, 0.05, 0.1, 0.5, 0.9, 0.999]) {
        const c = chiSquareCriticalValue(alpha, df);
        assert.ok(c < previous, `not falling at alpha=${alpha}, df=${df}`);
        previous = c;
      }
    }
    let previous = 0;
    for (let df = 1; df <= 100000; df *= 3) {
      const c = chiSquareCriticalValue(0.05, df);
      assert.ok(c > previous, `not rising at df=${df}`);
      previous = c;
    }
  });

  it('gives Infinity at alpha 0, 0 at alpha 1, and NaN for invalid input', () => {
    assert.equal(chiSquareCriticalValue(0, 4), Infinity);
    assert.equal(chiSquareCriticalValue(1, 4), 0);
    for (const [alpha, df] of [[NaN, 2], [-0.1, 2], [1.5, 2], [0.05, 0], [0.05, -3], [0.05, NaN]]) {
      assert.ok(Number.isNaN(chiSquareCriticalValue(alpha, df)), `alpha=${alpha}, df=${df}`);
    }
  });
});
