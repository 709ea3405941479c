import { createReadStream } from 'node:fs';
import { mkdtemp, rm, stat, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'csv-parse';
import { createCrossTabulator } from '../src/core/table/crossTabulate';
import { generateRawCsv } from './generateRawCsv';
import type { Figure } from './timing';

const ROWS = 1_000_000;
const SEED = 20240611;
const CHUNK_BYTES = 64 * 1024;
const REPEATS = 5;
const MEGABYTE = 1e6;
/** Throughput the issue asks for on one core (stretch goal 100 MB/s). */
const TARGET_MB_PER_S = 40;

interface Timing {
  /** Wall-clock seconds. */
  seconds: number;
  /** CPU seconds of the whole process (user + system), less disturbed by other load on a shared machine. */
  cpuSeconds: number;
}

interface OurRun extends Timing {
  peakRss: number;
  rssIncrease: number;
  heapIncrease: number;
}

function startTiming(): { wall: number; cpu: NodeJS.CpuUsage } {
  return { wall: performance.now(), cpu: process.cpuUsage() };
}

function stopTiming(start: { wall: number; cpu: NodeJS.CpuUsage }): Timing {
  const cpu = process.cpuUsage(start.cpu);
  return { seconds: (performance.now() - start.wall) / 1000, cpuSeconds: (cpu.user + cpu.system) / 1e6 };
}

function collectGarbage(): void {
  (globalThis as { gc?: () => void }).gc?.();
}

async function runOurs(file: string): Promise<OurRun> {
  collectGarbage();
  const before = process.memoryUsage();
  let peakRss = before.rss;
  let peakHeap = before.heapUsed;
  const start = startTiming();
  const tabulator = createCrossTabulator();
  for await (const chunk of createReadStream(file, { encoding: 'utf8', highWaterMark: CHUNK_BYTES })) {
    tabulator.push(chunk as string);
    const memory = process.memoryUsage();
    if (memory.rss > peakRss) peakRss = memory.rss;
    if (memory.heapUsed > peakHeap) peakHeap = memory.heapUsed;
  }
  const result = tabulator.finish();
  const timing = stopTiming(start);
  if (!result.ok) throw new Error(`benchmark input was rejected: ${result.issue.message}`);
  const counted = result.value.observed.flat().reduce((sum, count) => sum + count, 0);
  if (counted !== ROWS) throw new Error(`benchmark counted ${counted} rows, expected ${ROWS}`);
  return { ...timing, peakRss, rssIncrease: peakRss - before.rss, heapIncrease: peakHeap - before.heapUsed };
}

async function runCsvParse(file: string): Promise<Timing> {
  collectGarbage();
  const start = startTiming();
  const records = await new Promise<number>((resolve, reject) => {
    let count = 0;
    const parser = parse();
    parser.on('readable', () => {
      while (parser.read() !== null) count++;
    });
    parser.on('error', reject);
    parser.on('end', () => resolve(count));
    createReadStream(file, { highWaterMark: CHUNK_BYTES }).on('error', reject).pipe(parser);
  });
  if (records !== ROWS + 1) throw new Error(`csv-parse read ${records} records, expected ${ROWS + 1}`);
  return stopTiming(start);
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

/**
 * Streams a generated 1,000,000-row bus-breakdown CSV from a temporary file through `createCrossTabulator`
 * (64 KiB chunks, default columns) and through csv-parse's stream parser (records counted only), and returns
 * the median throughput of each over `REPEATS` runs after a warm-up run (per CPU second and by wall clock;
 * MB = 10^6 bytes), our memory use, and the throughput ratio. Nothing is printed; `bench/run.ts` shows them.
 */
export async function benchCrossTabulate(): Promise<Figure[]> {
  const directory = await mkdtemp(join(tmpdir(), 'tallywise-bench-'));
  const file = join(directory, 'bus-breakdowns.csv');
  try {
    await writeFile(file, generateRawCsv(ROWS, SEED));
    const megabytes = (await stat(file)).size / MEGABYTE;
    // The first run of each also warms up the JIT; it is reported on its own and left out of the medians.
    const ourColdRun = await runOurs(file);
    const ours: OurRun[] = [];
    for (let run = 0; run < REPEATS; run++) ours.push(await runOurs(file));
    await runCsvParse(file);
    const theirs: Timing[] = [];
    for (let run = 0; run < REPEATS; run++) theirs.push(await runCsvParse(file));
    const throughput = (runs: Timing[], key: keyof Timing): number => megabytes / median(runs.map((run) => run[key]));
    const oursPerCpu = throughput(ours, 'cpuSeconds');
    const theirsPerCpu = throughput(theirs, 'cpuSeconds');
    return [
      { name: 'generated raw CSV size', value: megabytes, unit: 'MB' },
      { name: 'crossTabulate streaming from file, 64 KiB chunks (per CPU second)', value: oursPerCpu, unit: 'MB/s', target: { value: TARGET_MB_PER_S, better: 'higher' } },
      { name: 'crossTabulate streaming from file, 64 KiB chunks (wall clock)', value: throughput(ours, 'seconds'), unit: 'MB/s' },
      { name: 'crossTabulate first run, JIT still warming up (wall clock)', value: megabytes / ourColdRun.seconds, unit: 'MB/s' },
      { name: 'crossTabulate peak RSS (whole process)', value: Math.max(...ours.map((run) => run.peakRss)) / MEGABYTE, unit: 'MB' },
      { name: 'crossTabulate RSS increase during a run', value: median(ours.map((run) => run.rssIncrease)) / MEGABYTE, unit: 'MB' },
      { name: 'crossTabulate peak heap increase during a run', value: median(ours.map((run) => run.heapIncrease)) / MEGABYTE, unit: 'MB' },
      { name: 'csv-parse stream parse, counting records (per CPU second)', value: theirsPerCpu, unit: 'MB/s' },
      { name: 'csv-parse stream parse, counting records (wall clock)', value: throughput(theirs, 'seconds'), unit: 'MB/s' },
      { name: 'crossTabulate / csv-parse throughput (per CPU second)', value: oursPerCpu / theirsPerCpu, unit: 'x' },
    ];
  } finally {
    await rm(directory, { recursive: true, force: true });
  }
}
