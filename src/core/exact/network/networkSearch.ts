import type { Stopped } from '../types';
import { LogSumAccumulator } from './logSumAccumulator';
import { maxLogFactorialSumBoundSolver } from './maxLogFactorialSumBoundSolver';
import { minLogFactorialSumSolver } from './minLogFactorialSumSolver';
import { NodePastTable } from './nodePastTable';
import type { SearchGuard } from './searchGuard';
import { SortedPastPaths } from './sortedPastPaths';

/** The budget is checked after this many units of work (edges and past values moved or sorted). */
export const WORK_PER_CHECK = 4096;
/**
 * Margin (log units) by which a bound must clear the threshold before a whole sub-network is counted
 * or dropped: it absorbs rounding in the bounds and merged past values; undecided paths are expanded,
 * and the final column compares exact table values.
 */
export const BOUND_MARGIN = 1e-9;
/** Rough bytes per node: its row sums, three bounds and a Map entry (V8 uses ~50–80 bytes). */
const BYTES_PER_NODE_OVERHEAD = 3 * 8 + 80;
/** Integer keys encode the sorted row sums in base N + 1 while that stays exact in a double. */
const MAX_EXACT_INTEGER = Number.MAX_SAFE_INTEGER;

export interface NetworkProblem {
  /** Row sums: the state of a node is the multiset of what is left of them. */
  rowSums: Int32Array;
  /** Column sums in the order the stages fill them. */
  columnSums: Int32Array;
  /** log k! for k = 0…N. */
  logFactorial: Float64Array;
  /** A table counts when its log-weight −Σ log x_ij! is at most this. */
  threshold: number;
  /** Scale of the past-value buckets (see NodePastTable). */
  bucketScale: number;
}

export type LogMass = { ok: true; logMass: number } | Stopped;

type Key = number | string;

/** The nodes of one stage: sorted remaining row sums, keyed by an integer (or string) encoding. */
class StageNodes {
  count = 0;
  rows: Int32Array;
  longest: Float64Array;
  shortest: Float64Array;
  logTotal: Float64Array;
  /** Each node's sorted past values, once the stage before has been processed. */
  readonly pasts: (SortedPastPaths | undefined)[] = [];
  readonly index = new Map<Key, number>();
  pastBytes = 0;

  constructor(private readonly width: number) {
    this.rows = new Int32Array(64 * width);
    this.longest = new Float64Array(64);
    this.shortest = new Float64Array(64);
    this.logTotal = new Float64Array(64);
  }

  bytes(): number {
    return this.longest.length * (this.width * 4 + BYTES_PER_NODE_OVERHEAD) + this.pastBytes;
  }

  append(rows: Int32Array, longest: number, shortest: number, logTotal: number): number {
    if (this.count === this.longest.length) {
      const capacity = 2 * this.count;
      const grownRows = new Int32Array(capacity * this.width);
      grownRows.set(this.rows);
      this.rows = grownRows;
      this.longest = grow(this.longest, capacity);
      this.shortest = grow(this.shortest, capacity);
      this.logTotal = grow(this.logTotal, capacity);
    }
    const node = this.count++;
    this.rows.set(rows.subarray(0, this.width), node * this.width);
    this.longest[node] = longest;
    this.shortest[node] = shortest;
    this.logTotal[node] = logTotal;
    this.pasts.push(undefined);
    return node;
  }
}

/**
 * Runs of past values bound for child nodes: entries [from, to) of a parent's sorted list, each value
 * shifted by the edge weight and each weight multiplied by the pattern's multiplicity. Collected
 * while a stage's parents are expanded, then replayed child by child, so that every insert into a
 * child's table happens while that table is in cache.
 */
class PendingRuns {
  count = 0;
  child: Int32Array = new Int32Array(1024);
  parent: Int32Array = new Int32Array(1024);
  from: Int32Array = new Int32Array(1024);
  to: Int32Array = new Int32Array(1024);
  shift: Float64Array = new Float64Array(1024);
  factor: Float64Array = new Float64Array(1024);

  bytes(): number {
    return this.child.length * 32;
  }

