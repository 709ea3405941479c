import assert from 'node:assert/strict';
import * as fs from 'node:fs';
import * as path from 'node:path';
import { analyze } from '../../src/core/analyze';
import { monteCarloBlockRunner } from '../../src/core/exact/monteCarloBlockRunner';
import { monteCarloGoodnessOfFit } from '../../src/core/exact/monteCarloGoodnessOfFit';
import { monteCarloIndependence } from '../../src/core/exact/monteCarloIndependence';
import { monteCarloIndependenceSpec } from '../../src/core/exact/monteCarloIndependenceSpec';
import type { MonteCarloJobSpec } from '../../src/core/exact/monteCarloJobSpec';
import { monteCarloLogFactorials } from '../../src/core/exact/monteCarloLogFactorials';
import type { MonteCarloStatistic } from '../../src/core/exact/monteCarloOptions';
import { createMonteCarloPool, type MonteCarloPool } from '../../src/node/monteCarloPool';

const root = path.resolve(__dirname, '..', '..', '..');

interface RxcCase { name: string; input: number[][]; expected: number }
interface MultinomialCase { name: string; input: { observed: number[]; proportions: number[] }; expected: { p: string } }

// Exact p-values from outside: test/fixtures/scipy/rxc.json (full enumeration with scipy's gammaln,
// generate_rxc.py) and test/fixtures/python-fractions/exactMultinomial.json (exact rational
// enumeration, generate_exact_simulation.py); versions are recorded in the files.
const rxc = JSON.parse(fs.readFileSync(path.join(root, 'test', 'fixtures', 'scipy', 'rxc.json'), 'utf8')) as { cases: RxcCase[] };
const multinomial = JSON.parse(fs.readFileSync(path.join(root, 'test', 'fixtures', 'python-fractions', 'exactMultinomial.json'), 'utf8')) as { cases: MultinomialCase[] };
const RXC_CASES = ['3x4 N=40 weak #2 (30254 tables)', '3x5 N=30 strong #2 (163412 tables)', '4x4 N=30 weak #2 (224442 tables)'];
const MULTINOMIAL_CASES = ['observed=[7, 2, 1] weights=[1, 1, 1]', 'observed=[4, 22, 4] weights=[1, 5, 2]', 'observed=[8, 15, 7] weights=[1, 4, 2]'];

/** Invented tables with no exact value at hand: a 5×5 and a 10×10 (identity checks only). */
const invented5x5 = [[9, 3, 0, 4, 1], [2, 7, 5, 0, 3], [0, 4, 8, 6, 2], [5, 1, 2, 9, 4], [3, 0, 6, 2, 8]];
const invented10x10 = Array.from({ length: 10 }, (_, i) => Array.from({ length: 10 }, (_, j) => ((i * 7 + j * 3) % 5) + 1 + ((i + j) % 3 === 0 ? 4 : 0)));

/** 21 blocks, the last one short: uneven shares for 2 and 3 threads. */
const REPLICATES = 20_500;
const SEED = 20261202;

function findCase<T extends { name: string }>(cases: T[], name: string): T {
  const found = cases.find((c) => c.name === name);
  assert.ok(found, `fixture case ${name}`);
  return found;
}

