import assert from 'node:assert/strict';
import { logFactorialTable } from '../../../../src/core/exact/network/logFactorialTable';
import { minLogFactorialSumSolver } from '../../../../src/core/exact/network/minLogFactorialSumSolver';
import { assertClose } from '../../../helpers/assertClose';
import { seededRandom } from '../../../helpers/randomTables';

/** Calls visit(Σ log x_ij!) for every table with the given margins (log k! summed from Math.log). */
function forEachLogFactorialSum(rowSums: number[], columnSums: number[], visit: (sum: number) => void): void {
  const logFactorial = [0];
  for (let k = 1; k <= rowSums.reduce((a, b) => a + b, 0); k++) logFactorial.push(logFactorial[k - 1] + Math.log(k));
  const columnLeft = [...columnSums];
  const fill = (i: number, j: number, rowLeft: number, sum: number): void => {
    if (i === rowSums.length - 1) {
      visit(columnLeft.reduce((s, c) => s + logFactorial[c], sum));
      return;
    }
    const last = j === columnSums.length - 1;
    for (let x = last ? rowLeft : 0; x <= Math.min(rowLeft, columnLeft[j]); x++) {
      columnLeft[j] -= x;
      if (last) fill(i + 1, 0, rowSums[i + 1], sum + logFactorial[x]);
      else fill(i, j + 1, rowLeft - x, sum + logFactorial[x]);
      columnLeft[j] += x;
    }
  };
  fill(0, 0, rowSums[0], 0);
}

function randomMargins(random: () => number, rows: number, columns: number, total: number): [number[], number[]] {
  const rowSums = new Array<number>(rows).fill(0);
  const columnSums = new Array<number>(columns).fill(0);
  for (let n = 0; n < total; n++) {
    rowSums[Math.floor(random() ** 1.5 * rows)] += 1;
    columnSums[Math.floor(random() * columns)] += 1;
  }
  return [rowSums, columnSums];
}

describe('minLogFactorialSumSolver', () => {
  it('finds the smallest Σ log x_ij! over all tables with the margins, as enumeration does', () => {
    const random = seededRandom(99);
    const solve = minLogFactorialSumSolver(5, 5, logFactorialTable(30));
    for (let n = 0; n < 300; n++) {
      const rows = 1 + Math.floor(random() * 5);
      const columns = 1 + Math.floor(random() * 5);
      const [rowSums, columnSums] = randomMargins(random, rows, columns, Math.floor(random() * (rows * columns > 12 ? 14 : 30)));
      let smallest = Infinity;
      forEachLogFactorialSum(rowSums, columnSums, (sum) => {
        smallest = Math.min(smallest, sum);
      });
      const found = solve(Int32Array.from(rowSums), rows, Int32Array.from(columnSums), columns);
      assertClose(found, smallest, { relative: 1e-12, absolute: 1e-12 }, { rowSums, columnSums });
    }
  });

  it('reuses its scratch space across calls of different sizes', () => {
    const solve = minLogFactorialSumSolver(4, 4, logFactorialTable(40));
    const big = solve(Int32Array.of(10, 10, 10, 10), 4, Int32Array.of(10, 10, 10, 10), 4);
    const small = solve(Int32Array.of(2, 2), 2, Int32Array.of(3, 1), 2);
    // [[1,1],[2,0]] or [[2,0],[1,1]]: log 2!; the even 4×4 table: 16 log 2! plus adjustments = 16 × log(2.5!)…
    assertClose(small, Math.log(2), 1e-14);
    assertClose(solve(Int32Array.of(10, 10, 10, 10), 4, Int32Array.of(10, 10, 10, 10), 4), big, 1e-15);
    // Each cell 2 or 3 with margins 10: eight 2s and eight 3s, 8 log 2 + 8 log 6.
    assertClose(big, 8 * Math.log(2) + 8 * Math.log(6), 1e-14);
    assert.equal(solve(Int32Array.of(0, 0), 2, Int32Array.of(0, 0), 2), 0);
  });
});
