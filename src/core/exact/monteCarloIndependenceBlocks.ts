import { monteCarloBlockRunner } from './monteCarloBlockRunner';
import { monteCarloCountBlocks } from './monteCarloCountBlocks';
import { monteCarloIndependenceSpec } from './monteCarloIndependenceSpec';
import { monteCarloLogFactorials } from './monteCarloLogFactorials';
import type { MonteCarloBlockRange, MonteCarloComputed, MonteCarloCount, MonteCarloOptions } from './monteCarloOptions';
import { DEFAULT_BUDGET } from './types';

/** Bytes per stored log-factorial (Float64Array) and per cell of the work tables (Int32Array, Float64Array). */
const BYTES_PER_LOG_FACTORIAL = 8;
const BYTES_PER_CELL = 4 + 8;

/**
 * The simulation count b for some blocks of a Monte Carlo test of independence in an r×c table with
 * both margins fixed (tables drawn by Patefield's algorithm AS 159): the unit of work a worker pool
 * splits; counts over disjoint block ranges add up to the single-thread count exactly.
 *
 * Intuition: under independence and given the margins, every rearrangement of the observations is
 * equally likely, so the share of random rearrangements at least as extreme as the data estimates
 * the exact (Freeman–Halton) p-value.
 *
 * ## Method
 * 'probability' (the default, as in the Freeman–Halton test): a table counts when its probability
 * given the margins is at most the observed one's times (1 + RELATIVE_TIE_TOLERANCE); that
 * probability is a constant times 1/Π n_ij!, so the comparison is Σ log n_ij! ≥ Σ log o_ij! − log(1 + tol).
 * 'pearson': a table counts when X² = Σ (n_ij − e_ij)²/e_ij ≥ X²_obs (1 − tol), e_ij = r_i c_j / N,
 * summed without the cancellation of Σ n²/e − N; cells with e_ij = 0 are always empty and add nothing.
 *
 * @param observed - the table: rows of nonnegative integer counts, all rows the same length
 * @param options - replicates R, seed, budget, statistic, and optionally a block hook (a worker pool)
 * @param range - which blocks of REPLICATES_PER_STREAM replicates to simulate (default: all)
 * @returns b and the replicates simulated, or why the budget (or the block hook) stopped it
 */
export function monteCarloIndependenceBlocks(
  observed: readonly (readonly number[])[],
  options: MonteCarloOptions,
  range?: MonteCarloBlockRange,
): MonteCarloComputed<MonteCarloCount> {
  const startedAt = performance.now();
  const rows = observed.length;
  const columns = rows > 0 ? observed[0].length : 0;
  if (rows === 0 || columns === 0 || observed.some((row) => row.length !== columns || row.some((count) => !Number.isSafeInteger(count) || count < 0))) {
    throw new RangeError('monteCarloIndependenceBlocks: the table must be a non-empty grid of nonnegative integer counts');
  }
  if (!Number.isSafeInteger(options.replicates) || options.replicates < 1) {
    throw new RangeError(`monteCarloIndependenceBlocks: replicates must be a positive integer (got ${options.replicates})`);
  }
  const total = observed.reduce((sum, row) => sum + row.reduce((rowSum, count) => rowSum + count, 0), 0);
  const memoryBytes = options.budget?.memoryBytes ?? DEFAULT_BUDGET.memoryBytes;
  if ((total + 1) * BYTES_PER_LOG_FACTORIAL + rows * columns * BYTES_PER_CELL > memoryBytes) {
    return { ok: false, reason: 'memory', elapsedMs: 0 };
  }
  const logFactorials = monteCarloLogFactorials(total);
  const spec = monteCarloIndependenceSpec(observed, options.statistic ?? 'probability', options.replicates, options.seed, logFactorials);
  return monteCarloCountBlocks(spec, () => monteCarloBlockRunner(spec, logFactorials), range, options.budget, options.runBlocks, startedAt);
}
