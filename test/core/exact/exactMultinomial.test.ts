import assert from 'node:assert/strict';
import * as fs from 'node:fs';
import * as path from 'node:path';
import { exactMultinomial } from '../../../src/core/exact/exactMultinomial';
import { assertClose } from '../../helpers/assertClose';
import { exactGoodnessOfFitP, testInputs } from './bruteForce';
import { tableFromWeights } from '../../helpers/randomTables';

interface Fixture {
  generator: string;
  reference: string;
  referenceVersion: string;
  cases: { name: string; input: { observed: number[]; proportions: number[] }; expected: { p: number | string }; tolerance: number }[];
}
const fixture = (relative: string): Fixture => JSON.parse(fs.readFileSync(path.resolve(__dirname, '../../../../test/fixtures', relative), 'utf8')) as Fixture;

function pOf(observed: number[], proportions: number[], budget?: Parameters<typeof exactMultinomial>[2]): number {
  const result = exactMultinomial(observed, proportions, budget);
  assert.ok(result.ok, `stopped: ${JSON.stringify(result)}`);
  assert.equal(result.value.method, 'exact-multinomial');
  assert.ok(result.value.p >= 0 && result.value.p <= 1);
  return result.value.p;
}

describe('exactMultinomial', () => {
  it('matches full enumeration of the definition on 400 seeded small cases', () => {
    const next = testInputs(4242);
    for (let c = 0; c < 400; c++) {
      const k = 2 + Math.floor(next() * 5);
      const total = Math.floor(next() * (k <= 3 ? 40 : k === 4 ? 22 : 14));
      const equal = next() < 0.35;
      const proportions = Array.from({ length: k }, () => (equal ? 1 : 0.2 + Math.floor(next() * 6) / 2));
      const skew = proportions.map((p) => p * (0.2 + 2 * next()));
      const observed = tableFromWeights(next, skew, 1, k, total)[0];
      const expected = Math.min(1, exactGoodnessOfFitP(observed, proportions, 'probability'));
      assertClose(pOf(observed, proportions), expected, 1e-11, { observed, proportions });
    }
  });

  it('matches exact rational enumeration (Python fractions fixture, 44 cases)', () => {
    const { reference, cases } = fixture('python-fractions/exactMultinomial.json');
    assert.equal(reference, 'python-fractions');
    for (const { input, expected, tolerance } of cases) {
      assertClose(pOf(input.observed, input.proportions), Number(expected.p), tolerance, input);
    }
  });

  it('equals the two-sided binomial test when k = 2 (scipy.stats.binomtest fixture, 40 cases)', () => {
    const { reference, cases } = fixture('scipy/binomialTwoSided.json');
    assert.equal(reference, 'scipy');
    for (const { input, expected, tolerance } of cases) {
      assertClose(pOf(input.observed, input.proportions), Number(expected.p), tolerance, input);
    }
  });

  it('gives p = 3/27 for three of a kind in three equally likely categories (by hand)', () => {
    // The outcomes as improbable as (3, 0, 0) are its three rotations, each of probability 1/27.
    assertClose(pOf([3, 0, 0], [1, 1, 1]), 3 / 27, 1e-14);
    assertClose(pOf([0, 3, 0], [5, 5, 5]), 3 / 27, 1e-14, 'proportions are normalised');
  });

  it('gives p = 1 for one category, no observations, or the most probable outcome', () => {
    assert.equal(pOf([17], [1]), 1);
    assert.equal(pOf([0, 0, 0], [1, 2, 3]), 1);
    assertClose(pOf([10, 10, 10], [1, 1, 1]), 1, 1e-12);
  });

  it('leaves out empty categories of proportion zero and gives p = 0 when one is not empty', () => {
    assertClose(pOf([4, 0, 6, 2], [2, 0, 3, 1]), pOf([4, 6, 2], [2, 3, 1]), 1e-14);
    const impossible = exactMultinomial([4, 1, 6], [2, 0, 3]);
    assert.ok(impossible.ok);
    assert.equal(impossible.value.p, 0);
    assert.equal(impossible.value.log10p, -Infinity);
  });

  it('keeps log10 p accurate far below the smallest double', () => {
    // (N, 0, 0): only the three corner outcomes are as improbable, so p = 3 · 3^−N exactly.
    const result = exactMultinomial([700, 0, 0], [1, 1, 1]);
    assert.ok(result.ok);
    assertClose(result.value.log10p, Math.log10(3) - 700 * Math.log10(3), 1e-12);
  });

  it('gives the same p without the pair tables (a tight memory budget) as with them', () => {
    const next = testInputs(77);
    for (let c = 0; c < 40; c++) {
      const k = 2 + Math.floor(next() * 3);
      const observed = Array.from({ length: k }, () => Math.floor(next() * 40));
      const proportions = Array.from({ length: k }, () => 0.5 + next());
      const total = observed.reduce((s, v) => s + v, 0);
      // Enough for the log-factorial and bound tables, not for the (N + 1)(N + 2)/2 pair table.
      const tight = (total + 1) * (k + 1) * 8 + (total + 1) * 8;
      assertClose(pOf(observed, proportions, { memoryBytes: tight }), pOf(observed, proportions), 1e-12, { observed, proportions });
    }
  });

  it('is fast enough for k = 6, N = 100 and stops on time, memory and cancellation budgets', () => {
    const heavy = [30, 5, 18, 17, 14, 16];
    const proportions = [1, 1.1, 1.2, 1.3, 1.4, 2];
    const timed = exactMultinomial(heavy, proportions, { timeMs: 5 });
    assert.ok(!timed.ok && timed.reason === 'time' && timed.elapsedMs < 300, JSON.stringify(timed));
    const memory = exactMultinomial(heavy, proportions, { memoryBytes: 2000 });
    assert.ok(!memory.ok && memory.reason === 'memory');
    const cancelled = exactMultinomial(heavy, proportions, { isCancelled: () => true });
    assert.ok(!cancelled.ok && cancelled.reason === 'cancelled', JSON.stringify(cancelled));
    const fractions: number[] = [];
    const full = exactMultinomial(heavy, proportions, { onProgress: (f) => fractions.push(f) });
    assert.ok(full.ok);
    assert.ok(fractions.every((f, i) => f >= 0 && f <= 1 && (i === 0 || f >= fractions[i - 1])));
  });

  it('treats malformed input as a programmer error', () => {
    assert.throws(() => exactMultinomial([1, 2], [1]), RangeError);
    assert.throws(() => exactMultinomial([1, -2], [1, 1]), RangeError);
    assert.throws(() => exactMultinomial([1, 2], [0, 0]), RangeError);
    assert.throws(() => exactMultinomial([1.5, 2], [1, 1]), RangeError);
  });
});
