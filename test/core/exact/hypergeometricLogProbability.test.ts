import assert from 'node:assert/strict';
import { hypergeometricLogProbability } from '../../../src/core/exact/hypergeometricLogProbability';
import { hypergeometricMargins } from '../../../src/core/exact/hypergeometricMargins';
import { assertClose } from '../../helpers/assertClose';
import { casesOfKind, type MarginsInput } from './fisherFixture';
import { binomial, ratioToNumber } from './fisherExactRational';

/** A table with the given margins whose top-left cell is x. */
function marginsOf({ x, rowTotal, otherRowTotal, columnTotal }: MarginsInput) {
  return hypergeometricMargins([[x, rowTotal - x], [columnTotal - x, otherRowTotal - columnTotal + x]]);
}

describe('hypergeometricLogProbability', () => {
  describe('against mpmath at 50 digits (test/fixtures/scipy/fisher.json, logpmf cases)', () => {
    const cases = casesOfKind('logpmf');
    it('has the cases, up to N = 10^7', () => assert.ok(cases.length >= 15));
    for (const fixtureCase of cases) {
      it(`agrees on ${fixtureCase.name}`, () => {
        const actual = hypergeometricLogProbability(fixtureCase.input.x, marginsOf(fixtureCase.input));
        assertClose(actual, fixtureCase.expected.logProbability, fixtureCase.tolerance, fixtureCase.input);
      });
    }
  });

  it('matches C(m, x)·C(n, k − x) / C(N, k) in exact arithmetic over whole supports', () => {
    for (const [m, n, k] of [[4, 4, 4], [10, 5, 7], [37, 58, 41], [200, 150, 120], [600, 400, 300]]) {
      const margins = marginsOf({ x: Math.max(0, k - n), rowTotal: m, otherRowTotal: n, columnTotal: k });
      for (let x = margins.lowest; x <= margins.highest; x++) {
        const exact = Math.log(ratioToNumber(binomial(m, x) * binomial(n, k - x), binomial(m + n, k)));
        assertClose(hypergeometricLogProbability(x, margins), exact, { relative: 1e-13, absolute: 1e-13 }, { x, m, n, k });
      }
    }
  });

  it('is −Infinity outside the support and 0 on a single-point support', () => {
    const margins = hypergeometricMargins([[2, 3], [4, 1]]);
    assert.equal(hypergeometricLogProbability(margins.lowest - 1, margins), -Infinity);
    assert.equal(hypergeometricLogProbability(margins.highest + 1, margins), -Infinity);
    assert.equal(hypergeometricLogProbability(0, hypergeometricMargins([[0, 0], [3, 4]])), 0);
  });
});
