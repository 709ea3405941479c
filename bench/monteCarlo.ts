/**
 * Monte Carlo throughput: Patefield tables per second (sampler plus the probability criterion, as
 * monteCarloIndependence runs it), the time for 9,999 replicates of large tables, and multinomial
 * outcomes per second for goodness of fit, on one thread; targets from the issue. Then the worker
 * pool (src/node/monteCarloPool.ts): tables per second for 99,999 replicates in this thread, on one
 * and on two pool threads, and the speed-up of two pool threads over one (fresh threads both, so the
 * ratio is not flattered by this process's JIT history; no target: it depends on the free cores).
 */
import { tableFromWeights } from '../test/helpers/randomTables';
import { monteCarloGoodnessOfFit } from '../src/core/exact/monteCarloGoodnessOfFit';
import { monteCarloIndependence } from '../src/core/exact/monteCarloIndependence';
import type { MonteCarloBlockHook } from '../src/core/exact/monteCarloJobSpec';
import { createMonteCarloPool } from '../src/node/monteCarloPool';
import { medianMs, seededRandom, type Figure } from './timing';

const SEED = 20240612;
/** Tables simulated per timed call: enough that per-call set-up is a small share. */
const REPLICATES_PER_CALL = 20_000;

/** A rows × columns table of `total` observations spread unevenly by a seeded generator. */
function randomTable(rows: number, columns: number, total: number, seed: number): number[][] {
  const random = seededRandom(seed);
  const rowWeights = Array.from({ length: rows }, () => 0.5 + random());
  const columnWeights = Array.from({ length: columns }, () => 0.5 + random());
  const weights = rowWeights.flatMap((r) => columnWeights.map((c) => r * c * (0.7 + 0.6 * random())));
  return tableFromWeights(random, weights, rows, columns, total);
}

function tablesPerSecond(rows: number, columns: number, total: number): number {
  const table = randomTable(rows, columns, total, SEED + rows * 100 + columns);
  const ms = medianMs(() => {
    const result = monteCarloIndependence(table, { replicates: REPLICATES_PER_CALL, seed: 1, budget: { timeMs: 60_000 } });
    if (!result.ok) throw new Error(`benchmark run stopped: ${result.reason}`);
  }, 1000);
  return (REPLICATES_PER_CALL / ms) * 1000;
}

function msFor9999(rows: number, columns: number, total: number): number {
  const table = randomTable(rows, columns, total, SEED + 7);
  return medianMs(() => monteCarloIndependence(table, { replicates: 9_999, seed: 2, budget: { timeMs: 60_000 } }), 1000);
}

function outcomesPerSecond(categories: number, total: number): number {
  const random = seededRandom(SEED + categories);
  const proportions = Array.from({ length: categories }, () => 0.5 + random());
  const observed = proportions.map((p) => Math.round((p / proportions.reduce((s, v) => s + v, 0)) * total));
  const ms = medianMs(() => monteCarloGoodnessOfFit(observed, proportions, { replicates: REPLICATES_PER_CALL, seed: 3, budget: { timeMs: 60_000 } }), 1000);
  return (REPLICATES_PER_CALL / ms) * 1000;
}

/** Replicates of the pool figures: a realistic long run (100 blocks). */
const POOL_REPLICATES = 99_999;
/** Timed runs per configuration after one warm-up run each (which also starts the threads); medians are shown. */
const POOL_RUNS = 5;

/**
 * Tables per second for each block hook (undefined: this thread), the runs interleaved so that a
 * shared machine's changing load falls on every configuration alike.
 */
function interleavedTablesPerSecond(table: number[][], hooks: (MonteCarloBlockHook | undefined)[]): number[] {
  const once = (runBlocks: MonteCarloBlockHook | undefined): number => {
    const start = performance.now();
    const result = monteCarloIndependence(table, { replicates: POOL_REPLICATES, seed: 4, runBlocks, budget: { timeMs: 600_000 } });
    if (!result.ok) throw new Error(`benchmark run stopped: ${result.reason}`);
    return performance.now() - start;
  };
  hooks.forEach(once);
  const times = hooks.map((): number[] => []);
  for (let run = 0; run < POOL_RUNS; run++) hooks.forEach((hook, k) => times[k].push(once(hook)));
  return times.map((list) => {
    list.sort((a, b) => a - b);
    return (POOL_REPLICATES / list[Math.floor(list.length / 2)]) * 1000;
  });
}

async function poolFigures(): Promise<Figure[]> {
  const figures: Figure[] = [];
  const pools = [createMonteCarloPool({ threads: 1 }), createMonteCarloPool({ threads: 2 })];
  try {
    for (const [rows, columns, total] of [
      [5, 5, 1000],
      [10, 10, 1000],
    ]) {
      const table = randomTable(rows, columns, total, SEED + rows * 100 + columns);
      const label = `${rows}×${columns}, N = ${total.toLocaleString('en')}, 99,999 replicates`;
      const [here, one, two] = interleavedTablesPerSecond(table, [undefined, pools[0].runBlocks, pools[1].runBlocks]);
      figures.push({ name: `Patefield ${label}, in this thread`, value: here, unit: 'tables/s' });
      figures.push({ name: `Patefield ${label}, 1 pool thread`, value: one, unit: 'tables/s' });
      figures.push({ name: `Patefield ${label}, 2 pool threads`, value: two, unit: 'tables/s' });
      figures.push({ name: `speed-up of 2 pool threads over 1, ${rows}×${columns}`, value: two / one, unit: '×' });
    }
  } finally {
    await Promise.all(pools.map((pool) => pool.close()));
  }
  return figures;
}

export async function benchMonteCarlo(): Promise<Figure[]> {
  const figures: Figure[] = [];
  for (const [rows, columns, total] of [
    [2, 2, 100],
    [3, 3, 300],
    [4, 6, 500],
    [5, 5, 200],
    [5, 5, 1000],
  ]) {
    figures.push({ name: `Patefield ${rows}×${columns}, N = ${total}`, value: tablesPerSecond(rows, columns, total), unit: 'tables/s', target: { value: 300_000, better: 'higher' } });
  }
  figures.push({ name: 'Patefield 10×10, N = 1,000', value: tablesPerSecond(10, 10, 1000), unit: 'tables/s', target: { value: 80_000, better: 'higher' } });
  for (const [rows, columns, total] of [
    [10, 10, 1000],
    [10, 10, 10_000],
    [4, 25, 2000],
  ]) {
    figures.push({ name: `9,999 Patefield replicates, ${rows}×${columns}, N = ${total.toLocaleString('en')}`, value: msFor9999(rows, columns, total), unit: 'ms', target: { value: 200, better: 'lower' } });
  }
  figures.push({ name: 'multinomial outcomes, k = 6, N = 100', value: outcomesPerSecond(6, 100), unit: 'draws/s' });
  figures.push({ name: 'multinomial outcomes, k = 20, N = 2,000', value: outcomesPerSecond(20, 2000), unit: 'draws/s' });
  figures.push(...(await poolFigures()));
  return figures;
}
