/**
 * Improvements smaller than this (in log units) are treated as zero, so floating-point noise cannot
 * make the cycle search loop; it is far below the 1e-7 tie tolerance of the exact tests.
 */
const NEGATIVE_CYCLE_TOLERANCE = 1e-12;
/**
 * Bellman–Ford settles within (vertices − 1) rounds unless a negative cycle exists, and then a cycle
 * of predecessor links appears; this cap only guards against floating-point pathologies.
 */
const MAX_ROUNDS_PER_VERTEX = 4;

type CycleSearch = 'moved' | 'optimal' | 'gave-up';

/** Solves one sub-table: row sums, column sums (both summing to the same total) → the minimum. */
export type MinLogFactorialSum = (rowSums: Int32Array, rowCount: number, columnSums: Int32Array, columnCount: number) => number;

/**
 * Builds a solver for min Σ log x_ij! over the tables x with the given row and column sums, which is
 * minus the log-weight of the most probable table with those margins (the "longest path" of
 * Mehta & Patel 1983, JASA 78, 427–434, from a node of their network to its terminal node).
 *
 * Intuition: log k! is convex, so the most probable table spreads the counts as evenly as the margins
 * allow; starting near the proportional table, unit moves around cycles of cells settle it.
 *
 * ## Method
 * The problem is a transportation problem with separable convex costs. Start from the rounded-down
 * proportional table x_ij = ⌊a_i b_j / A⌋ completed by the north-west corner rule on the remainders.
 * In the residual graph (row i → column j costs log(x_ij + 1), the price of one more count; column j →
 * row i costs −log x_ij when x_ij > 0) a table is optimal exactly when no cycle has negative cost
 * (Ahuja, Magnanti & Orlin 1993, Network Flows, ch. 14, for convex separable costs with integer
 * breakpoints). Bellman–Ford finds such a cycle; one unit is pushed around it; repeat.
 *
 * @param maxRows - The most rows any call will pass.
 * @param maxColumns - The most columns any call will pass.
 * @param logFactorial - log k! for k up to the largest total any call will pass.
 * @returns A function of (rowSums, rowCount, columnSums, columnCount) returning min Σ log x_ij!
 *   (or the valid lower bound 0 should the cycle search ever stall); scratch space is reused between
 *   calls, so the function is not re-entrant.
 * @example minLogFactorialSumSolver(2, 2, logFactorialTable(4))(Int32Array.of(2, 2), 2, Int32Array.of(2, 2), 2) // 0, the table [[1,1],[1,1]]
 */
export function minLogFactorialSumSolver(maxRows: number, maxColumns: number, logFactorial: Float64Array): MinLogFactorialSum {
  const cells = new Int32Array(maxRows * maxColumns);
  const rowLeft = new Int32Array(maxRows);
  const columnLeft = new Int32Array(maxColumns);
  const vertexCount = maxRows + maxColumns;
  const distance = new Float64Array(vertexCount);
  const predecessor = new Int32Array(vertexCount);
  const seen = new Int32Array(vertexCount);

  return (rowSums, rowCount, columnSums, columnCount) => {
    let total = 0;
    for (let i = 0; i < rowCount; i++) total += rowSums[i];
    if (total === 0) return 0;
    for (let i = 0; i < rowCount; i++) rowLeft[i] = rowSums[i];
    for (let j = 0; j < columnCount; j++) columnLeft[j] = columnSums[j];
    for (let i = 0; i < rowCount; i++) {
      for (let j = 0; j < columnCount; j++) {
        const proportional = Math.floor((rowSums[i] * columnSums[j]) / total);
        cells[i * columnCount + j] = proportional;
        rowLeft[i] -= proportional;
        columnLeft[j] -= proportional;
      }
    }
    for (let i = 0, j = 0; i < rowCount && j < columnCount; ) {
      const moved = Math.min(rowLeft[i], columnLeft[j]);
      cells[i * columnCount + j] += moved;
      rowLeft[i] -= moved;
      columnLeft[j] -= moved;
      if (rowLeft[i] === 0) i++;
      else j++;
    }
    if (columnCount > 1 && rowCount > 1) {
      let outcome: CycleSearch;
      while ((outcome = cancelNegativeCycle(rowCount, columnCount)) === 'moved') {
        // one unit moved around a cheaper cycle; look again
      }
      // A search cut off by the round cap proves nothing; 0 ≤ Σ log x_ij! is still a valid bound.
      if (outcome === 'gave-up') return 0;
    }
    let sum = 0;
    for (let k = 0; k < rowCount * columnCount; k++) sum += logFactorial[cells[k]];
    return sum;
  };

  /** One Bellman–Ford search from a virtual source; pushes one unit around a negative cycle if found. */
  function cancelNegativeCycle(rowCount: number, columnCount: number): CycleSearch {
    const vertices = rowCount + columnCount;
    distance.fill(0, 0, vertices);
    predecessor.fill(-1, 0, vertices);
    for (let round = 0; round < MAX_ROUNDS_PER_VERTEX * vertices; round++) {
      let relaxed = false;
      for (let i = 0; i < rowCount; i++) {
        for (let j = 0; j < columnCount; j++) {
          const count = cells[i * columnCount + j];
          const up = distance[i] + (logFactorial[count + 1] - logFactorial[count]);
          if (up < distance[rowCount + j] - NEGATIVE_CYCLE_TOLERANCE) {
            distance[rowCount + j] = up;
            predecessor[rowCount + j] = i;
            relaxed = true;
          }
          if (count > 0) {
            const down = distance[rowCount + j] - (logFactorial[count] - logFactorial[count - 1]);
            if (down < distance[i] - NEGATIVE_CYCLE_TOLERANCE) {
              distance[i] = down;
              predecessor[i] = rowCount + j;
              relaxed = true;
            }
          }
        }
      }
      if (!relaxed) return 'optimal';
      const onCycle = findPredecessorCycle(vertices);
      if (onCycle >= 0 && pushAroundCycle(onCycle, rowCount, columnCount)) return 'moved';
    }
    return 'gave-up';
  }

  /** A vertex on a cycle of predecessor links, or −1; such a cycle has negative cost (Bellman–Ford). */
  function findPredecessorCycle(vertices: number): number {
    seen.fill(0, 0, vertices);
    for (let startVertex = 0; startVertex < vertices; startVertex++) {
      let vertex = startVertex;
      while (vertex >= 0 && seen[vertex] === 0) {
        seen[vertex] = startVertex + 1;
        vertex = predecessor[vertex];
      }
      if (vertex >= 0 && seen[vertex] === startVertex + 1) return vertex;
    }
    return -1;
  }

  function pushAroundCycle(start: number, rowCount: number, columnCount: number): boolean {
    let cost = 0;
    let vertex = start;
    do {
      const from = predecessor[vertex];
      if (vertex >= rowCount) {
        const count = cells[from * columnCount + (vertex - rowCount)];
        cost += logFactorial[count + 1] - logFactorial[count];
      } else {
        const count = cells[vertex * columnCount + (from - rowCount)];
        cost -= logFactorial[count] - logFactorial[count - 1];
      }
      vertex = from;
    } while (vertex !== start);
    if (!(cost < -NEGATIVE_CYCLE_TOLERANCE)) return false;
    do {
      const from = predecessor[vertex];
      if (vertex >= rowCount) cells[from * columnCount + (vertex - rowCount)] += 1;
      else cells[vertex * columnCount + (from - rowCount)] -= 1;
      vertex = from;
    } while (vertex !== start);
    return true;
  }
}