describe('createMonteCarloPool', function () {
  this.timeout(60_000);
  const pools = new Map<number, MonteCarloPool>();
  before(() => {
    for (const threads of [1, 2, 3]) pools.set(threads, createMonteCarloPool({ threads }));
  });
  after(async () => {
    for (const pool of pools.values()) await pool.close();
  });

  for (const statistic of ['probability', 'pearson'] as MonteCarloStatistic[]) {
    it(`gives the in-thread count and p for 1, 2 and 3 threads, r×c tables, ${statistic} criterion`, () => {
      const tables: [string, number[][], number | undefined][] = [
        ...RXC_CASES.map((name): [string, number[][], number | undefined] => {
          const c = findCase(rxc.cases, name);
          return [name, c.input, statistic === 'probability' ? c.expected : undefined];
        }),
        ['invented 5×5', invented5x5, undefined],
        ['invented 10×10', invented10x10, undefined],
      ];
      for (const [name, table, exactP] of tables) {
        const here = monteCarloIndependence(table, { replicates: REPLICATES, seed: SEED, statistic });
        assert.ok(here.ok, name);
        for (const [threads, pool] of pools) {
          const pooled = monteCarloIndependence(table, { replicates: REPLICATES, seed: SEED, statistic, runBlocks: pool.runBlocks });
          assert.ok(pooled.ok, `${name}, ${threads} threads`);
          assert.equal(pooled.value.p, here.value.p, `${name}, ${threads} threads`);
          assert.equal(pooled.value.replicates, REPLICATES);
          assert.deepEqual(pooled.value.interval, here.value.interval);
        }
        if (exactP !== undefined) {
          const { lower, upper } = here.value.interval ?? { lower: NaN, upper: NaN };
          assert.ok(lower <= exactP && exactP <= upper, `${name}: exact p ${exactP} (scipy enumeration) outside [${lower}, ${upper}]`);
        }
      }
    });

    it(`gives the in-thread count and p for 1, 2 and 3 threads, goodness of fit, ${statistic} criterion`, () => {
      const cases: [string, number[], number[], number | undefined][] = [
        ...MULTINOMIAL_CASES.map((name): [string, number[], number[], number | undefined] => {
          const c = findCase(multinomial.cases, name);
          return [name, c.input.observed, c.input.proportions, statistic === 'probability' ? Number(c.expected.p) : undefined];
        }),
        // An observation in a category of proportion zero: no replicate is as extreme, p = 1/(R + 1).
        ['impossible category', [3, 1, 2], [1, 0, 1], 1 / (REPLICATES + 1)],
      ];
      for (const [name, observed, proportions, exactP] of cases) {
        const here = monteCarloGoodnessOfFit(observed, proportions, { replicates: REPLICATES, seed: SEED, statistic });
        assert.ok(here.ok, name);
        for (const [threads, pool] of pools) {
          const pooled = monteCarloGoodnessOfFit(observed, proportions, { replicates: REPLICATES, seed: SEED, statistic, runBlocks: pool.runBlocks });
          assert.ok(pooled.ok, `${name}, ${threads} threads`);
          assert.equal(pooled.value.p, here.value.p, `${name}, ${threads} threads`);
        }
        if (exactP !== undefined && name === 'impossible category') assert.equal(here.value.p, exactP);
        else if (exactP !== undefined) {
          const { lower, upper } = here.value.interval ?? { lower: NaN, upper: NaN };
          assert.ok(lower <= exactP && exactP <= upper, `${name}: exact p ${exactP} (rational enumeration) outside [${lower}, ${upper}]`);
        }
      }
    });
  }

  it('returns the counts of the blocks asked for, in their order, as the in-thread runner counts them', () => {
    const table = findCase(rxc.cases, RXC_CASES[0]).input;
    const spec = monteCarloIndependenceSpec(table, 'probability', REPLICATES, SEED, monteCarloLogFactorials(40));
    const runner = monteCarloBlockRunner(spec);
    const blocks = [20, 3, 11, 0, 7];
    const outcome = pools.get(3)?.runBlocks(spec, blocks, {});
    assert.deepEqual(outcome, { ok: true, extreme: blocks.map((block) => runner.countBlock(block)) });
    assert.equal(runner.blockReplicates(20), 500);
  });

  it('gives the same analysis and write-up through the engine with and without the pool', () => {
    const text = ['| Route | On time | Late | Cancelled |', '|---|---|---|---|', '| North | 14 | 3 | 0 |', '| River | 6 | 5 | 2 |', '| Hill | 2 | 7 | 4 |'].join('\n');
    const options = { pValueMethod: 'monte-carlo' as const, replicates: 9_999 };
    const here = analyze({ text, format: 'markdown', options });
    const pooled = analyze({ text, format: 'markdown', options, control: { runBlocks: pools.get(2)?.runBlocks } });
    assert.ok(here.ok && pooled.ok);
    assert.equal(pooled.value.exact?.p, here.value.exact?.p);
    assert.equal(pooled.value.writeUp, here.value.writeUp);
  });

  it('reports progress and returns promptly when cancelled, and the pool works again afterwards', () => {
    const pool = pools.get(2);
    assert.ok(pool);
    const fractions: number[] = [];
    let cancelledAt = 0;
    const result = monteCarloIndependence(invented10x10, {
      replicates: 10_000_000,
      seed: SEED,
      runBlocks: pool.runBlocks,
      budget: {
        timeMs: Number.POSITIVE_INFINITY,
        onProgress: (fraction) => fractions.push(fraction),
        isCancelled: () => {
          if (fractions.length >= 2 && cancelledAt === 0) cancelledAt = performance.now();
          return cancelledAt > 0;
        },
      },
    });
    const stoppedAfterMs = performance.now() - cancelledAt;
    assert.equal(result.ok, false);
    if (!result.ok) assert.equal(result.reason, 'cancelled');
    assert.ok(fractions.length >= 2 && fractions.every((f) => f >= 0 && f < 1), JSON.stringify(fractions));
    assert.ok(stoppedAfterMs < 1000, `stopped ${stoppedAfterMs} ms after the request`);
    const again = monteCarloIndependence(invented5x5, { replicates: 4_999, seed: SEED, runBlocks: pool.runBlocks });
    const here = monteCarloIndependence(invented5x5, { replicates: 4_999, seed: SEED });
    assert.ok(again.ok && here.ok);
    assert.equal(again.value.p, here.value.p);
  });
});

