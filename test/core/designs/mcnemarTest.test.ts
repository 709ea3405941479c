import assert from 'node:assert/strict';
import fc from 'fast-check';
import { jStat } from 'jstat';
import { mcnemarTest, type PairedTable } from '../../../src/core/designs/mcnemarTest';
import { assertClose } from '../../helpers/assertClose';
import { designCases } from './designFixture';

const PROPERTY_SEED = 20261202;

interface McNemarExpected {
  chiSquare: number;
  chiSquareP: number;
  corrected: number;
  correctedP: number;
  exactP: number;
  midP: number;
  wald: [number, number];
  newcombe: [number, number];
}

const pairedTable = fc
  .tuple(fc.nat(60), fc.nat(60), fc.nat(60), fc.nat(60))
  .filter(([a, b, c, d]) => a + b + c + d > 0)
  .map(([a, b, c, d]): PairedTable => [[a, b], [c, d]]);

describe('mcnemarTest', () => {
  it('gives z² = 17.36 for the presidential approval ratings of Agresti (2013, §11.1; 2007, §8.1)', () => {
    // Agresti, Categorical Data Analysis 3rd ed., 1600 people rated twice: 794, 150, 86, 570;
    // z = (86 − 150)/√236 = −4.17, z² = 17.36 (from memory); difference 0.59 − 0.55 = 0.04.
    const result = mcnemarTest([[794, 150], [86, 570]]);
    assertClose(result.chiSquare.statistic, 17.36, { absolute: 0.005 });
    assertClose(result.difference.wald.estimate, 0.04, 1e-12);
    // Wald interval 0.04 ± 1.96 · 0.0095 = (0.021, 0.059) (Agresti 2007, §8.1.2, from memory).
    assertClose(result.difference.wald.lower, 0.021, { absolute: 0.0005 });
    assertClose(result.difference.wald.upper, 0.059, { absolute: 0.0005 });
    assert.ok(result.chiSquare.p < 1e-4);
  });

  // jstat 1.9.6 rounds binomial.cdf to 10 decimal places, hence an absolute tolerance.
  const JSTAT_ROUNDING = { absolute: 1e-10 };

  describe('against jstat 1.9.6, live', () => {
    it('gives the exact p as twice the binomial tail 2·P(X ≤ min(b, c)), X ~ Bin(b + c, ½), capped at 1', () => {
      for (const [b, c] of [[3, 9], [12, 4], [0, 7], [25, 25], [40, 22], [1, 0]]) {
        const expected = Math.min(1, 2 * jStat.binomial.cdf(Math.min(b, c), b + c, 0.5));
        assertClose(mcnemarTest([[5, b], [c, 5]]).exact.p, expected, JSTAT_ROUNDING, { b, c });
      }
    });

    it('gives the mid-p as 2·P(X < min) + P(X = min) from jstat', () => {
      for (const [b, c] of [[3, 9], [12, 4], [0, 7], [40, 22]]) {
        const low = Math.min(b, c);
        const expected = 2 * (jStat.binomial.cdf(low, b + c, 0.5) - 0.5 * jStat.binomial.pdf(low, b + c, 0.5));
        assertClose(mcnemarTest([[5, b], [c, 5]]).midP.p, expected, JSTAT_ROUNDING, { b, c });
      }
    });
  });

  describe('against SciPy fixtures', () => {
    // test/fixtures/scipy/designs.json from generate_designs.py (scipy.stats.binomtest, chi2.sf,
    // Wilson limits from binomtest(...).proportion_ci for Newcombe's method 10).
    for (const { name, input, expected: raw, tolerance } of designCases('mcnemar')) {
      const expected = raw as unknown as McNemarExpected;
      it(`agrees with scipy 1.17.1 on ${name}`, () => {
        const table = input.table as PairedTable;
        const result = mcnemarTest(table);
        const close = (actual: number, wanted: number): void => assertClose(actual, wanted, { relative: tolerance, absolute: 1e-15 }, table);
        close(result.chiSquare.statistic, expected.chiSquare);
        close(result.chiSquare.p, expected.chiSquareP);
        close(result.chiSquareCorrected.statistic, expected.corrected);
        close(result.chiSquareCorrected.p, expected.correctedP);
        close(result.exact.p, expected.exactP);
        close(result.midP.p, expected.midP);
        close(result.difference.wald.lower, expected.wald[0]);
        close(result.difference.wald.upper, expected.wald[1]);
        close(result.difference.newcombe.lower, expected.newcombe[0]);
        close(result.difference.newcombe.upper, expected.newcombe[1]);
      });
    }
  });

  it('gives p = 1 and statistic 0 when there are no discordant pairs', () => {
    const result = mcnemarTest([[10, 0], [0, 4]]);
    assert.equal(result.chiSquare.statistic, 0);
    assert.equal(result.chiSquare.p, 1);
    assert.equal(result.exact.p, 1);
    assert.equal(result.midP.p, 1);
  });

  it('keeps log10p finite when the exact p underflows', () => {
    const result = mcnemarTest([[0, 3000], [0, 0]]);
    assert.equal(result.exact.p, 0);
    // 2·2^−3000: log10 = (1 − 3000)·log10 2.
    assertClose(result.exact.log10p, -2999 * Math.log10(2), 1e-12);
    assertClose(result.midP.log10p, -3000 * Math.log10(2), 1e-12);
  });

  it('throws RangeError on counts that are not whole non-negative numbers', () => {
    assert.throws(() => mcnemarTest([[1, -1], [2, 3]]), RangeError);
    assert.throws(() => mcnemarTest([[1, 1.5], [2, 3]]), RangeError);
    assert.throws(() => mcnemarTest([[0, 0], [0, 0]]), RangeError);
    assert.throws(() => mcnemarTest([[1, 1], [2, 3]], 1), RangeError);
  });

  describe('properties', () => {
    it('keeps every p in [0, 1] and mid-p no larger than the exact p', () => {
      fc.assert(
        fc.property(pairedTable, (table) => {
          const result = mcnemarTest(table);
          for (const p of [result.chiSquare.p, result.chiSquareCorrected.p, result.exact.p, result.midP.p]) assert.ok(p >= 0 && p <= 1, `p = ${p}`);
          assert.ok(result.midP.p <= result.exact.p + 1e-15);
        }),
        { seed: PROPERTY_SEED, numRuns: 300 },
      );
    });

    it('gives the same p-values and a mirrored interval when b and c are swapped', () => {
      fc.assert(
        fc.property(pairedTable, ([[a, b], [c, d]]) => {
          const forward = mcnemarTest([[a, b], [c, d]]);
          const swapped = mcnemarTest([[a, c], [b, d]]);
          assert.equal(forward.chiSquare.statistic, swapped.chiSquare.statistic);
          assert.equal(forward.exact.p, swapped.exact.p);
          assert.equal(forward.midP.p, swapped.midP.p);
          assertClose(forward.difference.newcombe.lower, -swapped.difference.newcombe.upper, { relative: 1e-12, absolute: 1e-15 });
          assertClose(forward.difference.wald.upper, -swapped.difference.wald.lower, { relative: 1e-12, absolute: 1e-15 });
        }),
        { seed: PROPERTY_SEED, numRuns: 300 },
      );
    });

    it('puts the difference inside both intervals', () => {
      fc.assert(
        fc.property(pairedTable, (table) => {
          const { wald, newcombe } = mcnemarTest(table).difference;
          for (const interval of [wald, newcombe]) assert.ok(interval.lower <= interval.estimate + 1e-15 && interval.estimate <= interval.upper + 1e-15);
        }),
        { seed: PROPERTY_SEED, numRuns: 300 },
      );
    });
  });
});
