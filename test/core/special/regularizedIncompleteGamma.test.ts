import assert from 'node:assert/strict';
import { jStat } from 'jstat';
import { regularizedIncompleteGamma } from '../../../src/core/special/regularizedIncompleteGamma';
import { assertClose } from '../../helpers/assertClose';
import { readMpmathFixture } from './mpmathFixture';

const fixture = readMpmathFixture<{ x: number; df: number }, { p?: string; log10p: string }>('chiSquareUpperTail');

describe('regularizedIncompleteGamma', () => {
  it('gives Q(df/2, x/2) equal to the mpmath chi-square upper tail, with the log to 1e-12', () => {
    for (const c of fixture.cases) {
      const result = regularizedIncompleteGamma(c.input.df / 2, c.input.x / 2);
      assertClose(result.logUpper / Math.LN10, Number(c.expected.log10p), 1e-12, c.input);
    }
  });

  it('keeps P + Q = 1 and each log consistent with its value', () => {
    for (const a of [0.05, 0.5, 1, 3.5, 40, 700, 25000]) {
      for (const share of [1e-3, 0.2, 0.7, 0.95, 1, 1.05, 1.3, 2, 5]) {
        const z = share * a + (share === 1 ? 1 : 0);
        const { lower, upper, logLower, logUpper } = regularizedIncompleteGamma(a, z);
        assertClose(lower + upper, 1, 4e-16, { a, z });
        if (lower > 1e-300) assertClose(Math.exp(logLower), lower, 1e-14, { a, z });
        if (upper > 1e-300) assertClose(Math.exp(logUpper), upper, 1e-14, { a, z });
      }
    }
  });

  it('agrees with jstat lowRegGamma (run live) to 1e-6 absolute for small shapes', () => {
    for (const a of [0.5, 1, 2, 4.5, 10]) {
      for (const z of [0.1, 0.5, 1, 2, 5, 10, 20]) {
        assertClose(regularizedIncompleteGamma(a, z).lower, jStat.lowRegGamma(a, z), { absolute: 1e-6 }, { a, z });
      }
    }
  });

  it('handles z = 0 and z = Infinity, and gives NaN for a ≤ 0, z < 0 or NaN', () => {
    assert.deepEqual(regularizedIncompleteGamma(2, 0), { lower: 0, upper: 1, logLower: -Infinity, logUpper: 0 });
    assert.deepEqual(regularizedIncompleteGamma(2, Infinity), { lower: 1, upper: 0, logLower: 0, logUpper: -Infinity });
    for (const [a, z] of [[0, 1], [-1, 1], [1, -1], [NaN, 1], [1, NaN], [Infinity, 1]]) {
      assert.ok(Number.isNaN(regularizedIncompleteGamma(a, z).upper), `a=${a}, z=${z}`);
    }
  });
});