  push(child: number, parent: number, from: number, to: number, shift: number, factor: number): void {
    if (this.count === this.child.length) {
      const capacity = 2 * this.count;
      this.child = growInt(this.child, capacity);
      this.parent = growInt(this.parent, capacity);
      this.from = growInt(this.from, capacity);
      this.to = growInt(this.to, capacity);
      this.shift = grow(this.shift, capacity);
      this.factor = grow(this.factor, capacity);
    }
    const run = this.count++;
    this.child[run] = child;
    this.parent[run] = parent;
    this.from[run] = from;
    this.to[run] = to;
    this.shift[run] = shift;
    this.factor[run] = factor;
  }

  /** Run indices grouped by child (counting sort): child c's runs are order[start[c]] … order[start[c + 1] − 1]. */
  byChild(childCount: number): { order: Int32Array; start: Int32Array } {
    const start = new Int32Array(childCount + 1);
    for (let run = 0; run < this.count; run++) start[this.child[run] + 1] += 1;
    for (let c = 0; c < childCount; c++) start[c + 1] += start[c];
    const fill = start.slice(0, childCount);
    const order = new Int32Array(this.count);
    for (let run = 0; run < this.count; run++) order[fill[this.child[run]]++] = run;
    return { order, start };
  }
}

function growInt(values: Int32Array, capacity: number): Int32Array {
  const grown = new Int32Array(capacity);
  grown.set(values);
  return grown;
}

function grow(values: Float64Array, capacity: number): Float64Array {
  const grown = new Float64Array(capacity);
  grown.set(values);
  return grown;
}

/**
 * Lists the ways to fill one column of a node, one per pattern: rows with equal remaining sums are
 * interchangeable, so within such a group the counts are listed non-increasing and the pattern is
 * weighted by its number of distinct arrangements, g! / Π (run length)!.
 */
class ColumnPatterns {
  readonly rows: Int32Array;
  readonly placed: Int32Array;
  /** Remaining row sums after the column, sorted descending. */
  readonly child: Int32Array;
  childTotal = 0;
  edgeWeight = 0;
  multiplicity = 1;
  aborted = false;
  private readonly capacityAfter: Int32Array;
  private readonly sameAsPrevious: Uint8Array;
  private readonly factorial: Float64Array;
  private visit: () => void = () => undefined;

  constructor(
    private readonly width: number,
    private readonly logFactorial: Float64Array,
  ) {
    this.rows = new Int32Array(width);
    this.placed = new Int32Array(width);
    this.child = new Int32Array(width);
    this.capacityAfter = new Int32Array(width + 1);
    this.sameAsPrevious = new Uint8Array(width);
    this.factorial = new Float64Array(width + 1);
    this.factorial[0] = 1;
    for (let k = 1; k <= width; k++) this.factorial[k] = this.factorial[k - 1] * k;
  }

  /** Calls `visit` once per pattern of `columnSum` over `rows` (sorted descending). */
  run(rows: Int32Array, columnSum: number, visit: () => void): void {
    const width = this.width;
    for (let i = 0; i < width; i++) this.rows[i] = rows[i];
    this.capacityAfter[width] = 0;
    for (let i = width - 1; i >= 0; i--) this.capacityAfter[i] = this.capacityAfter[i + 1] + this.rows[i];
    for (let i = 0; i < width; i++) this.sameAsPrevious[i] = i > 0 && this.rows[i] === this.rows[i - 1] ? 1 : 0;
    this.visit = visit;
    this.aborted = false;
    this.place(0, columnSum);
  }

  private place(i: number, left: number): void {
    const { rows, placed, sameAsPrevious } = this;
    if (i === this.width - 1) {
      if (left > rows[i] || (sameAsPrevious[i] === 1 && left > placed[i - 1])) return;
      placed[i] = left;
      this.finishPattern();
      this.visit();
      return;
    }
    let most = Math.min(rows[i], left);
    if (sameAsPrevious[i] === 1 && placed[i - 1] < most) most = placed[i - 1];
    const least = Math.max(0, left - this.capacityAfter[i + 1]);
    for (let value = most; value >= least; value--) {
      placed[i] = value;
      this.place(i + 1, left - value);
      if (this.aborted) return;
    }
  }

