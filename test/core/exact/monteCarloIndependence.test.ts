import assert from 'node:assert/strict';
import * as fs from 'node:fs';
import * as path from 'node:path';
import { monteCarloIndependence } from '../../../src/core/exact/monteCarloIndependence';
import { monteCarloIndependenceBlocks } from '../../../src/core/exact/monteCarloIndependenceBlocks';
import { monteCarloPValue } from '../../../src/core/exact/monteCarloPValue';
import { REPLICATES_PER_STREAM } from '../../../src/core/exact/random';
import { exactIndependenceP, margins, testInputs } from './bruteForce';

interface FisherFixture {
  generator: string;
  reference: string;
  referenceVersion: string;
  cases: { name: string; input: { table: number[][] }; expected: { p: number } }[];
}
const fisher = JSON.parse(
  fs.readFileSync(path.resolve(__dirname, '../../../../test/fixtures/scipy/fisherTwoByTwo.json'), 'utf8'),
) as FisherFixture;

/** A random small table with no empty row or column. */
function smallTable(next: () => number): number[][] {
  for (;;) {
    const rows = 2 + Math.floor(next() * 2);
    const columns = 2 + Math.floor(next() * 3);
    const total = 8 + Math.floor(next() * (rows * columns > 8 ? 10 : 16));
    const table = Array.from({ length: rows }, () => new Array<number>(columns).fill(0));
    const skew = Array.from({ length: rows * columns }, () => 0.05 + 3 * next() ** 2);
    const skewSum = skew.reduce((s, v) => s + v, 0);
    for (let n = 0; n < total; n++) {
      let u = next() * skewSum;
      let cell = 0;
      while (u > skew[cell] && cell < skew.length - 1) u -= skew[cell++];
      table[Math.floor(cell / columns)][cell % columns] += 1;
    }
    const { rowTotals, columnTotals } = margins(table);
    if (rowTotals.every((r) => r > 0) && columnTotals.every((c) => c > 0)) return table;
  }
}

/**
 * Clopper–Pearson intervals at 99% cover the exact p with probability ≥ 0.99 each; over the cases
 * below, more than this many misses would have probability < 0.002 (binomial, n = 48, 1%).
 */
const ALLOWED_MISSES = 3;

