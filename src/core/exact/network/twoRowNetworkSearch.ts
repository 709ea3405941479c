import type { Stopped } from '../types';
import { LogSumAccumulator } from './logSumAccumulator';
import { BOUND_MARGIN, WORK_PER_CHECK, type LogMass, type NetworkProblem } from './networkSearch';
import { PastPathArena } from './pastPathArena';
import type { SearchGuard } from './searchGuard';
import { SortedPastPaths, termOf } from './sortedPastPaths';
import { SortedRunMerger } from './sortedRunMerger';

/**
 * Cost of one step of the final sweep relative to one value merged while a frontier advances
 * (measured on the benchmark tables); used only to choose the last step before the frontiers meet.
 */
const SWEEP_COST = 0.3;
/** Merge buffers (2 × value and term) plus the merged list (value, term, two prefix arrays), in bytes. */
const BYTES_PER_MERGED_ENTRY = 4 * 8 + 4 * 8;

/**
 * The network algorithm for tables with two rows (2 × c), where a node is a single number, the part
 * of the first row sum still to place (Mehta & Patel 1983, JASA 78, 427–434; for 2 × c, Requena &
 * Martín Ciudad 2006, Computational Statistics & Data Analysis 51, 490–498). Returns
 * log Σ exp(−Σ log x_ij!) over the tables whose log-weight is at most the threshold.
 *
 * Intuition: with one free count per column the network is small, so both path bounds are exact and
 * only past values whose completions straddle the threshold go on; because those values multiply
 * from stage to stage, the search also grows from the far end, and the two halves meet in the middle.
 *
 * ## Method
 * A backward pass gives, for every node, the exact longest and shortest remaining path (max and min
 * of −Σ log x! over the completions). Two frontiers then advance, always the smaller one (the last
 * step by an estimate of what it and the final sweep will cost), until they are one column apart:
 * - forward, each node's sorted past values; per edge, the past values all of whose completions count
 *   are summed in one prefix lookup (the completions' total weight is A!/(a₁! a₂! Π b_j!)), those none
 *   of whose completions count are dropped, and the rest, a sorted run, go on to the child, which
 *   merges the runs of its parents (SortedRunMerger) into its own sorted list;
 * - backward, each node's sorted completion values merged from its children's, keeping only those
 *   that count for some but not all of the past values that can still reach the node (their range
 *   follows from the forward frontier); those that count for all are kept as one summed mass.
 * Across the column between the frontiers, each edge meets the parent's sorted past values with the
 * child's sorted completion values in one sweep. A stage's lists are views into one arena per frontier
 * (PastPathArena), two taking turns, so building hundreds of lists per stage allocates nothing.
 *
 * @param problem - Margins (two row sums), log-factorials and the threshold.
 * @param guard - The budget.
 * @returns The log mass of the counted tables (−Infinity if none), or why the search stopped.
 */
