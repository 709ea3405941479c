/**
 * Freeman–Halton exact test by the network algorithm: worst time per table size over random and
 * adversarial tables (uniform cells, one dominant cell, weak association with p near 1/2, strong
 * diagonal association with a tiny p, strong association by blocks of columns). The issue asks for
 * under 1 s at each size listed here; for 2 × c it asks for any c at N = 200, so widths from 2 to 40
 * are measured (the hardest lie around 12–25 columns).
 */
import { tableFromWeights } from '../test/helpers/randomTables';
import { freemanHaltonExact } from '../src/core/exact/network/freemanHaltonExact';
import { medianMs, seededRandom, type Figure } from './timing';

const SEED = 20240611;
const TARGET_MS = 1000;
/** Each size is measured on this many tables of each kind. */
const TABLES_PER_KIND = 3;
/** Tables slower than this are timed as the median of a few runs instead of medianMs' batches. */
const SLOW_TABLE_MS = 50;
const SLOW_TABLE_RUNS = 3;
/** Long enough for every table here to finish; a stop would be reported as a failure. */
const BENCH_BUDGET = { timeMs: 120_000 };

type Kind = 'uniform' | 'dominant' | 'weak' | 'strong' | 'blocks';
const KINDS: Kind[] = ['uniform', 'dominant', 'weak', 'strong', 'blocks'];

/** [rows, columns, N] as the issue lists them. */
const SIZES: [number, number, number][] = [
  [2, 2, 200], [2, 6, 200], [2, 10, 200], [2, 15, 200], [2, 20, 200], [2, 25, 200], [2, 30, 200], [2, 40, 200],
  [3, 3, 150], [4, 4, 60], [5, 5, 50], [6, 6, 50],
];

interface SizeResult {
  size: string;
  total: number;
  worstMs: number;
  /** CPU time of the table that was slowest in wall time. */
  worstCpuMs: number;
  worstKind: Kind;
  worstP: number;
}

function cellWeights(random: () => number, rows: number, columns: number, kind: Kind): number[] {
  const weights: number[] = [];
  const rowEffect = Array.from({ length: rows }, () => 0.5 + random());
  const columnEffect = Array.from({ length: columns }, () => 0.5 + random());
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < columns; j++) {
      if (kind === 'uniform') weights.push(1);
      else if (kind === 'dominant') weights.push(i === 0 && j === 0 ? rows * columns : 1);
      else if (kind === 'weak') weights.push(rowEffect[i] * columnEffect[j]);
      else if (kind === 'strong') weights.push(i === j % rows ? 4 : 1);
      // Row i dominates the i-th block of neighbouring columns (for two rows: the two halves).
      else weights.push(i === Math.floor((j * rows) / columns) ? 4 : 1);
    }
  }
  return weights;
}

function randomTable(random: () => number, rows: number, columns: number, total: number, kind: Kind): number[][] {
  const weights = cellWeights(random, rows, columns, kind);
  return tableFromWeights(random, weights, rows, columns, total);
}

/** CPU milliseconds of this process since `start` (user + system): less sensitive to other jobs than wall time. */
function cpuMsSince(start: NodeJS.CpuUsage): number {
  const used = process.cpuUsage(start);
  return (used.user + used.system) / 1000;
}

function timeTable(table: number[][]): { ms: number; cpuMs: number; p: number } {
  const run = (): number => {
    const result = freemanHaltonExact(table, BENCH_BUDGET);
    if (!result.ok) throw new Error(`benchmark table stopped (${result.reason}): ${JSON.stringify(table)}`);
    return result.value.p;
  };
  const start = performance.now();
  const cpuStart = process.cpuUsage();
  const p = run();
  const first = performance.now() - start;
  const firstCpu = cpuMsSince(cpuStart);
  if (first < SLOW_TABLE_MS) {
    const ms = medianMs(run, 200);
    return { ms, cpuMs: Math.min(ms, firstCpu), p };
  }
  const samples = [first];
  const cpuSamples = [firstCpu];
  for (let k = 1; k < SLOW_TABLE_RUNS; k++) {
    const again = performance.now();
    const cpuAgain = process.cpuUsage();
    run();
    samples.push(performance.now() - again);
    cpuSamples.push(cpuMsSince(cpuAgain));
  }
  const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
  return { ms: median(samples), cpuMs: median(cpuSamples), p };
}

let measured: SizeResult[] | undefined;

function measureAll(): SizeResult[] {
  if (measured) return measured;
  const random = seededRandom(SEED);
  measured = SIZES.map(([rows, columns, total]) => {
    let worst: SizeResult = { size: `${rows}×${columns}`, total, worstMs: 0, worstCpuMs: 0, worstKind: 'uniform', worstP: 1 };
    for (const kind of KINDS) {
      for (let k = 0; k < TABLES_PER_KIND; k++) {
        const { ms, cpuMs, p } = timeTable(randomTable(random, rows, columns, total, kind));
        if (ms > worst.worstMs) worst = { ...worst, worstMs: ms, worstCpuMs: cpuMs, worstKind: kind, worstP: p };
      }
    }
    return worst;
  });
  return measured;
}

/** Worst milliseconds per table size (each size: TABLES_PER_KIND tables of each kind). */
export function benchNetworkExact(): Figure[] {
  // Wall time is the target; the CPU time beside it shows how much of a miss is other jobs on a shared machine.
  return measureAll().flatMap((result) => [
    {
      name: `Freeman–Halton exact ${result.size}, N = ${result.total} (worst: ${result.worstKind})`,
      value: result.worstMs,
      unit: 'ms',
      target: { value: TARGET_MS, better: 'lower' as const },
    },
    { name: `  the same table, CPU time`, value: result.worstCpuMs, unit: 'ms' },
  ]);
}

/** The same measurements as Markdown table rows for the docs: size, N, worst ms, kind of table, its p. */
export function feasibilityTable(): string {
  const lines = ['| Table | N | Worst time (ms) | Hardest kind | Its p |', '|---|---:|---:|---|---:|'];
  for (const result of measureAll()) {
    lines.push(`| ${result.size} | ${result.total} | ${result.worstMs.toFixed(0)} | ${result.worstKind} | ${result.worstP.toPrecision(2)} |`);
  }
  return lines.join('\n');
}
