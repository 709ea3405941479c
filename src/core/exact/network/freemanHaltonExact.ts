import { DEFAULT_BUDGET, RELATIVE_TIE_TOLERANCE, type Budget, type Computed, type ExactPValue, type Stopped } from '../types';
import { logFactorialTable } from './logFactorialTable';
import { networkSearch, type LogMass, type NetworkProblem } from './networkSearch';
import { SearchGuard } from './searchGuard';
import { twoRowNetworkSearch } from './twoRowNetworkSearch';

/**
 * Past values that agree within 2^−44 of the largest possible value (log N!, at least 16) are merged:
 * a few hundred units in the last place, enough to absorb the rounding of sums taken in different
 * orders, and far below the tie tolerance. (The two-row search merges in each pass of its run merges,
 * so a value may move by ⌈log₂ runs⌉ such widths, at most ~1e-9 here; weights are always kept whole.)
 */
const MERGE_RELATIVE_WIDTH = 2 ** -44;
const MERGE_SMALLEST_SCALE = 16;
/** Margins are held in Int32Arrays; a larger total could not be searched within any memory anyway. */
const LARGEST_TOTAL = 2 ** 31 - 1;

/**
 * Freeman–Halton exact test for an r × c table: the probability, given both margins, of all tables
 * with those margins that are no more probable than the observed one (Freeman & Halton 1951,
 * Biometrika 38, 141–149), computed with the network algorithm of Mehta & Patel (1983, JASA 78,
 * 427–434; FEXACT, ACM TOMS Algorithm 643, 1986) rather than by listing the tables.
 *
 * Intuition: tables are built one column at a time; partial tables that leave the same multiset of
 * row sums share their future, so they are merged, and whole families of completions are counted or
 * dropped at once when bounds show they all fall on one side of the observed probability.
 *
 * ## Method
 * Zero rows and columns are dropped (they change no probability). The shorter side becomes the rows
 * (the node state) and the columns, largest first, are the stages. A table's probability is
 * exp(K − Σ log x_ij!) with K = Σ log r_i! + Σ log c_j! − log N!; a table counts when its probability
 * is at most P(observed)·(1 + RELATIVE_TIE_TOLERANCE). Two-row tables use a specialised network whose
 * node is a single number and whose path bounds are exact (twoRowNetworkSearch); larger tables use
 * networkSearch. Everything is in log space, so p is accurate in relative terms even far below 1e-300.
 *
 * @param observed - The table of counts: rows of equal length, non-negative safe integers. The caller
 *   validates user input; a malformed table here is a programmer error and throws a RangeError.
 * @param budget - Time and memory limits, cancellation and progress (defaults: DEFAULT_BUDGET).
 * @returns `{ ok: true, value }` with method 'freeman-halton-network', p and log10 p; or why the search
 *   stopped ('time', 'memory', 'cancelled') and after how long.
 * @example freemanHaltonExact([[3, 1], [1, 3]]) // p = 34/70 ≈ 0.4857
 */
export function freemanHaltonExact(observed: number[][], budget?: Partial<Budget>): Computed<ExactPValue> {
  const guard = new SearchGuard({ ...DEFAULT_BUDGET, ...budget });
  validate(observed);
  const rowCount = observed.length;
  const columnCount = observed[0].length;
  const rowSums = observed.map((row) => row.reduce((sum, count) => sum + count, 0));
  const columnSums = observed[0].map((_, j) => observed.reduce((sum, row) => sum + row[j], 0));
  const keptRows = [...Array(rowCount).keys()].filter((i) => rowSums[i] > 0);
  const keptColumns = [...Array(columnCount).keys()].filter((j) => columnSums[j] > 0);
  const total = rowSums.reduce((sum, value) => sum + value, 0);
  if (keptRows.length <= 1 || keptColumns.length <= 1) return done(0, guard);

  if (total > LARGEST_TOTAL) return { ok: false, reason: 'memory', elapsedMs: guard.elapsedMs() };
  const tableBytes = (total + 1) * 8;
  let stopped: Stopped | undefined;
  const shouldStop = (): boolean => (stopped = guard.check(tableBytes, 0)) !== undefined;
  const whyStopped = (): Stopped | undefined => stopped;
  const logFactorial = shouldStop() ? undefined : logFactorialTable(total, shouldStop);
  if (!logFactorial) return whyStopped() as Stopped;
  let observedLogWeight = 0;
  for (const i of keptRows) for (const j of keptColumns) observedLogWeight -= logFactorial[observed[i][j]];
  let logConstant = -logFactorial[total];
  for (const i of keptRows) logConstant += logFactorial[rowSums[i]];
  for (const j of keptColumns) logConstant += logFactorial[columnSums[j]];

  const [stateSums, stageSums] = keptRows.length <= keptColumns.length
    ? [keptRows.map((i) => rowSums[i]), keptColumns.map((j) => columnSums[j])]
    : [keptColumns.map((j) => columnSums[j]), keptRows.map((i) => rowSums[i])];
  stageSums.sort((a, b) => b - a);
  const problem: NetworkProblem = {
    rowSums: Int32Array.from(stateSums),
    columnSums: Int32Array.from(stageSums),
    logFactorial,
    threshold: observedLogWeight + Math.log1p(RELATIVE_TIE_TOLERANCE),
    bucketScale: 1 / (MERGE_RELATIVE_WIDTH * Math.max(MERGE_SMALLEST_SCALE, logFactorial[total])),
  };
  const result: LogMass = stateSums.length === 2 ? twoRowNetworkSearch(problem, guard) : networkSearch(problem, guard);
  if (!result.ok) return result;
  return done(Math.min(0, logConstant + result.logMass), guard);
}

function done(logP: number, guard: SearchGuard): Computed<ExactPValue> {
  return {
    ok: true,
    value: { method: 'freeman-halton-network', p: Math.exp(logP), log10p: logP / Math.LN10, elapsedMs: guard.elapsedMs() },
  };
}

function validate(observed: number[][]): void {
  if (!Array.isArray(observed) || observed.length === 0 || !Array.isArray(observed[0]) || observed[0].length === 0) {
    throw new RangeError('freemanHaltonExact needs a table with at least one row and one column');
  }
  const width = observed[0].length;
  let total = 0;
  for (const row of observed) {
    if (!Array.isArray(row) || row.length !== width) throw new RangeError('freemanHaltonExact needs rows of equal length');
    for (const count of row) {
      if (!Number.isSafeInteger(count) || count < 0) throw new RangeError(`freemanHaltonExact needs non-negative integer counts, got ${count}`);
      total += count;
    }
  }
  if (!Number.isSafeInteger(total)) throw new RangeError('freemanHaltonExact needs a total below 2^53');
}
