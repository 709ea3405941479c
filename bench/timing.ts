/** Shared timing helpers for the benchmarks: warm up, then take the median of repeated runs. */

export interface Figure {
  name: string;
  value: number;
  unit: string;
  /** Target the issue sets, in the same unit, and whether lower or higher is better. */
  target?: { value: number; better: 'lower' | 'higher' };
}

/** Median milliseconds per call of `run`, after warm-up, over batches sized to take ~`budgetMs`. */
export function medianMs(run: () => unknown, budgetMs = 300): number {
  const warmUpUntil = performance.now() + budgetMs / 3;
  let calls = 0;
  while (performance.now() < warmUpUntil) {
    run();
    calls += 1;
  }
  const perBatch = Math.max(1, Math.ceil(calls / 10));
  const samples: number[] = [];
  const stopAt = performance.now() + budgetMs;
  while (samples.length < 5 || (performance.now() < stopAt && samples.length < 200)) {
    const start = performance.now();
    for (let i = 0; i < perBatch; i++) run();
    samples.push((performance.now() - start) / perBatch);
  }
  samples.sort((a, b) => a - b);
  return samples[Math.floor(samples.length / 2)];
}

export { seededRandom } from '../test/helpers/randomTables';