describe('createMonteCarloPool when a worker fails', function () {
  this.timeout(30_000);

  it('reports the error a worker thread throws as a failure with its reason, and recovers on the next run', async () => {
    const pool = createMonteCarloPool({ threads: 2 });
    try {
      const broken: MonteCarloJobSpec = { kind: 'independence', replicates: 2_000, seed: 1, statistic: 'probability', threshold: 0, rowTotals: [3, 4], columnTotals: [5, 5] };
      const outcome = pool.runBlocks(broken, [0, 1], {});
      assert.equal(outcome.ok, false);
      if (!outcome.ok) {
        assert.equal(outcome.reason, 'failed');
        if (outcome.reason === 'failed') assert.match(outcome.message, /stopped unexpectedly \(a worker thread reported: patefieldSampler: the margins must share one total/);
      }
      const again = monteCarloIndependence(invented5x5, { replicates: 2_999, seed: 5, runBlocks: pool.runBlocks });
      const here = monteCarloIndependence(invented5x5, { replicates: 2_999, seed: 5 });
      assert.ok(again.ok && here.ok);
      assert.equal(again.value.p, here.value.p);
    } finally {
      await pool.close();
    }
  });

  it('turns a missing worker file into an Issue of the analysis, naming the one-thread remedy', async () => {
    const pool = createMonteCarloPool({ threads: 2, workerFile: path.join(__dirname, 'no-such-worker.js') });
    try {
      const text = ['| Shift | Passed | Failed |', '|---|---|---|', '| Early | 9 | 1 |', '| Late | 4 | 6 |', '| Night | 2 | 3 |'].join('\n');
      const result = analyze({ text, format: 'markdown', options: { pValueMethod: 'monte-carlo', replicates: 1_999 }, control: { runBlocks: pool.runBlocks } });
      assert.equal(result.ok, false);
      if (!result.ok) {
        assert.equal(result.issue.code, 'unreadable');
        assert.match(result.issue.message, /worker file .*no-such-worker\.js is missing/);
        assert.match(result.issue.message, /monteCarloThreads .*--threads\) to 1/);
      }
    } finally {
      await pool.close();
    }
  });

  it('gives up on a worker that dies silently once it shows no sign of life, without crashing', async () => {
    const pool = createMonteCarloPool({ threads: 2, workerFile: path.join(__dirname, 'exitingPoolWorker.js'), stallMs: 400 });
    try {
      const started = performance.now();
      const outcome = monteCarloIndependence(invented5x5, { replicates: 9_999, seed: 5, runBlocks: pool.runBlocks });
      assert.equal(outcome.ok, false);
      if (!outcome.ok) assert.equal(outcome.reason, 'failed');
      if (!outcome.ok && outcome.reason === 'failed') assert.match(outcome.message, /no worker thread showed progress/);
      assert.ok(performance.now() - started < 5_000);
      // Let the workers' exit events arrive: they are handled, not thrown.
      await new Promise((resolve) => setTimeout(resolve, 100));
    } finally {
      await pool.close();
    }
  });
});
