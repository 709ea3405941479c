import assert from 'node:assert/strict';
import * as fs from 'node:fs';
import * as path from 'node:path';
import { monteCarloDefaultReplicates } from '../../../src/core/exact/monteCarloDefaultReplicates';
import { monteCarloInterval } from '../../../src/core/exact/monteCarloInterval';
import { assertClose } from '../../helpers/assertClose';

interface Fixture {
  reference: string;
  referenceVersion: string;
  cases: { name: string; input: { extreme: number; replicates: number; level: number }; expected: { lower: number; upper: number }; tolerance: number }[];
}
const fixture = JSON.parse(fs.readFileSync(path.resolve(__dirname, '../../../../test/fixtures/scipy/clopperPearson.json'), 'utf8')) as Fixture;

describe('monteCarloInterval', () => {
  it('matches Clopper–Pearson limits from scipy.stats.beta.ppf (fixture, 118 cases)', () => {
    assert.equal(fixture.reference, 'scipy');
    for (const { input, expected, tolerance } of fixture.cases) {
      const interval = monteCarloInterval(input.extreme, input.replicates, input.level);
      assert.equal(interval.level, input.level);
      assertClose(interval.lower, expected.lower, { relative: tolerance, absolute: 1e-300 }, input);
      assertClose(interval.upper, expected.upper, tolerance, input);
    }
  });

  it('contains the reported estimate (b + 1)/(R + 1) for every b at small R and at the edges of large R', () => {
    const check = (b: number, r: number): void => {
      const { lower, upper } = monteCarloInterval(b, r, 0.99);
      const p = (b + 1) / (r + 1);
      assert.ok(lower <= p && p <= upper, `b = ${b}, R = ${r}: ${p} not in [${lower}, ${upper}]`);
    };
    for (const r of [1, 2, 9, 99, 999]) for (let b = 0; b <= r; b++) check(b, r);
    for (const b of [0, 1, 2, 3, 49_995, 49_996, 49_997, 49_998, 49_999]) check(b, 49_999);
  });

  it('rejects impossible counts (programmer errors)', () => {
    assert.throws(() => monteCarloInterval(5, 4, 0.99), RangeError);
    assert.throws(() => monteCarloInterval(1, 10, 1), RangeError);
  });
});

describe('monteCarloDefaultReplicates', () => {
  it('gives R = 45,999 for ±0.002 at p = 0.05 with 95% (1.96² · 0.05 · 0.95 / 0.002² = 45,617.6, rounded up to k·1000 − 1)', () => {
    assert.equal(monteCarloDefaultReplicates(), 45_999);
    // Wald half-width at p = .05 with that R, from the normal quantile 1.959964 (handbook value).
    assert.ok(1.959964 * Math.sqrt((0.05 * 0.95) / 45_999) <= 0.002);
  });

  it('grows fourfold when the half-width halves, and always returns k·1000 − 1', () => {
    const r = monteCarloDefaultReplicates(0.001);
    assert.equal((r + 1) % 1000, 0);
    assert.ok(Math.abs((r + 1) / 4 - 46_000) <= 1000);
    assert.equal(monteCarloDefaultReplicates(0.5, 0.5, 0.5), 999);
  });
});
