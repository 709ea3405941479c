import assert from 'node:assert/strict';
import fc from 'fast-check';
import { conditionalOddsRatio } from '../../../src/core/exact/conditionalOddsRatio';
import { assertClose } from '../../helpers/assertClose';
import { casesOfKind, fixtureNumber } from './fisherFixture';
import { binomial, ratioToNumber } from './fisherExactRational';

type Table = [[number, number], [number, number]];
const PROPERTY_SEED = 20250611;

/**
 * Mean and tails of Fisher's noncentral hypergeometric distribution straight from the definition,
 * Σ C(m, x)·C(n, k − x)·ψ^x over the whole support, with exact binomials (small tables only).
 */
function noncentralByDefinition(table: Table, odds: number): { mean: number; atLeast: number; atMost: number } {
  const [[a, b], [c, d]] = table;
  const m = a + b;
  const n = c + d;
  const k = a + c;
  const lowest = Math.max(0, k - n);
  const highest = Math.min(k, m);
  const logWeights: number[] = [];
  for (let x = lowest; x <= highest; x++) logWeights.push(Math.log(ratioToNumber(binomial(m, x) * binomial(n, k - x), 1n)) + x * Math.log(odds));
  // Scaled by the largest weight so that ψ^x can neither overflow nor underflow.
  const largest = Math.max(...logWeights);
  let total = 0;
  let first = 0;
  let atLeast = 0;
  let atMost = 0;
  for (let x = lowest; x <= highest; x++) {
    const weight = Math.exp(logWeights[x - lowest] - largest);
    total += weight;
    first += x * weight;
    if (x >= a) atLeast += weight;
    if (x <= a) atMost += weight;
  }
  return { mean: first / total, atLeast: atLeast / total, atMost: atMost / total };
}

describe('conditionalOddsRatio', () => {
  describe('against SciPy fixtures (scipy.stats.contingency.odds_ratio, kind="conditional")', () => {
    const cases = casesOfKind('fisher').filter((c) => c.expected.oddsRatio !== undefined);

    it('has the odds-ratio cases', () => assert.ok(cases.length >= 200));

    for (const fixtureCase of cases) {
      it(`agrees on ${fixtureCase.name}`, () => {
        const { table } = fixtureCase.input;
        const result = conditionalOddsRatio(table, 0.95);
        const estimate = fixtureNumber(fixtureCase.expected.oddsRatio);
        const input = { name: fixtureCase.name, table };
        if (estimate === null) {
          assert.equal(result, null);
          return;
        }
        assert.ok(result);
        assertClose(result.estimate, estimate, fixtureCase.tolerance.oddsRatio!, input);
        assertClose(result.lower, fixtureNumber(fixtureCase.expected.lower)!, fixtureCase.tolerance.interval!, input);
        assertClose(result.upper, fixtureNumber(fixtureCase.expected.upper)!, fixtureCase.tolerance.interval!, input);
        assert.equal(result.level, 0.95);
      });
    }
  });

  describe('by its definition (Cornfield 1956), summed directly for small tables', () => {
    it('makes the noncentral mean equal a at the estimate and each tail α/2 at the limits', () => {
      const cell = fc.integer({ min: 0, max: 40 });
      fc.assert(
        fc.property(fc.tuple(cell, cell, cell, cell), fc.constantFrom(0.8, 0.9, 0.95, 0.99), ([a, b, c, d], level) => {
          const table: Table = [[a, b], [c, d]];
          const result = conditionalOddsRatio(table, level);
          if (result === null) return;
          const halfAlpha = (1 - level) / 2;
          if (Number.isFinite(result.estimate) && result.estimate > 0) {
            assertClose(noncentralByDefinition(table, result.estimate).mean, a, 1e-9, table);
          }
          if (result.lower > 0) assertClose(noncentralByDefinition(table, result.lower).atLeast, halfAlpha, 1e-8, table);
          if (Number.isFinite(result.upper)) assertClose(noncentralByDefinition(table, result.upper).atMost, halfAlpha, 1e-8, table);
        }),
        { seed: PROPERTY_SEED, numRuns: 300 },
      );
    });

    it('puts the estimate and lower limit at 0 when a is at its minimum, the upper limit at Infinity at its maximum', () => {
      const atMinimum = conditionalOddsRatio([[0, 6], [9, 2]])!;
      assert.equal(atMinimum.estimate, 0);
      assert.equal(atMinimum.lower, 0);
      assert.ok(Number.isFinite(atMinimum.upper) && atMinimum.upper > 0);
      const atMaximum = conditionalOddsRatio([[7, 0], [3, 11]])!;
      assert.equal(atMaximum.estimate, Infinity);
      assert.equal(atMaximum.upper, Infinity);
      assert.ok(Number.isFinite(atMaximum.lower) && atMaximum.lower > 0);
    });
  });

  describe('properties', () => {
    it('holds the estimate inside the interval, which widens with the level', () => {
      const cell = fc.integer({ min: 0, max: 200000 });
      fc.assert(
        fc.property(fc.tuple(cell, cell, cell, cell), ([a, b, c, d]) => {
          const narrow = conditionalOddsRatio([[a, b], [c, d]], 0.9);
          const wide = conditionalOddsRatio([[a, b], [c, d]], 0.99);
          if (narrow === null || wide === null) return;
          assert.ok(narrow.lower <= narrow.estimate && narrow.estimate <= narrow.upper, JSON.stringify(narrow));
          assert.ok(wide.lower <= narrow.lower && narrow.upper <= wide.upper);
        }),
        { seed: PROPERTY_SEED, numRuns: 100 },
      );
    });

    it('is 1 with reciprocal limits for a perfectly balanced table with N = 10^7', () => {
      const result = conditionalOddsRatio([[2500000, 2500000], [2500000, 2500000]])!;
      assertClose(result.estimate, 1, 1e-12);
      // Symmetric table: the limits are reciprocals of each other.
      assertClose(result.lower * result.upper, 1, 1e-9);
      assert.ok(result.lower < 1 && result.upper > 1);
    });
  });

  describe('bad input', () => {
    it('throws a RangeError for a negative or fractional cell or a level outside (0, 1)', () => {
      assert.throws(() => conditionalOddsRatio([[1, -2], [3, 4]]), RangeError);
      assert.throws(() => conditionalOddsRatio([[1, 2.5], [3, 4]]), RangeError);
      assert.throws(() => conditionalOddsRatio([[1, 2], [3, 4]], 0), RangeError);
      assert.throws(() => conditionalOddsRatio([[1, 2], [3, 4]], Number.NaN), RangeError);
    });
  });
});
