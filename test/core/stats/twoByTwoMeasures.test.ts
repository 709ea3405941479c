import assert from 'node:assert/strict';
import { twoByTwoMeasures } from '../../../src/core/stats/twoByTwoMeasures';
import { assertClose } from '../../helpers/assertClose';
import { readScipyFixture } from './scipyFixture';

const fixture = readScipyFixture<{ observed: number[][]; confidenceLevel: number }, { relativeRisk?: number[]; oddsRatio?: number[] }>('independence.json');

describe('twoByTwoMeasures', () => {
  describe('against SciPy fixtures (contingency.relative_risk, Katz; odds_ratio kind="sample", Woolf)', () => {
    for (const { name, input, expected, tolerance } of fixture.cases.filter((c) => c.expected.relativeRisk && c.expected.oddsRatio)) {
      it(`matches relative risk and odds ratio with their intervals for ${name}`, () => {
        const measures = twoByTwoMeasures(input.observed, input.confidenceLevel);
        assert.equal(measures.zeroCellCorrection, false);
        const [rr, rrLower, rrUpper] = expected.relativeRisk as number[];
        const [or, orLower, orUpper] = expected.oddsRatio as number[];
        assertClose(measures.relativeRisk.estimate, rr, tolerance.relative, input.observed);
        assertClose(measures.relativeRisk.lower, rrLower, tolerance.relative, input.observed);
        assertClose(measures.relativeRisk.upper, rrUpper, tolerance.relative, input.observed);
        assertClose(measures.oddsRatio.estimate, or, tolerance.relative, input.observed);
        assertClose(measures.oddsRatio.lower, orLower, tolerance.relative, input.observed);
        assertClose(measures.oddsRatio.upper, orUpper, tolerance.relative, input.observed);
      });
    }
  });

  it('adds 0.5 to every cell for the ratios when a cell is zero (Haldane–Anscombe), but not for the difference', () => {
    const measures = twoByTwoMeasures([[0, 5], [3, 4]], 0.95);
    const shifted = twoByTwoMeasures([[0.5, 5.5], [3.5, 4.5]], 0.95);
    assert.equal(measures.zeroCellCorrection, true);
    assert.equal(shifted.zeroCellCorrection, false);
    assert.deepEqual(measures.oddsRatio, shifted.oddsRatio);
    assert.deepEqual(measures.relativeRisk, shifted.relativeRisk);
    assertClose(measures.riskDifference.estimate, 0 / 5 - 3 / 7, 1e-14);
    assert.ok(Number.isFinite(measures.oddsRatio.lower) && measures.oddsRatio.lower > 0);
  });

  it('puts the risk difference estimate inside its interval and uses the row order', () => {
    const forward = twoByTwoMeasures([[30, 10], [15, 25]], 0.95);
    const backward = twoByTwoMeasures([[15, 25], [30, 10]], 0.95);
    assertClose(forward.riskDifference.estimate, -backward.riskDifference.estimate, 1e-14);
    assertClose(forward.oddsRatio.estimate, 1 / backward.oddsRatio.estimate, 1e-14);
    assert.ok(forward.riskDifference.lower < forward.riskDifference.estimate && forward.riskDifference.estimate < forward.riskDifference.upper);
  });
});
