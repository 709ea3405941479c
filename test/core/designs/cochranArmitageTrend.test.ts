import assert from 'node:assert/strict';
import fc from 'fast-check';
import { cochranArmitageTrend } from '../../../src/core/designs/cochranArmitageTrend';
import { linearByLinear } from '../../../src/core/designs/linearByLinear';
import { assertClose } from '../../helpers/assertClose';
import { designCases } from './designFixture';

const PROPERTY_SEED = 20261202;

describe('cochranArmitageTrend', () => {
  // Agresti (2007), An Introduction to Categorical Data Analysis 2nd ed., Table 2.7 / §2.5.1: infant
  // malformation (present, absent) by mother's alcohol consumption (0, <1, 1–2, 3–5, ≥6 drinks a day).
  // With scores 0, 0.5, 1.5, 4, 7 Agresti reports r = 0.0142, M² = 6.57, P = 0.01; with scores 1…5,
  // M² = 1.83 (from memory). Our generator gives Z = 2.563 and 1.352 (M = √M² = 2.563 and 1.352).
  const malformation = [
    [48, 38, 5, 1, 1],
    [17066, 14464, 788, 126, 37],
  ];

  it('matches the conditional M² = 6.57 of Agresti (2007) for the malformation table with scores 0, 0.5, 1.5, 4, 7', () => {
    const result = cochranArmitageTrend(malformation, [0, 0.5, 1.5, 4, 7]);
    assertClose(result.zConditional ** 2, 6.57, { absolute: 0.005 });
    assertClose(result.pConditional.p, 0.01, { absolute: 0.0005 });
  });

  it('matches M² = 1.83 of Agresti (2007) for the malformation table with equally spaced scores', () => {
    assertClose(cochranArmitageTrend(malformation, [1, 2, 3, 4, 5]).zConditional ** 2, 1.83, { absolute: 0.005 });
    assertClose(cochranArmitageTrend(malformation).z, cochranArmitageTrend(malformation, [1, 2, 3, 4, 5]).z, 1e-12);
  });

  describe('against SciPy fixtures', () => {
    // test/fixtures/scipy/designs.json from generate_designs.py (NumPy formula, scipy.stats.norm.sf).
    for (const { name, input, expected, tolerance } of designCases('trend')) {
      it(`agrees with scipy 1.17.1 on ${name}`, () => {
        const table = input.table as number[][];
        const result = cochranArmitageTrend(table, input.scores as number[]);
        assertClose(result.z, expected.z as number, tolerance, input);
        assertClose(result.p.p, expected.p as number, { relative: tolerance, absolute: 1e-300 }, input);
      });
    }
  });

  it('has zConditional² equal to the linear-by-linear M² for a 2×k table', () => {
    const result = cochranArmitageTrend(malformation, [0, 0.5, 1.5, 4, 7]);
    const m2 = linearByLinear(malformation, [0, 1], [0, 0.5, 1.5, 4, 7]).statistic;
    assertClose(result.zConditional ** 2, m2, 1e-12);
  });

  it('throws RangeError on bad arguments', () => {
    assert.throws(() => cochranArmitageTrend([[1, 2, 3]]), RangeError);
    assert.throws(() => cochranArmitageTrend([[1, 2], [3, 4]], [0, 1, 2]), RangeError);
    assert.throws(() => cochranArmitageTrend([[1, 2], [3, 4]], [5, 5]), RangeError);
    assert.throws(() => cochranArmitageTrend([[0, 0], [3, 4]]), RangeError);
  });

  describe('properties', () => {
    const table = fc.tuple(fc.array(fc.integer({ min: 1, max: 50 }), { minLength: 3, maxLength: 6 })).chain(([first]) =>
      fc.array(fc.integer({ min: 1, max: 50 }), { minLength: first.length, maxLength: first.length }).map((second) => [first, second]),
    );

    it('keeps p in [0, 1]', () => {
      fc.assert(
        fc.property(table, (counts) => {
          const { p, pConditional } = cochranArmitageTrend(counts);
          assert.ok(p.p >= 0 && p.p <= 1 && pConditional.p >= 0 && pConditional.p <= 1);
        }),
        { seed: PROPERTY_SEED, numRuns: 200 },
      );
    });

    it('changes the sign of z, not its size, when the scores are reversed', () => {
      fc.assert(
        fc.property(table, (counts) => {
          const scores = counts[0].map((_, index) => index);
          const reversed = scores.map((score) => -score);
          assertClose(cochranArmitageTrend(counts, reversed).z, -cochranArmitageTrend(counts, scores).z, { relative: 1e-12, absolute: 1e-14 }, counts);
        }),
        { seed: PROPERTY_SEED, numRuns: 200 },
      );
    });
  });
});
