import assert from 'node:assert/strict';
import fc from 'fast-check';
import { cochranMantelHaenszel, type StratumTable } from '../../../src/core/designs/cochranMantelHaenszel';
import { testIndependence } from '../../../src/core/stats/testIndependence';
import { assertClose } from '../../helpers/assertClose';
import { designCases } from './designFixture';

const PROPERTY_SEED = 20261202;

interface CmhExpected {
  statistic: number;
  p: number;
  corrected: number;
  correctedP: number;
  oddsRatio: number;
  oddsRatioInterval: [number, number];
  breslowDay: number;
  breslowDayP: number;
  tarone: number;
  taroneP: number;
  df: number;
  skipped: number;
}

const stratum = fc
  .tuple(fc.integer({ min: 1, max: 40 }), fc.integer({ min: 1, max: 40 }), fc.integer({ min: 1, max: 40 }), fc.integer({ min: 1, max: 40 }))
  .map(([a, b, c, d]): StratumTable => [[a, b], [c, d]]);

describe('cochranMantelHaenszel', () => {
  describe('against SciPy fixtures', () => {
    // test/fixtures/scipy/designs.json from generate_designs.py: the published formulas coded with NumPy,
    // Breslow–Day fitted counts by scipy.optimize.brentq, tails by scipy.stats.chi2.sf / norm.ppf.
    for (const { name, input, expected: raw, tolerance } of designCases('cmh')) {
      const expected = raw as unknown as CmhExpected;
      it(`agrees with scipy 1.17.1 on ${name}`, () => {
        const strata = input.strata as StratumTable[];
        const result = cochranMantelHaenszel(strata);
        const close = (actual: number | undefined, wanted: number): void => assertClose(actual ?? NaN, wanted, { relative: tolerance, absolute: 1e-300 }, strata);
        assert.equal(result.strataSkipped, expected.skipped);
        close(result.statistic.value, expected.statistic);
        close(result.statistic.p, expected.p);
        close(result.corrected.value, expected.corrected);
        close(result.corrected.p, expected.correctedP);
        close(result.pooledOddsRatio?.estimate, expected.oddsRatio);
        close(result.pooledOddsRatio?.lower, expected.oddsRatioInterval[0]);
        close(result.pooledOddsRatio?.upper, expected.oddsRatioInterval[1]);
        assert.equal(result.breslowDay?.df, expected.df);
        close(result.breslowDay?.statistic, expected.breslowDay);
        close(result.breslowDay?.p, expected.breslowDayP);
        close(result.breslowDay?.taroneStatistic, expected.tarone);
        close(result.breslowDay?.tarone.p, expected.taroneP);
      });
    }
  });

  it('gives the continuity-corrected X²MH = 5.05, P = 0.025 of the mussel Lap94 example in McDonald (2014)', () => {
    // McDonald, Handbook of Biological Statistics 3rd ed. (2014), Cochran–Mantel–Haenszel chapter: Lap94 vs other
    // alleles, marine vs estuarine, at Tillamook, Yaquina, Alsea, Umpqua (McDonald & Siebenaller 1989);
    // counts and result from memory.
    const mussels: StratumTable[] = [
      [[56, 40], [69, 77]],
      [[61, 57], [257, 301]],
      [[73, 71], [65, 79]],
      [[71, 55], [48, 48]],
    ];
    const result = cochranMantelHaenszel(mussels);
    assertClose(result.corrected.value, 5.05, { absolute: 0.005 });
    assertClose(result.corrected.p, 0.025, { absolute: 0.0005 });
  });

  it('equals (N − 1)/N times Pearson X² for a single stratum', () => {
    // Identity: with one stratum, a − E = (ad − bc)/N and V = n₁n₂m₁m₂/(N²(N − 1)), so
    // (a − E)²/V = (N − 1)(ad − bc)²/(n₁n₂m₁m₂) = ((N − 1)/N) · X²  (Agresti 2013, §6.4.2; common practice).
    fc.assert(
      fc.property(stratum, (table) => {
        const n = table[0][0] + table[0][1] + table[1][0] + table[1][1];
        const pearson = testIndependence([[...table[0]], [...table[1]]]).pearson.statistic;
        assertClose(cochranMantelHaenszel([table]).statistic.value, ((n - 1) / n) * pearson, { relative: 1e-12, absolute: 1e-14 }, table);
      }),
      { seed: PROPERTY_SEED, numRuns: 200 },
    );
  });

  it('gives a pooled odds ratio equal to the common odds ratio when every stratum has it, and Breslow–Day 0', () => {
    // Strata with odds ratio exactly 2 (a·d/(b·c) = 2): ψ̂ = 2 and every fitted count equals the observed one.
    const strata: StratumTable[] = [[[4, 2], [3, 3]], [[10, 5], [6, 6]], [[8, 1], [4, 1]]];
    const result = cochranMantelHaenszel(strata);
    assertClose(result.pooledOddsRatio?.estimate ?? NaN, 2, 1e-12);
    assertClose(result.breslowDay?.statistic ?? NaN, 0, { absolute: 1e-12 });
    assert.equal(result.breslowDay?.df, 2);
    assert.deepEqual(result.strata.map((entry) => entry.oddsRatio), [2, 2, 2]);
  });

  it('skips strata with n ≤ 1 and counts them', () => {
    const result = cochranMantelHaenszel([[[5, 3], [2, 6]], [[0, 0], [0, 0]], [[0, 1], [0, 0]], [[7, 2], [3, 4]]]);
    assert.equal(result.strataUsed, 2);
    assert.equal(result.strataSkipped, 2);
    assert.equal(result.strata.length, 4);
  });

  it('leaves the pooled odds ratio and Breslow–Day undefined when no stratum has a·d > 0', () => {
    const result = cochranMantelHaenszel([[[0, 3], [2, 6]], [[4, 2], [3, 0]]]);
    assert.equal(result.pooledOddsRatio, undefined);
    assert.equal(result.breslowDay, undefined);
    assert.ok(result.statistic.p >= 0 && result.statistic.p <= 1);
  });

  it('throws RangeError on bad arguments', () => {
    assert.throws(() => cochranMantelHaenszel([]), RangeError);
    assert.throws(() => cochranMantelHaenszel([[[1, 0], [0, 0]]]), RangeError);
    assert.throws(() => cochranMantelHaenszel([[[1, -2], [3, 4]]]), RangeError);
  });

  describe('properties', () => {
    it('keeps every p in [0, 1]', () => {
      fc.assert(
        fc.property(fc.array(stratum, { minLength: 1, maxLength: 6 }), (strata) => {
          const result = cochranMantelHaenszel(strata);
          const ps = [result.statistic.p, result.corrected.p, result.breslowDay?.p ?? 0.5, result.breslowDay?.tarone.p ?? 0.5];
          for (const p of ps) assert.ok(p >= 0 && p <= 1, `p = ${p}`);
        }),
        { seed: PROPERTY_SEED, numRuns: 200 },
      );
    });

    it('does not depend on the order of the strata', () => {
      fc.assert(
        fc.property(fc.array(stratum, { minLength: 2, maxLength: 6 }), (strata) => {
          const forward = cochranMantelHaenszel(strata);
          const reversed = cochranMantelHaenszel([...strata].reverse());
          const tolerance = { relative: 1e-12, absolute: 1e-14 };
          assertClose(reversed.statistic.value, forward.statistic.value, tolerance, strata);
          assertClose(reversed.pooledOddsRatio?.estimate ?? NaN, forward.pooledOddsRatio?.estimate ?? NaN, tolerance, strata);
          assertClose(reversed.pooledOddsRatio?.lower ?? NaN, forward.pooledOddsRatio?.lower ?? NaN, tolerance, strata);
          assertClose(reversed.breslowDay?.taroneStatistic ?? NaN, forward.breslowDay?.taroneStatistic ?? NaN, { relative: 1e-9, absolute: 1e-12 }, strata);
        }),
        { seed: PROPERTY_SEED, numRuns: 200 },
      );
    });
  });
});
