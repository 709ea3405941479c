import assert from 'node:assert/strict';
import fc from 'fast-check';
import { fisherExact2x2, type FisherResult } from '../../../src/core/exact/fisherExact2x2';
import { hypergeometricLogProbability } from '../../../src/core/exact/hypergeometricLogProbability';
import { hypergeometricMargins } from '../../../src/core/exact/hypergeometricMargins';
import { assertClose } from '../../helpers/assertClose';
import { casesOfKind, fixtureNumber } from './fisherFixture';
import { rationalFisher } from './fisherExactRational';

type Table = [[number, number], [number, number]];

/** fast-check runs are seeded so that a failure reproduces. */
const PROPERTY_SEED = 20250611;
/** Double-precision sums of a few thousand terms agree with exact rationals to about this. */
const EXACT_TOLERANCE = { relative: 1e-12, absolute: 1e-300 };

const cell = (max: number) => fc.integer({ min: 0, max });
const tableArbitrary = (max: number): fc.Arbitrary<Table> => fc.tuple(cell(max), cell(max), cell(max), cell(max)).map(([a, b, c, d]) => [[a, b], [c, d]]);
const observedProbability = (table: Table) => Math.exp(hypergeometricLogProbability(table[0][0], hypergeometricMargins(table)));

describe('fisherExact2x2', () => {
  describe('the lady tasting tea (Fisher 1935, The Design of Experiments, ch. II)', () => {
    // Four cups of each kind, three of the four milk-first cups picked out: the five possible tables
    // have probabilities 1/70, 16/70, 36/70, 16/70, 1/70 (C(4,x)·C(4,4−x)/C(8,4)).
    const result = fisherExact2x2([[3, 1], [1, 3]], { midP: true });

    it('gives the one-sided p of 17/70 that Fisher worked out', () => {
      assertClose(result.pGreater, 17 / 70, 1e-14);
      assertClose(result.pLess, 69 / 70, 1e-14);
    });

    it('gives the two-sided p of 34/70, the two tables as or more extreme on each side', () => {
      assertClose(result.p, 34 / 70, 1e-14);
      assertClose(result.log10p, Math.log10(34 / 70), 1e-13);
    });

    it('gives mid-p values that take half of the tied probability off (Lancaster 1961)', () => {
      assert.ok(result.midP);
      assertClose(result.midP.pGreater, 17 / 70 - 8 / 70, 1e-13);
      assertClose(result.midP.pLess, 69 / 70 - 8 / 70, 1e-13);
      // Tied with the observed 16/70: the observed table and its mirror image.
      assertClose(result.midP.p, 34 / 70 - 16 / 70, 1e-13);
    });

    it('reports the sample odds ratio ad/bc = 9', () => {
      assert.equal(result.sampleOddsRatio, 9);
      assert.equal(result.method, 'fisher-2x2');
      assert.ok(result.elapsedMs >= 0);
    });
  });

  describe('against exact rational arithmetic (the definition, summed with BigInt)', () => {
    it('matches every table with N ≤ 30 (46,376 tables)', () => {
      let checked = 0;
      for (let total = 0; total <= 30; total++) {
        for (let a = 0; a <= total; a++) {
          for (let b = 0; a + b <= total; b++) {
            for (let c = 0; a + b + c <= total; c++) {
              const table: Table = [[a, b], [c, total - a - b - c]];
              compareWithRational(table, fisherExact2x2(table, { midP: true, oddsRatio: false }));
              checked += 1;
            }
          }
        }
      }
      assert.equal(checked, 46376);
    });

    it('matches 300 random tables with N up to 4,000, far into the tails', () => {
      fc.assert(
        fc.property(tableArbitrary(1000), (table) => {
          compareWithRational(table, fisherExact2x2(table, { midP: true, oddsRatio: false }));
        }),
        { seed: PROPERTY_SEED, numRuns: 300 },
      );
    });
  });

  describe('against SciPy fixtures (test/fixtures/scipy/fisher.json, scipy.stats.fisher_exact)', () => {
    const cases = casesOfKind('fisher');

    it('has the random and edge-case tables', () => assert.ok(cases.length >= 320));

    for (const fixtureCase of cases) {
      it(`agrees on ${fixtureCase.name}`, () => {
        const { table } = fixtureCase.input;
        const result = fisherExact2x2(table, { oddsRatio: false });
        const input = { name: fixtureCase.name, table };
        // Where scipy's own sums drift (N = 10^7) the generator also summed the definition with mpmath at 40
        // digits; the check is then against mpmath, and scipy is held to a looser 1e-8.
        const reference = fixtureCase.mpmathExpected ?? fixtureCase.expected;
        for (const key of ['p', 'pLess', 'pGreater'] as const) {
          assertClose(result[key], reference[key], fixtureCase.tolerance.p, input);
          if (fixtureCase.mpmathExpected) assertClose(result[key], fixtureCase.expected[key], 1e-8, input);
        }
        const sample = fixtureCase.expected.oddsRatio === undefined ? undefined : fixtureNumber(fixtureCase.expected.oddsRatio);
        if (sample === null) assert.equal(result.sampleOddsRatio, null);
      });
    }

    for (const fixtureCase of casesOfKind('log10p')) {
      it(`keeps log10 p where p underflows: ${fixtureCase.name}`, () => {
        const result = fisherExact2x2(fixtureCase.input.table, { oddsRatio: false });
        const input = { name: fixtureCase.name, table: fixtureCase.input.table };
        assertClose(result.log10p, fixtureCase.expected.log10p, fixtureCase.tolerance.log10p, input);
        assertClose(result.p, fixtureCase.expected.p, fixtureCase.tolerance.p, input);
      });
    }
  });

  describe('properties', () => {
    it('keeps every p in [0, 1] and log10p ≤ 0', () => {
      fc.assert(
        fc.property(tableArbitrary(30000), (table) => {
          const result = fisherExact2x2(table, { midP: true, oddsRatio: false });
          for (const value of [result.p, result.pLess, result.pGreater, result.midP!.p, result.midP!.pLess, result.midP!.pGreater]) {
            assert.ok(value >= 0 && value <= 1, `${value} for ${JSON.stringify(table)}`);
          }
          assert.ok(result.log10p <= 0);
          assert.ok(result.midP!.p <= result.p);
        }),
        { seed: PROPERTY_SEED, numRuns: 300 },
      );
    });

    it('has pLess + pGreater − P(observed) = 1', () => {
      fc.assert(
        fc.property(tableArbitrary(30000), (table) => {
          const result = fisherExact2x2(table, { oddsRatio: false });
          assertClose(result.pLess + result.pGreater - observedProbability(table), 1, { absolute: 1e-12 }, table);
        }),
        { seed: PROPERTY_SEED, numRuns: 300 },
      );
    });

    it('is symmetric under swapping rows, swapping columns and transposing', () => {
      fc.assert(
        fc.property(tableArbitrary(3000), (table) => {
          const [[a, b], [c, d]] = table;
          const result = fisherExact2x2(table);
          const rowSwap = fisherExact2x2([[c, d], [a, b]]);
          const columnSwap = fisherExact2x2([[b, a], [d, c]]);
          const transposed = fisherExact2x2([[a, c], [b, d]]);
          for (const swapped of [rowSwap, columnSwap]) {
            assertClose(swapped.p, result.p, { relative: 1e-10, absolute: 1e-300 }, table);
            assertClose(swapped.pLess, result.pGreater, { relative: 1e-10, absolute: 1e-300 }, table);
            assertOddsRatioInverted(swapped, result, table);
          }
          assertClose(transposed.p, result.p, { relative: 1e-10, absolute: 1e-300 }, table);
          assertClose(transposed.pLess, result.pLess, { relative: 1e-10, absolute: 1e-300 }, table);
          if (result.oddsRatio) {
            assertClose(transposed.oddsRatio!.estimate, result.oddsRatio.estimate, 1e-8, table);
            assertClose(transposed.oddsRatio!.lower, result.oddsRatio.lower, 1e-8, table);
            assertClose(transposed.oddsRatio!.upper, result.oddsRatio.upper, 1e-8, table);
          }
        }),
        { seed: PROPERTY_SEED, numRuns: 150 },
      );
    });

    it('gives p = 1 when a margin is empty, with no odds ratio', () => {
      for (const table of [[[0, 0], [4, 7]], [[5, 0], [9, 0]], [[0, 0], [0, 0]]] as Table[]) {
        const result = fisherExact2x2(table);
        assert.deepEqual([result.p, result.pLess, result.pGreater, result.log10p], [1, 1, 1, 0]);
        assert.equal(result.oddsRatio, null);
        assert.equal(result.sampleOddsRatio, null);
      }
    });
  });

  describe('large tables', () => {
    it('stays finite and consistent for N = 10^7 with a huge association', () => {
      const result = fisherExact2x2([[4000000, 1000000], [1000000, 4000000]], { oddsRatio: false });
      assert.equal(result.p, 0);
      assert.ok(Number.isFinite(result.log10p) && result.log10p < -1e5, `${result.log10p}`);
      // The mirror table [[1e6, 4e6], [4e6, 1e6]] is exactly as probable, so p = 2·P(A ≥ a).
      assertClose(result.log10p, Math.log10(2) + greaterLog10(4000000, 1000000), 1e-12);
    });
  });

  describe('bad input (a programmer error: the engine validates counts first)', () => {
    for (const bad of [-1, 1.5, Number.NaN, Infinity, 2 ** 53]) {
      it(`throws a RangeError for a cell of ${bad}`, () => {
        assert.throws(() => fisherExact2x2([[3, bad], [1, 3]]), RangeError);
      });
    }
    it('throws a RangeError for a confidence level outside (0, 1)', () => {
      assert.throws(() => fisherExact2x2([[3, 1], [1, 3]], { level: 1 }), RangeError);
    });
  });
});

