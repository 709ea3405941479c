import assert from 'node:assert/strict';
import { hypergeometricMargins } from '../../../src/core/exact/hypergeometricMargins';
import { hypergeometricNoncentralMoments } from '../../../src/core/exact/hypergeometricNoncentralMoments';
import { assertClose } from '../../helpers/assertClose';
import { casesOfKind } from './fisherFixture';

describe('hypergeometricNoncentralMoments', () => {
  describe('against SciPy fixtures (scipy.stats.nchypergeom_fisher mean, cdf, sf)', () => {
    const cases = casesOfKind('noncentral');
    it('has the cases', () => assert.ok(cases.length >= 9));
    for (const fixtureCase of cases) {
      it(`agrees on ${fixtureCase.name}`, () => {
        const { x, rowTotal, otherRowTotal, columnTotal, oddsRatio } = fixtureCase.input;
        const margins = hypergeometricMargins([[x, rowTotal - x], [columnTotal - x, otherRowTotal - columnTotal + x]]);
        const actual = hypergeometricNoncentralMoments(margins, Math.log(oddsRatio), x);
        assertClose(actual.mean, fixtureCase.expected.mean, fixtureCase.tolerance, fixtureCase.input);
        assertClose(actual.pAtMost, fixtureCase.expected.pAtMost, fixtureCase.tolerance, fixtureCase.input);
        assertClose(actual.pAtLeast, fixtureCase.expected.pAtLeast, fixtureCase.tolerance, fixtureCase.input);
      });
    }
  });

  it('is the central hypergeometric at ψ = 1: mean k·m/N (Johnson, Kemp & Kotz 2005, §6.2)', () => {
    const margins = hypergeometricMargins([[2600000, 2400000], [2300000, 2700000]]);
    const moments = hypergeometricNoncentralMoments(margins, 0, 2600000);
    assertClose(moments.mean, (margins.columnTotal * margins.rowTotal) / margins.total, 1e-13);
  });

  it('puts all the mass on one end for extreme ψ without overflow', () => {
    const margins = hypergeometricMargins([[30, 20], [25, 40]]);
    const high = hypergeometricNoncentralMoments(margins, 800, 30);
    assert.equal(high.mean, margins.highest);
    const low = hypergeometricNoncentralMoments(margins, -800, 30);
    assert.equal(low.mean, margins.lowest);
    assert.equal(low.pAtMost, 1);
  });
});
