import assert from 'node:assert/strict';
import { logFactorialTable } from '../../../../src/core/exact/network/logFactorialTable';
import { networkSearch, type NetworkProblem } from '../../../../src/core/exact/network/networkSearch';
import { SearchGuard } from '../../../../src/core/exact/network/searchGuard';
import { twoRowNetworkSearch } from '../../../../src/core/exact/network/twoRowNetworkSearch';
import { DEFAULT_BUDGET } from '../../../../src/core/exact/types';
import { assertClose } from '../../../helpers/assertClose';
import { seededRandom, tableFromWeights } from '../../../helpers/randomTables';

function problemOf(table: number[][], tie: number): NetworkProblem {
  const total = table.flat().reduce((a, b) => a + b, 0);
  const logFactorial = logFactorialTable(total);
  let observed = 0;
  for (const x of table.flat()) observed -= logFactorial[x];
  return {
    rowSums: Int32Array.from(table.map((row) => row.reduce((a, b) => a + b, 0))),
    columnSums: Int32Array.from(table[0].map((_, j) => table[0][j] + table[1][j])).sort().reverse(),
    logFactorial,
    threshold: observed + Math.log1p(tie),
    bucketScale: 2 ** 40,
  };
}

describe('twoRowNetworkSearch', () => {
  it('finds the same counted mass as the general network on two-row tables', () => {
    // Two independent implementations of the same sum: the general engine handles two rows too.
    let state = 17;
    const random = (): number => (state = (state * 1103515245 + 12345) % 2147483648) / 2147483648;
    for (let n = 0; n < 60; n++) {
      const columns = 2 + Math.floor(random() * 7);
      const table = [0, 1].map(() => Array.from({ length: columns }, () => Math.floor(random() * 9)));
      if (table.flat().every((x) => x === 0) || table[0].some((_, j) => table[0][j] + table[1][j] === 0)) continue;
      if (table.some((row) => row.every((x) => x === 0))) continue;
      // Offsets like −1/2 would put tables exactly on the threshold (log 2 is a difference of log-factorials).
      for (const tie of [1e-7, -0.3719, 2.718]) {
        const problem = problemOf(table, tie);
        const special = twoRowNetworkSearch(problem, new SearchGuard(DEFAULT_BUDGET));
        const general = networkSearch(problem, new SearchGuard(DEFAULT_BUDGET));
        assert.ok(special.ok && general.ok);
        if (general.logMass === -Infinity) assert.equal(special.logMass, -Infinity);
        else assertClose(special.logMass, general.logMass, { relative: 1e-12, absolute: 1e-12 }, { table, tie });
      }
    }
  });

  it('agrees with the general network on wide tables with strong association (both frontiers, merged duplicates)', () => {
    // Wide tables with many equal column totals and a tiny p: the frontiers grow large, meet in the
    // middle, and many past values reach a node by several paths (merged in every merge pass).
    const random = seededRandom(90210);
    const patterns: Record<string, (row: number, column: number, columns: number) => number> = {
      alternating: (row, column) => (row === column % 2 ? 5 : 1),
      halves: (row, column, columns) => ((row === 0) === (column < columns / 2) ? 5 : 1),
      dominant: (row, column) => (row === 0 && column === 0 ? 30 : 1),
    };
    const shapes: [number, number][] = [[8, 80], [12, 120], [16, 120], [20, 100], [25, 100], [10, 130]];
    let checked = 0;
    for (const [columns, total] of shapes) {
      for (const [name, weightOf] of Object.entries(patterns)) {
        const weights = [0, 1].flatMap((row) => Array.from({ length: columns }, (_, column) => weightOf(row, column, columns)));
        const table = tableFromWeights(random, weights, 2, columns, total);
        if (table.some((row) => row.every((x) => x === 0)) || table[0].some((_, j) => table[0][j] + table[1][j] === 0)) continue;
        const problem = problemOf(table, 1e-7);
        const special = twoRowNetworkSearch(problem, new SearchGuard(DEFAULT_BUDGET));
        const general = networkSearch(problem, new SearchGuard({ ...DEFAULT_BUDGET, timeMs: 60_000 }));
        assert.ok(special.ok && general.ok, JSON.stringify({ name, table }));
        assertClose(special.logMass, general.logMass, { relative: 1e-12, absolute: 1e-12 }, { name, table });
        checked++;
      }
    }
    assert.ok(checked >= 15, `only ${checked} tables checked`);
  });
});