export function twoRowNetworkSearch(problem: NetworkProblem, guard: SearchGuard): LogMass {
  const { rowSums, columnSums, logFactorial, threshold, bucketScale } = problem;
  const firstRow = rowSums[0];
  const secondRow = rowSums[1];
  const stages = columnSums.length;
  const last = stages - 1;
  const remainingTotal = new Int32Array(stages + 1);
  const columnLogFactorialFrom = new Float64Array(stages + 1);
  for (let j = stages - 1; j >= 0; j--) {
    remainingTotal[j] = remainingTotal[j + 1] + columnSums[j];
    columnLogFactorialFrom[j] = columnLogFactorialFrom[j + 1] + logFactorial[columnSums[j]];
  }
  const lowest = new Int32Array(stages);
  const offset = new Int32Array(stages + 1);
  for (let k = 0; k < stages; k++) {
    lowest[k] = Math.max(0, remainingTotal[k] - secondRow);
    offset[k + 1] = offset[k] + (Math.min(firstRow, remainingTotal[k]) - lowest[k] + 1);
  }
  const nodeCount = (k: number): number => offset[k + 1] - offset[k];
  const edgeWeight = (column: number, x: number): number => -logFactorial[x] - logFactorial[column - x];
  /** log of the total weight of all completions of node `first` at stage k (closed form). */
  const logTotal = (k: number, first: number): number =>
    logFactorial[remainingTotal[k]] - logFactorial[first] - logFactorial[remainingTotal[k] - first] - columnLogFactorialFrom[k];
  const longest = new Float64Array(offset[stages]);
  const shortest = new Float64Array(offset[stages]);
  const liveLowest = new Float64Array(offset[stages]);
  const liveHighest = new Float64Array(offset[stages]);
  const fixedBytes = logFactorial.length * 8 + offset[stages] * 32;

  const merger = new SortedRunMerger();
  // Each frontier's lists live in one arena while the next stage's are built in the other.
  let forwardArena = new PastPathArena();
  let spareForwardArena = new PastPathArena();
  let backwardArena = new PastPathArena();
  let spareBackwardArena = new PastPathArena();
  const listBytes = (): number => forwardArena.bytes() + spareForwardArena.bytes() + backwardArena.bytes() + spareBackwardArena.bytes();
  let stopped: Stopped | undefined;
  let work = 0;
  let stagesDone = 0;
  const spend = (units: number): boolean => {
    work += units;
    if (work >= WORK_PER_CHECK) {
      work = 0;
      stopped = guard.check(fixedBytes + listBytes() + merger.bytes(), stagesDone / Math.max(1, last));
    }
    return stopped !== undefined;
  };

  /** Checked before a run joins the merge: the run, the merge buffers and the list it becomes must fit. */
  const wouldExceedMemory = (entries: number): boolean => {
    const projected = fixedBytes + listBytes() + merger.bytes() + (merger.pending() + entries) * BYTES_PER_MERGED_ENTRY;
    stopped = guard.memoryExceeded(projected);
    return stopped !== undefined;
  };

  for (let node = 0; node < nodeCount(last); node++) {
    const first = lowest[last] + node;
    const value = -logFactorial[first] - logFactorial[remainingTotal[last] - first];
    longest[offset[last] + node] = value;
    shortest[offset[last] + node] = value;
  }
  for (let k = last - 1; k >= 1; k--) {
    const column = columnSums[k];
    for (let node = 0; node < nodeCount(k); node++) {
      const first = lowest[k] + node;
      let best = -Infinity;
      let worst = Infinity;
      const base = offset[k + 1] + first - lowest[k + 1];
      for (let x = Math.max(0, column - (remainingTotal[k] - first)); x <= Math.min(first, column); x++) {
        const edge = edgeWeight(column, x);
        best = Math.max(best, edge + longest[base - x]);
        worst = Math.min(worst, edge + shortest[base - x]);
      }
      longest[offset[k] + node] = best;
      shortest[offset[k] + node] = worst;
      if (spend(column + 1)) return stopped as Stopped;
    }
  }

  const mass = new LogSumAccumulator();
  const tolerance = 1 / bucketScale;

  let forwardStage = 0;
  const root = new SortedPastPaths(1);
  root.push(0, termOf(0, 1), tolerance);
  root.computePrefix();
  let forward: (SortedPastPaths | undefined)[] = [root];
  let forwardSize = 1;

  let backwardStage = last;
  let backward: (SortedPastPaths | undefined)[] = [];
  for (let node = 0; node < nodeCount(last); node++) {
    const single = backwardArena.take(1);
    single.push(longest[offset[last] + node], termOf(longest[offset[last] + node], 1), tolerance);
    single.computePrefix();
    backward.push(backwardArena.settle(single));
  }
  let backwardSize = nodeCount(last);

  /** The range of past values that can still reach each node of stages forwardStage … upTo. */
  const propagateLiveRange = (upTo: number): void => {
    const base = offset[forwardStage];
    for (let node = 0; node < nodeCount(forwardStage); node++) {
      const list = forward[node];
      const live = list !== undefined && list.count > 0;
      liveLowest[base + node] = live ? list.past[0] : Infinity;
      liveHighest[base + node] = live ? list.past[list.count - 1] : -Infinity;
    }
    for (let k = forwardStage; k < upTo; k++) {
      const column = columnSums[k];
      liveLowest.fill(Infinity, offset[k + 1], offset[k + 2]);
      liveHighest.fill(-Infinity, offset[k + 1], offset[k + 2]);
      for (let node = 0; node < nodeCount(k); node++) {
        const low = liveLowest[offset[k] + node];
        if (low === Infinity) continue;
        const high = liveHighest[offset[k] + node];
        const first = lowest[k] + node;
        for (let x = Math.max(0, column - (remainingTotal[k] - first)); x <= Math.min(first, column); x++) {
          const edge = edgeWeight(column, x);
          const child = offset[k + 1] + first - x - lowest[k + 1];
          if (low + edge < liveLowest[child]) liveLowest[child] = low + edge;
          if (high + edge > liveHighest[child]) liveHighest[child] = high + edge;
        }
      }
    }
  };

  let forwardGrowth = 1;
  while (backwardStage - forwardStage > 1) {
    let advanceForward = forwardSize <= backwardSize;
    if (backwardStage - forwardStage === 2) {
      // The last step before the frontiers meet: weigh what each side costs to advance and then to meet.
      const middle = columnSums[forwardStage + 1] + 1;
      const here = columnSums[forwardStage] + 1;
      const forwardCost = forwardSize * here + SWEEP_COST * forwardSize * forwardGrowth * middle;
      const backwardCost = backwardSize * middle + SWEEP_COST * forwardSize * here;
      advanceForward = forwardCost <= backwardCost;
    }
    if (advanceForward) {
      const sizeBefore = forwardSize;
      const k = forwardStage;
      const next = k + 1;
      const column = columnSums[k];
      const lastStage = next === last;
      const margin = lastStage ? 0 : BOUND_MARGIN;
      const highestParent = lowest[k] + nodeCount(k) - 1;
      const lists: (SortedPastPaths | undefined)[] = new Array(nodeCount(next));
      let size = 0;
      for (let child = 0; child < nodeCount(next); child++) {
        const childFirst = lowest[next] + child;
        const childLongest = longest[offset[next] + child];
        const childShortest = shortest[offset[next] + child];
        const childLogTotal = lastStage ? childLongest : logTotal(next, childFirst);
        const xHighest = Math.min(column, highestParent - childFirst);
        for (let x = Math.max(0, lowest[k] - childFirst); x <= xHighest; x++) {
          const parent = forward[childFirst + x - lowest[k]];
          if (parent === undefined || parent.count === 0) continue;
          const edge = edgeWeight(column, x);
          const countAll = parent.countAtMost(threshold - edge - childLongest - margin);
          if (countAll > 0) mass.add(parent.logPrefixMass(countAll - 1) + edge + childLogTotal);
          if (!lastStage && countAll < parent.count) {
            const countKept = parent.countAtMost(threshold - edge - childShortest + margin);
            if (wouldExceedMemory(countKept - countAll)) return stopped as Stopped;
            merger.addRun(parent, countAll, countKept, edge);
          }
        }
        const pending = merger.pending();
        if (pending > 0) {
          const list = spareForwardArena.take(pending);
          merger.mergeInto(list, tolerance);
          lists[child] = spareForwardArena.settle(list);
          size += list.count;
        }
        if (spend(1 + pending)) return stopped as Stopped;
      }
      forward = lists;
      [forwardArena, spareForwardArena] = [spareForwardArena, forwardArena];
      spareForwardArena.reset();
      forwardStage = next;
      forwardSize = size;
      forwardGrowth = size / Math.max(1, sizeBefore);
      if (forwardSize === 0) return { ok: true, logMass: mass.value() };
    } else {
      const k = backwardStage - 1;
      const column = columnSums[k];
      propagateLiveRange(k);
      const lists: (SortedPastPaths | undefined)[] = [];
      let size = 0;
      for (let node = 0; node < nodeCount(k); node++) {
        const liveLow = liveLowest[offset[k] + node];
        if (liveLow === Infinity) {
          lists.push(undefined);
          continue;
        }
        const countsForAll = threshold - liveHighest[offset[k] + node];
        const countsForSome = threshold - liveLow;
        const first = lowest[k] + node;
        const always = new LogSumAccumulator();
        for (let x = Math.max(0, column - (remainingTotal[k] - first)); x <= Math.min(first, column); x++) {
          const childList = backward[first - x - lowest[backwardStage]];
          if (childList === undefined) continue;
          const edge = edgeWeight(column, x);
          if (childList.alwaysLogMass > -Infinity) always.add(childList.alwaysLogMass + edge);
          const folded = childList.countAtMost(countsForAll - edge);
          if (folded > 0) always.add(childList.logPrefixMass(folded - 1) + edge);
          const kept = childList.countAtMost(countsForSome - edge);
          if (wouldExceedMemory(kept - folded)) return stopped as Stopped;
          merger.addRun(childList, folded, kept, edge);
        }
        const pending = merger.pending();
        const list = spareBackwardArena.take(pending);
        merger.mergeInto(list, tolerance);
        list.alwaysLogMass = always.value();
        lists.push(spareBackwardArena.settle(list));
        size += list.count;
        if (spend(1 + pending)) return stopped as Stopped;
      }
      backward = lists;
      [backwardArena, spareBackwardArena] = [spareBackwardArena, backwardArena];
      spareBackwardArena.reset();
      backwardStage = k;
      backwardSize = size;
    }
    stagesDone++;
  }

  /**
   * Adds the tables through one edge for past values [from, to) of `pasts`: each past value with the
   * completions that keep the table at or below the threshold. Sums run in linear scale between
   * changes of the lists' reference exponents, so the sweep costs a few multiplications per value.
   */
  const meetAcrossEdge = (pasts: SortedPastPaths, from: number, to: number, completions: SortedPastPaths, edge: number): void => {
    const always = completions.alwaysLogMass;
    const pastValues = pasts.past;
    const pastTerms = pasts.term;
    const pastReferences = pasts.prefixReference;
    const completionValues = completions.past;
    const completionPrefix = completions.prefixScaled;
    const completionReferences = completions.prefixReference;
    const limitBase = threshold - edge;
    let usable = completions.count;
    let pastReference = NaN;
    let completionReference = NaN;
    let sum = 0;
    let alwaysSum = 0;
    for (let q = from; q < to; q++) {
      const limit = limitBase - pastValues[q];
      while (usable > 0 && completionValues[usable - 1] > limit) usable--;
      if (usable === 0 && always === -Infinity) break;
      const reference = pastReferences[q];
      const otherReference = usable > 0 ? completionReferences[usable - 1] : completionReference;
      if (reference !== pastReference || otherReference !== completionReference) {
        if (sum > 0) mass.add(Math.log(sum) + pastReference + completionReference + edge);
        if (alwaysSum > 0 && reference !== pastReference && always > -Infinity) {
          mass.add(Math.log(alwaysSum) + pastReference + always + edge);
          alwaysSum = 0;
        }
        sum = 0;
        pastReference = reference;
        completionReference = otherReference;
      }
      const term = pastTerms[q];
      if (usable > 0) sum += term * completionPrefix[usable - 1];
      alwaysSum += term;
    }
    if (sum > 0) mass.add(Math.log(sum) + pastReference + completionReference + edge);
    if (alwaysSum > 0 && always > -Infinity) mass.add(Math.log(alwaysSum) + pastReference + always + edge);
  };

  // The frontiers are one column apart: meet across that column's edges.
  const k = forwardStage;
  const column = columnSums[k];
  const lastStage = backwardStage === last;
  const margin = lastStage ? 0 : BOUND_MARGIN;
  for (let node = 0; node < forward.length; node++) {
    const pasts = forward[node];
    if (pasts === undefined || pasts.count === 0) continue;
    const first = lowest[k] + node;
    for (let x = Math.min(first, column); x >= Math.max(0, column - (remainingTotal[k] - first)); x--) {
      const edge = edgeWeight(column, x);
      const child = first - x - lowest[backwardStage];
      const childLongest = longest[offset[backwardStage] + child];
      const countAll = pasts.countAtMost(threshold - edge - childLongest - margin);
      if (countAll > 0) {
        mass.add(pasts.logPrefixMass(countAll - 1) + edge + (lastStage ? childLongest : logTotal(backwardStage, first - x)));
      }
      if (countAll === pasts.count) continue;
      const countKept = pasts.countAtMost(threshold - edge - shortest[offset[backwardStage] + child] + margin);
      meetAcrossEdge(pasts, countAll, countKept, backward[child] as SortedPastPaths, edge);
      if (spend(1 + countKept - countAll)) return stopped as Stopped;
    }
  }
  return { ok: true, logMass: mass.value() };
}
