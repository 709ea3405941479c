/** Bounds one sub-table: row sums, column sums (both summing to the same total) → an upper bound. */
export type MaxLogFactorialSumBound = (rowSums: Int32Array, rowCount: number, columnSums: Int32Array, columnCount: number) => number;

/**
 * Builds a function giving an upper bound on max Σ log x_ij! over the tables x with the given margins,
 * which is minus a lower bound on the log-weight of the least probable table (the "shortest path" of
 * Mehta & Patel 1983, JASA 78, 427–434, for which a valid bound suffices to prune the network).
 *
 * Intuition: the least probable table piles counts into as few cells as possible; dropping one set of
 * margins lets each column (or row) pile up on its own, which can only do better.
 *
 * ## Method
 * - One row or column: the table is determined.
 * - Two rows or columns (exact): Σ log x! is convex, so its maximum over {Σ x_i = b, 0 ≤ x_i ≤ a_i} sits
 *   at a vertex where every x_i but one is 0 or a_i; both ends give log a_i! for the pair of cells in
 *   row i, so the search is over which row is free and which subset sums the full rows can reach.
 * - Otherwise: the smaller of the two relaxations that keep only the column sums (with cells capped by
 *   the row sums) or only the row sums. For one column with sum b and caps a, filling the largest caps
 *   first is optimal: moving a count from a smaller to a larger cell never lowers a convex sum.
 *
 * @param maxRows - The most rows any call will pass.
 * @param maxColumns - The most columns any call will pass.
 * @param logFactorial - log k! for k up to the largest total any call will pass.
 * @returns A function of (rowSums, rowCount, columnSums, columnCount) returning the bound; scratch space
 *   is reused between calls, so the function is not re-entrant.
 * @example maxLogFactorialSumBoundSolver(2, 2, logFactorialTable(4))(Int32Array.of(2, 2), 2, Int32Array.of(2, 2), 2) // log 2! + log 2! ≈ 1.386, the table [[2,0],[0,2]]
 */
export function maxLogFactorialSumBoundSolver(maxRows: number, maxColumns: number, logFactorial: Float64Array): MaxLogFactorialSumBound {
  const longest = Math.max(maxRows, maxColumns);
  const sortedRows = new Int32Array(longest);
  const sortedColumns = new Int32Array(longest);
  let reachable = new Uint8Array(64);

  return (rowSums, rowCount, columnSums, columnCount) => {
    if (rowCount <= 1) return sumOfLogFactorials(columnSums, columnCount);
    if (columnCount <= 1) return sumOfLogFactorials(rowSums, rowCount);
    if (columnCount === 2) return twoLinesMaximum(rowSums, rowCount, Math.min(columnSums[0], columnSums[1]));
    if (rowCount === 2) return twoLinesMaximum(columnSums, columnCount, Math.min(rowSums[0], rowSums[1]));
    copySortedDescending(rowSums, rowCount, sortedRows);
    copySortedDescending(columnSums, columnCount, sortedColumns);
    let byColumns = 0;
    for (let j = 0; j < columnCount; j++) byColumns += pileUp(sortedColumns[j], sortedRows, rowCount);
    let byRows = 0;
    for (let i = 0; i < rowCount; i++) byRows += pileUp(sortedRows[i], sortedColumns, columnCount);
    return Math.min(byColumns, byRows);
  };

  function sumOfLogFactorials(values: Int32Array, count: number): number {
    let sum = 0;
    for (let i = 0; i < count; i++) sum += logFactorial[values[i]];
    return sum;
  }

  /** Max Σ log x_i! with Σ x_i = total, 0 ≤ x_i ≤ caps[i], caps sorted descending: fill in order. */
  function pileUp(total: number, caps: Int32Array, capCount: number): number {
    let left = total;
    let sum = 0;
    for (let i = 0; i < capCount && left > 0; i++) {
      const placed = Math.min(caps[i], left);
      sum += logFactorial[placed];
      left -= placed;
    }
    return sum;
  }

  /** Exact max over the two-column tables with row sums `lines` and first column sum `first`. */
  function twoLinesMaximum(lines: Int32Array, lineCount: number, first: number): number {
    if (reachable.length < first + 1) reachable = new Uint8Array(2 * (first + 1));
    let fullSum = 0;
    for (let i = 0; i < lineCount; i++) fullSum += logFactorial[lines[i]];
    let best = -Infinity;
    for (let free = 0; free < lineCount; free++) {
      reachable.fill(0, 0, first + 1);
      reachable[0] = 1;
      for (let i = 0; i < lineCount; i++) {
        const size = lines[i];
        if (i === free || size === 0) continue;
        for (let s = first; s >= size; s--) if (reachable[s - size] === 1) reachable[s] = 1;
      }
      const freeSize = lines[free];
      const others = fullSum - logFactorial[freeSize];
      for (let s = Math.max(0, first - freeSize); s <= first; s++) {
        if (reachable[s] === 0) continue;
        const inFirst = first - s;
        const value = others + logFactorial[inFirst] + logFactorial[freeSize - inFirst];
        if (value > best) best = value;
      }
    }
    return best;
  }
}

function copySortedDescending(source: Int32Array, count: number, target: Int32Array): void {
  for (let i = 0; i < count; i++) {
    const value = source[i];
    let k = i;
    while (k > 0 && target[k - 1] < value) {
      target[k] = target[k - 1];
      k--;
    }
    target[k] = value;
  }
}