/** log10 P(A ≥ a) for a table with a far above its mode, summed term by term from a upward. */
function greaterLog10(a: number, b: number): number {
  const margins = hypergeometricMargins([[a, b], [b, a]]);
  const logFirst = hypergeometricLogProbability(a, margins);
  let sum = 0;
  for (let x = a; x <= margins.highest; x++) {
    const term = Math.exp(hypergeometricLogProbability(x, margins) - logFirst);
    sum += term;
    if (term < 1e-18 * sum) break;
  }
  return (logFirst + Math.log(sum)) / Math.LN10;
}

function compareWithRational(table: Table, result: FisherResult): void {
  const exact = rationalFisher(table);
  assertClose(result.p, exact.p, EXACT_TOLERANCE, table);
  assertClose(result.pLess, exact.pLess, EXACT_TOLERANCE, table);
  assertClose(result.pGreater, exact.pGreater, EXACT_TOLERANCE, table);
  assertClose(result.midP!.p, exact.midP, EXACT_TOLERANCE, table);
  assertClose(result.midP!.pLess, exact.pLess - exact.observed / 2, EXACT_TOLERANCE, table);
  assertClose(result.midP!.pGreater, exact.pGreater - exact.observed / 2, EXACT_TOLERANCE, table);
  if (exact.p > 1e-300) assertClose(result.log10p, Math.log10(exact.p), { relative: 1e-12, absolute: 1e-14 }, table);
}

function assertOddsRatioInverted(swapped: FisherResult, original: FisherResult, table: Table): void {
  if (!original.oddsRatio || !swapped.oddsRatio) {
    assert.equal(swapped.oddsRatio, original.oddsRatio);
    return;
  }
  assertClose(swapped.oddsRatio.estimate, 1 / original.oddsRatio.estimate, 1e-8, table);
  assertClose(swapped.oddsRatio.lower, 1 / original.oddsRatio.upper, 1e-8, table);
  assertClose(swapped.oddsRatio.upper, 1 / original.oddsRatio.lower, 1e-8, table);
}
