import assert from 'node:assert/strict';
import { logFactorialTable } from '../../../../src/core/exact/network/logFactorialTable';
import { maxLogFactorialSumBoundSolver } from '../../../../src/core/exact/network/maxLogFactorialSumBoundSolver';
import { assertClose } from '../../../helpers/assertClose';
import { seededRandom } from '../../../helpers/randomTables';

function largestLogFactorialSum(rowSums: number[], columnSums: number[]): number {
  const logFactorial = [0];
  for (let k = 1; k <= rowSums.reduce((a, b) => a + b, 0); k++) logFactorial.push(logFactorial[k - 1] + Math.log(k));
  const columnLeft = [...columnSums];
  let largest = -Infinity;
  const fill = (i: number, j: number, rowLeft: number, sum: number): void => {
    if (i === rowSums.length - 1) {
      largest = Math.max(largest, columnLeft.reduce((s, c) => s + logFactorial[c], sum));
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
  return largest;
}

describe('maxLogFactorialSumBoundSolver', () => {
  it('never falls below the largest Σ log x_ij! over the tables, and equals it for one or two rows or columns', () => {
    const random = seededRandom(5);
    const bound = maxLogFactorialSumBoundSolver(5, 5, logFactorialTable(30));
    let exactCases = 0;
    for (let n = 0; n < 300; n++) {
      const rows = 1 + Math.floor(random() * 5);
      const columns = 1 + Math.floor(random() * 5);
      const total = Math.floor(random() * (rows * columns > 12 ? 14 : 30));
      const rowSums = new Array<number>(rows).fill(0);
      const columnSums = new Array<number>(columns).fill(0);
      for (let k = 0; k < total; k++) {
        rowSums[Math.floor(random() ** 2 * rows)] += 1;
        columnSums[Math.floor(random() * columns)] += 1;
      }
      const largest = largestLogFactorialSum(rowSums, columnSums);
      const value = bound(Int32Array.from(rowSums), rows, Int32Array.from(columnSums), columns);
      const input = { rowSums, columnSums };
      assert.ok(value >= largest - 1e-12, JSON.stringify({ ...input, value, largest }));
      if (Math.min(rows, columns) <= 2) {
        assertClose(value, largest, { relative: 1e-12, absolute: 1e-12 }, input);
        exactCases++;
      }
    }
    assert.ok(exactCases > 100);
  });

  it('fills the largest row first when relaxing a column', () => {
    // Row sums (5, 4, 4) and one column of 8 after relaxing: 5 + 3 beats 4 + 4 (log 5! + log 3! > 2 log 4!).
    const bound = maxLogFactorialSumBoundSolver(3, 3, logFactorialTable(30));
    const value = bound(Int32Array.of(5, 4, 4), 3, Int32Array.of(8, 5), 2);
    const exact = largestLogFactorialSum([5, 4, 4], [8, 5]);
    assertClose(value, exact, 1e-14);
  });
});