  private finishPattern(): void {
    const { width, placed, rows, child, factorial, logFactorial, sameAsPrevious } = this;
    let edgeWeight = 0;
    let multiplicity = 1;
    let groupStart = 0;
    let runStart = 0;
    let runs = 1;
    for (let i = 0; i < width; i++) {
      edgeWeight -= logFactorial[placed[i]];
      if (i > 0 && sameAsPrevious[i] === 0) {
        multiplicity *= factorial[i - groupStart] / (runs * factorial[i - runStart]);
        groupStart = i;
        runStart = i;
        runs = 1;
      } else if (i > 0 && placed[i] !== placed[i - 1]) {
        runs *= factorial[i - runStart];
        runStart = i;
      }
    }
    multiplicity *= factorial[width - groupStart] / (runs * factorial[width - runStart]);
    this.edgeWeight = edgeWeight;
    this.multiplicity = multiplicity;
    let childTotal = 0;
    for (let i = 0; i < width; i++) {
      const value = rows[i] - placed[i];
      childTotal += value;
      let k = i;
      while (k > 0 && child[k - 1] < value) {
        child[k] = child[k - 1];
        k--;
      }
      child[k] = value;
    }
    this.childTotal = childTotal;
  }
}

/**
 * The network algorithm of Mehta & Patel (1983, JASA 78, 427–434) for tables with three or more rows:
 * columns are filled one stage at a time; a node is the sorted multiset of what is left of the row
 * sums; edges carry −Σ log x_i! of the column placed. Returns log Σ exp(−Σ log x_ij!) over the tables
 * whose log-weight is at most the threshold.
 *
 * Intuition: partial tables that leave the same row sums share their future, so their past values are
 * pooled at one node, and bounds on that future settle most of them without looking further.
 *
 * ## Method
 * For each node the exact longest remaining path (most probable completion, by convex transportation)
 * and a lower bound on the shortest (least probable, by relaxation) are computed once. Each node's
 * past values are kept sorted; for each edge, the past values whose every completion counts are
 * summed in one prefix lookup — the completions' total weight is A!/(Π a_i! Π b_j!) in closed form —
 * those none of whose completions count are dropped, and the rest, a sorted run, are bound for the
 * child. When a stage's parents are done, each child merges its runs by value (NodePastTable) and
 * sorts them. Rows with equal remaining sums are enumerated once per pattern with
 * its multiplicity. The last column is determined by the row sums, so the second-to-last stage
 * compares exact table values.
 *
 * @param problem - Margins, log-factorials and the threshold.
 * @param guard - The budget.
 * @returns The log mass of the counted tables (−Infinity if none), or why the search stopped.
 */