describe('monteCarloIndependence', () => {
  for (const statistic of ['probability', 'pearson'] as const) {
    it(`brackets the exact p (enumeration) within its 99% interval on 24 seeded tables, ${statistic} criterion`, () => {
      const next = testInputs(statistic === 'probability' ? 101 : 202);
      const misses: string[] = [];
      for (let c = 0; c < 24; c++) {
        const table = smallTable(next);
        const exact = Math.min(1, exactIndependenceP(table, statistic)); // the enumerated sum can round above 1
        const result = monteCarloIndependence(table, { replicates: 20_000, seed: 1000 + c, statistic });
        assert.ok(result.ok);
        const { p, interval } = result.value;
        assert.ok(interval !== undefined && interval.level === 0.99);
        assert.ok(interval.lower <= p && p <= interval.upper, 'the estimate lies in its interval');
        // Monte Carlo error: 5 standard errors of b/R at the exact p, plus the 1/(R + 1) offset.
        assert.ok(Math.abs(p - exact) < 5 * Math.sqrt((exact * (1 - exact)) / 20_000) + 1e-4, `${JSON.stringify(table)}: ${p} vs exact ${exact}`);
        if (exact < interval.lower || exact > interval.upper) misses.push(`${JSON.stringify(table)} exact ${exact} outside [${interval.lower}, ${interval.upper}]`);
      }
      assert.ok(misses.length <= ALLOWED_MISSES, misses.join('\n'));
    });
  }

  it('agrees with scipy.stats.fisher_exact on 2×2 tables (fixture, 30 tables)', () => {
    assert.equal(fisher.reference, 'scipy');
    let misses = 0;
    for (const [index, { input, expected }] of fisher.cases.entries()) {
      const result = monteCarloIndependence(input.table, { replicates: 20_000, seed: index });
      assert.ok(result.ok && result.value.interval);
      const { p, interval } = result.value;
      assert.ok(Math.abs(p - expected.p) < 5 * Math.sqrt((expected.p * (1 - expected.p)) / 20_000) + 1e-4, `${JSON.stringify(input.table)}: ${p} vs ${expected.p}`);
      if (expected.p < interval.lower || expected.p > interval.upper) misses += 1;
    }
    assert.ok(misses <= ALLOWED_MISSES, `${misses} intervals missed scipy's p`);
  });

  it('reports method, seed, replicates and p = (b + 1)/(R + 1)', () => {
    const table = [
      [9, 2, 4],
      [3, 8, 5],
    ];
    const result = monteCarloIndependence(table, { replicates: 2500, seed: 77 });
    assert.ok(result.ok);
    const count = monteCarloIndependenceBlocks(table, { replicates: 2500, seed: 77 });
    assert.ok(count.ok);
    assert.equal(result.value.method, 'monte-carlo-patefield');
    assert.equal(result.value.seed, 77);
    assert.equal(result.value.replicates, 2500);
    assert.equal(result.value.p, (count.value.extreme + 1) / 2501);
    assert.equal(result.value.log10p, Math.log10(result.value.p));
  });

  it('is deterministic: the same seed gives the same p, another seed another draw', () => {
    const table = [
      [12, 5, 7, 3],
      [4, 9, 6, 11],
      [8, 8, 2, 6],
    ];
    const run = (seed: number): number => {
      const result = monteCarloIndependence(table, { replicates: 3333, seed });
      assert.ok(result.ok);
      return result.value.p;
    };
    assert.equal(run(5), run(5));
    assert.notEqual(run(5), run(6));
  });

  it('gives the single-run count when blocks are split, reordered and summed', () => {
    const table = [
      [14, 6, 3],
      [5, 11, 9],
      [2, 7, 12],
    ];
    const options = { replicates: 7_500, seed: 31 } as const;
    const whole = monteCarloIndependenceBlocks(table, options);
    assert.ok(whole.ok);
    assert.equal(whole.value.replicates, 7_500);
    const blocks = Math.ceil(options.replicates / REPLICATES_PER_STREAM);
    for (const cuts of [[3], [1, 2, 6], [7], [0, 4]]) {
      const edges = [0, ...cuts, blocks];
      const parts = edges.slice(1).map((end, i) => ({ firstBlock: edges[i], blockCount: end - edges[i] }));
      let extreme = 0;
      let replicates = 0;
      for (const range of parts.reverse()) {
        const part = monteCarloIndependenceBlocks(table, options, range);
        assert.ok(part.ok);
        extreme += part.value.extreme;
        replicates += part.value.replicates;
      }
      assert.deepEqual({ extreme, replicates }, { extreme: whole.value.extreme, replicates: whole.value.replicates }, `cuts ${cuts}`);
      const pooled = monteCarloPValue({ extreme, replicates, elapsedMs: 0 }, options.seed, 'monte-carlo-patefield');
      const single = monteCarloIndependence(table, options);
      assert.ok(single.ok);
      assert.equal(pooled.p, single.value.p);
    }
  });

  it('gives p = 1 when the margins allow a single table', () => {
    for (const table of [[[4, 7, 0]], [[3], [5]], [[0, 0], [6, 0]]]) {
      const result = monteCarloIndependence(table, { replicates: 999, seed: 1 });
      assert.ok(result.ok);
      assert.equal(result.value.p, 1);
    }
  });

  it('stops on the time budget, on cancellation and on the memory budget', () => {
    const table = [
      [300, 200, 100],
      [150, 250, 120],
    ];
    const timed = monteCarloIndependence(table, { replicates: 50_000_000, seed: 1, budget: { timeMs: 30 } });
    assert.ok(!timed.ok && timed.reason === 'time' && timed.elapsedMs < 500);
    const cancelled = monteCarloIndependence(table, { replicates: 50_000_000, seed: 1, budget: { isCancelled: () => true } });
    assert.ok(!cancelled.ok && cancelled.reason === 'cancelled' && cancelled.elapsedMs < 500);
    const memory = monteCarloIndependence(table, { replicates: 1000, seed: 1, budget: { memoryBytes: 1000 } });
    assert.ok(!memory.ok && memory.reason === 'memory');
  });

  it('reports progress as increasing fractions in [0, 1]', () => {
    const fractions: number[] = [];
    const table = Array.from({ length: 6 }, (_, i) => Array.from({ length: 6 }, (_, j) => 20 + ((i * 7 + j * 3) % 11)));
    const result = monteCarloIndependence(table, { replicates: 60_000, seed: 3, budget: { onProgress: (f) => fractions.push(f) } });
    assert.ok(result.ok);
    assert.ok(fractions.length >= 1, 'at least one progress call on a run of a few hundred milliseconds');
    assert.ok(fractions.every((f, i) => f >= 0 && f <= 1 && (i === 0 || f >= fractions[i - 1])));
  });

  it('treats malformed tables and replicate counts as programmer errors', () => {
    assert.throws(() => monteCarloIndependence([[1, 2], [3]], { replicates: 10, seed: 1 }), RangeError);
    assert.throws(() => monteCarloIndependence([[1, -2]], { replicates: 10, seed: 1 }), RangeError);
    assert.throws(() => monteCarloIndependence([[1, 2]], { replicates: 0, seed: 1 }), RangeError);
    assert.throws(() => monteCarloIndependenceBlocks([[1, 2]], { replicates: 10, seed: 1 }, { firstBlock: 1, blockCount: 1 }), RangeError);
  });
});
