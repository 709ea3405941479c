import assert from 'node:assert/strict';
import fc from 'fast-check';
import { cramersVInterval } from '../../../src/core/stats/cramersVInterval';
import { assertClose } from '../../helpers/assertClose';
import { readScipyFixture } from './scipyFixture';

const fixture = readScipyFixture<{ observed: number[][]; confidenceLevel: number }, { statistic: number; df: number; cramersVInterval: [number, number] }>('independence.json');
const PROPERTY_SEED = 20260611;

describe('cramersVInterval', () => {
  describe('against SciPy fixtures (scipy.stats.ncx2 inverted by brentq)', () => {
    for (const { name, input, expected, tolerance } of fixture.cases) {
      it(`matches the noncentrality limits for ${name}`, () => {
        const n = input.observed.flat().reduce((sum, count) => sum + count, 0);
        const k = Math.min(input.observed.length, input.observed[0].length);
        const interval = cramersVInterval(expected.statistic, expected.df, n, k, input.confidenceLevel);
        const [lower, upper] = expected.cramersVInterval;
        // 1e-5 relative while noncentralChiSquareCdf is the jstat-based placeholder (see generate_stats.py).
        const relative = tolerance.cramersVInterval ?? 1e-5;
        assertClose(interval.lower, lower, { relative, absolute: 1e-12 }, input.observed);
        const v = Math.sqrt(expected.statistic / (n * (k - 1)));
        // The upper limit is raised to the sample V when the inversion falls below it (documented guard).
        assertClose(interval.upper, Math.max(upper, v), { relative, absolute: 1e-12 }, input.observed);
      });
    }
  });

  it('is [0, 0] at X² = 0 and starts at 0 while the test is not significant at 1 − level', () => {
    assert.deepEqual([cramersVInterval(0, 2, 100, 2, 0.95).lower, cramersVInterval(0, 2, 100, 2, 0.95).upper], [0, 0]);
    // X² = 3 on df = 2 has p ≈ 0.22 > 0.025, so no positive lower limit.
    const interval = cramersVInterval(3, 2, 100, 2, 0.95);
    assert.equal(interval.lower, 0);
    assert.ok(interval.upper > interval.estimate);
  });

  it('widens with the confidence level', () => {
    const narrow = cramersVInterval(25, 4, 300, 3, 0.9);
    const wide = cramersVInterval(25, 4, 300, 3, 0.99);
    assert.ok(wide.lower < narrow.lower && wide.upper > narrow.upper);
  });

  it('has both limits rising with X² and containing V (fast-check)', () => {
    fc.assert(fc.property(
      fc.double({ min: 0, max: 150, noNaN: true }), fc.double({ min: 0, max: 150, noNaN: true }),
      fc.integer({ min: 1, max: 12 }), fc.integer({ min: 20, max: 2000 }),
      (x1, x2, df, n) => {
        const [smaller, larger] = x1 <= x2 ? [x1, x2] : [x2, x1];
        const k = 2 + (df % 3);
        const a = cramersVInterval(smaller, df, n, k, 0.95);
        const b = cramersVInterval(larger, df, n, k, 0.95);
        assert.ok(a.lower <= b.lower + 1e-9 && a.upper <= b.upper + 1e-9, JSON.stringify({ smaller, larger, df, n, a, b }));
        for (const interval of [a, b]) {
          assert.ok(interval.lower <= interval.estimate && interval.estimate <= interval.upper && interval.upper <= 1);
        }
      },
    ), { seed: PROPERTY_SEED, numRuns: 100 });
  });
});