export function networkSearch(problem: NetworkProblem, guard: SearchGuard): LogMass {
  const { rowSums, columnSums, logFactorial, threshold, bucketScale } = problem;
  const width = rowSums.length;
  const stages = columnSums.length;
  let total = 0;
  for (let j = 0; j < stages; j++) total += columnSums[j];
  const radix = total + 1;
  const integerKeys = Math.pow(radix, width - 1) <= MAX_EXACT_INTEGER;
  const minLogFactorialSum = minLogFactorialSumSolver(width, stages, logFactorial);
  const maxLogFactorialSumBound = maxLogFactorialSumBoundSolver(width, stages, logFactorial);

  const columnLogFactorialFrom = new Float64Array(stages + 1);
  for (let j = stages - 1; j >= 0; j--) columnLogFactorialFrom[j] = columnLogFactorialFrom[j + 1] + logFactorial[columnSums[j]];

  const mass = new LogSumAccumulator();
  const patterns = new ColumnPatterns(width, logFactorial);
  const logFactorialBytes = logFactorial.length * 8;

  let nodes = new StageNodes(width);
  const root = Int32Array.from(rowSums).sort().reverse();
  nodes.append(root, 0, 0, 0);
  const rootPasts = new NodePastTable();
  rootPasts.add(0, 1, bucketScale);
  nodes.pasts[0] = new SortedPastPaths(1);
  (nodes.pasts[0] as SortedPastPaths).load(rootPasts, bucketScale);

  let stopped: Stopped | undefined;
  let work = 0;
  let stage = 0;
  let done = 0;
  let next: StageNodes | undefined;
  let runs = new PendingRuns();
  let pasts = nodes.pasts[0] as SortedPastPaths;
  let parent = 0;
  let nextColumns = columnSums;
  let nextColumnCount = 0;
  let lastStage = false;

  const memoryNow = (): number => logFactorialBytes + nodes.bytes() + (next ? next.bytes() : 0) + runs.bytes();
  const spend = (units: number): boolean => {
    work += units;
    if (work >= WORK_PER_CHECK) {
      work = 0;
      stopped = guard.check(memoryNow(), (stage + done / Math.max(1, 2 * nodes.count)) / (stages - 1));
    }
    return stopped !== undefined;
  };

  const keyOf = (rows: Int32Array): Key => {
    if (!integerKeys) return rows.join(',');
    let key = 0;
    for (let i = 0; i < width - 1; i++) key = key * radix + rows[i];
    return key;
  };

  const visit = (): void => {
    const edgeWeight = patterns.edgeWeight;
    const multiplicity = patterns.multiplicity;
    const child = patterns.child;
    if (lastStage) {
      let completion = 0;
      for (let i = 0; i < width; i++) completion -= logFactorial[child[i]];
      const counted = pasts.countAtMost(threshold - edgeWeight - completion);
      if (counted > 0) mass.add(pasts.logPrefixMass(counted - 1) + edgeWeight + Math.log(multiplicity) + completion);
      if (spend(1)) patterns.aborted = true;
      return;
    }
    const stageNodes = next as StageNodes;
    const key = keyOf(child);
    let node = stageNodes.index.get(key);
    if (node === undefined) {
      let logTotal = logFactorial[patterns.childTotal] - columnLogFactorialFrom[stage + 1];
      for (let i = 0; i < width; i++) logTotal -= logFactorial[child[i]];
      const longest = -minLogFactorialSum(child, width, nextColumns, nextColumnCount);
      const shortest = -maxLogFactorialSumBound(child, width, nextColumns, nextColumnCount);
      node = stageNodes.append(child, longest, shortest, logTotal);
      stageNodes.index.set(key, node);
    }
    const countAll = pasts.countAtMost(threshold - edgeWeight - stageNodes.longest[node] - BOUND_MARGIN);
    if (countAll > 0) {
      mass.add(pasts.logPrefixMass(countAll - 1) + edgeWeight + Math.log(multiplicity) + stageNodes.logTotal[node]);
    }
    if (countAll < pasts.count) {
      const countKept = pasts.countAtMost(threshold - edgeWeight - stageNodes.shortest[node] + BOUND_MARGIN);
      if (countKept > countAll) runs.push(node, parent, countAll, countKept, edgeWeight, multiplicity);
    }
    if (spend(1)) patterns.aborted = true;
  };

  /** Builds the sorted past values of every child of the stage from the runs bound for it. */
  const gatherChildren = (stageNodes: StageNodes): Stopped | undefined => {
    const { order, start } = runs.byChild(stageNodes.count);
    for (let child = 0; child < stageNodes.count; child++) {
      if (start[child] === start[child + 1]) continue;
      const table = new NodePastTable();
      for (let k = start[child]; k < start[child + 1]; k++) {
        const run = order[k];
        const source = nodes.pasts[runs.parent[run]] as SortedPastPaths;
        const moved = runs.to[run] - runs.from[run];
        const before = table.bytes();
        const after = table.bytesAfter(moved);
        if (after > before && (stopped = guard.memoryExceeded(memoryNow() + after))) return stopped;
        table.addShifted(source.past, source.weight, runs.from[run], runs.to[run], runs.shift[run], runs.factor[run], bucketScale);
        if (spend(moved)) return stopped;
      }
      const list = new SortedPastPaths(table.count);
      list.load(table, bucketScale);
      stageNodes.pasts[child] = list;
      stageNodes.pastBytes += list.bytes();
      done = stageNodes.count + child;
      if (spend(list.count)) return stopped;
    }
    return undefined;
  };

  const current = new Int32Array(width);
  for (stage = 0; stage < stages - 1; stage++) {
    lastStage = stage === stages - 2;
    nextColumns = columnSums.subarray(stage + 1);
    nextColumnCount = stages - stage - 1;
    next = lastStage ? undefined : new StageNodes(width);
    runs = new PendingRuns();
    for (parent = 0; parent < nodes.count; parent++) {
      const list = nodes.pasts[parent];
      if (list === undefined || list.count === 0) continue;
      pasts = list;
      done = parent;
      for (let i = 0; i < width; i++) current[i] = nodes.rows[parent * width + i];
      patterns.run(current, columnSums[stage], visit);
      if (stopped) return stopped;
    }
    if (next) {
      if (gatherChildren(next)) return stopped as Stopped;
      nodes = next;
    }
    next = undefined;
  }
  return { ok: true, logMass: mass.value() };
}
