import { monteCarloCountBlocks } from './monteCarloCountBlocks';
import { monteCarloLogFactorials } from './monteCarloLogFactorials';
import type { MonteCarloBlockRange, MonteCarloCount, MonteCarloOptions } from './monteCarloOptions';
import { patefieldSampler } from './patefieldSampler';
import { DEFAULT_BUDGET, RELATIVE_TIE_TOLERANCE, type Computed } from './types';

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
 * @param options - replicates R, seed, budget, statistic
 * @param range - which blocks of REPLICATES_PER_STREAM replicates to simulate (default: all)
 * @returns b and the replicates simulated, or why the budget stopped it
 */
export function monteCarloIndependenceBlocks(
  observed: readonly (readonly number[])[],
  options: MonteCarloOptions,
  range?: MonteCarloBlockRange,
): Computed<MonteCarloCount> {
  const startedAt = performance.now();
  const rows = observed.length;
  const columns = rows > 0 ? observed[0].length : 0;
  if (rows === 0 || columns === 0 || observed.some((row) => row.length !== columns || row.some((count) => !Number.isSafeInteger(count) || count < 0))) {
    throw new RangeError('monteCarloIndependenceBlocks: the table must be a non-empty grid of nonnegative integer counts');
  }
  if (!Number.isSafeInteger(options.replicates) || options.replicates < 1) {
    throw new RangeError(`monteCarloIndependenceBlocks: replicates must be a positive integer (got ${options.replicates})`);
  }
  const rowTotals = observed.map((row) => row.reduce((sum, count) => sum + count, 0));
  const columnTotals = Array.from({ length: columns }, (_, j) => observed.reduce((sum, row) => sum + row[j], 0));
  const total = rowTotals.reduce((sum, value) => sum + value, 0);
  const memoryBytes = options.budget?.memoryBytes ?? DEFAULT_BUDGET.memoryBytes;
  if ((total + 1) * BYTES_PER_LOG_FACTORIAL + rows * columns * BYTES_PER_CELL > memoryBytes) {
    return { ok: false, reason: 'memory', elapsedMs: 0 };
  }
  const logFactorials = monteCarloLogFactorials(total);
  const sampler = patefieldSampler(rowTotals, columnTotals, logFactorials);
  const cellCount = rows * columns;
  const cells = new Int32Array(cellCount);
  const isExtreme = (options.statistic ?? 'probability') === 'pearson' ? pearsonCriterion() : probabilityCriterion();
  return monteCarloCountBlocks(options.replicates, options.seed, range, options.budget, startedAt, (random) => {
    sampler.sample(random, cells);
    return isExtreme();
  });

  function probabilityCriterion(): () => boolean {
    let observedScore = 0;
    for (const row of observed) for (const count of row) observedScore += logFactorials[count];
    const threshold = observedScore - Math.log1p(RELATIVE_TIE_TOLERANCE);
    return () => {
      let score = 0;
      for (let cell = 0; cell < cellCount; cell++) score += logFactorials[cells[cell]];
      return score >= threshold;
    };
  }

  function pearsonCriterion(): () => boolean {
    const expected = new Float64Array(cellCount);
    const inverseExpected = new Float64Array(cellCount);
    for (let i = 0; i < rows; i++) {
      for (let j = 0; j < columns; j++) {
        const e = total === 0 ? 0 : (rowTotals[i] * columnTotals[j]) / total;
        expected[i * columns + j] = e;
        inverseExpected[i * columns + j] = e > 0 ? 1 / e : 0;
      }
    }
    const statistic = (): number => {
      let sum = 0;
      for (let cell = 0; cell < cellCount; cell++) {
        const difference = cells[cell] - expected[cell];
        sum += difference * difference * inverseExpected[cell];
      }
      return sum;
    };
    for (let i = 0; i < rows; i++) for (let j = 0; j < columns; j++) cells[i * columns + j] = observed[i][j];
    const threshold = statistic() * (1 - RELATIVE_TIE_TOLERANCE);
    return () => statistic() >= threshold;
  }
}
