import assert from 'node:assert/strict';
import fc from 'fast-check';
import { wilsonInterval } from '../../../src/core/stats/wilsonInterval';
import { assertClose } from '../../helpers/assertClose';

const PROPERTY_SEED = 20260611;

describe('wilsonInterval', () => {
  // Newcombe (1998), "Two-sided confidence intervals for the single proportion: comparison of seven
  // methods", Statistics in Medicine 17, 857–872, Table I, method 3 (score, no continuity correction),
  // 95% — values from memory, printed to 4 decimals.
  const newcombeTableI: [number, number, number, number][] = [
    [81, 263, 0.2553, 0.3662],
    [15, 148, 0.0624, 0.1605],
    [0, 20, 0, 0.1611],
    [1, 29, 0.0061, 0.1718],
  ];
  for (const [successes, n, lower, upper] of newcombeTableI) {
    it(`gives Newcombe's Table I limits ${lower}–${upper} for ${successes}/${n}`, () => {
      const interval = wilsonInterval(successes, n, 0.95);
      assertClose(interval.lower, lower, { absolute: 5e-5 }, [successes, n]);
      assertClose(interval.upper, upper, { absolute: 5e-5 }, [successes, n]);
      assert.equal(interval.estimate, successes / n);
    });
  }

  it('is symmetric: the interval for n − x is the mirror of the one for x', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 500 }).chain((n) => fc.tuple(fc.constant(n), fc.integer({ min: 0, max: n }))), ([n, x]) => {
      const a = wilsonInterval(x, n, 0.95);
      const b = wilsonInterval(n - x, n, 0.95);
      assertClose(a.lower, 1 - b.upper, { absolute: 1e-14 }, [x, n]);
      assert.ok(a.lower >= 0 && a.lower <= a.estimate && a.estimate <= a.upper && a.upper <= 1);
    }), { seed: PROPERTY_SEED, numRuns: 200 });
  });

  it('throws on impossible counts (programmer error)', () => {
    assert.throws(() => wilsonInterval(3, 0, 0.95), RangeError);
    assert.throws(() => wilsonInterval(5, 4, 0.95), RangeError);
  });
});
