import assert from 'node:assert/strict';
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { jStat } from 'jstat';
import { freemanHaltonExact } from '../../../../src/core/exact/network/freemanHaltonExact';
import type { ExactPValue } from '../../../../src/core/exact/types';
import { assertClose } from '../../../helpers/assertClose';
import { seededRandom, tableFromWeights } from '../../../helpers/randomTables';

/** The task's agreement with brute force (relative). */
const BRUTE_FORCE_TOLERANCE = 1e-9;
/** Tables within this relative factor of P(observed) count as ties; RELATIVE_TIE_TOLERANCE, restated from its definition. */
const TIE = 1e-7;


function randomTable(random: () => number, rows: number, columns: number, total: number): number[][] {
  const weights = Array.from({ length: rows * columns }, () => random() ** 2 + 0.02);
  return tableFromWeights(random, weights, rows, columns, total);
}

/**
 * The definition, by brute force: list every table with the observed margins (cell by cell, the last
 * row and column forced), and sum the probabilities of those with P ≤ P(observed)·(1 + 1e-7).
 * log k! is summed from Math.log, independently of the code under test.
 */
function bruteForceP(observed: number[][]): number {
  const rowSums = observed.map((row) => row.reduce((a, b) => a + b, 0));
  const columnSums = observed[0].map((_, j) => observed.reduce((a, row) => a + row[j], 0));
  const total = rowSums.reduce((a, b) => a + b, 0);
  const logFactorial = [0];
  for (let k = 1; k <= total; k++) logFactorial.push(logFactorial[k - 1] + Math.log(k));
  let constant = -logFactorial[total];
  for (const r of rowSums) constant += logFactorial[r];
  for (const c of columnSums) constant += logFactorial[c];
  let observedLog = constant;
  for (const row of observed) for (const x of row) observedLog -= logFactorial[x];
  const limit = observedLog + Math.log1p(TIE);
  const rows = rowSums.length;
  const columns = columnSums.length;
  const columnLeft = [...columnSums];
  let p = 0;
  const fill = (i: number, j: number, rowLeft: number, logP: number): void => {
    if (i === rows - 1) {
      let last = logP;
      for (let c = 0; c < columns; c++) last -= logFactorial[columnLeft[c]];
      if (last <= limit) p += Math.exp(last);
      return;
    }
    if (j === columns - 1) {
      if (rowLeft > columnLeft[j]) return;
      columnLeft[j] -= rowLeft;
      fill(i + 1, 0, rowSums[i + 1], logP - logFactorial[rowLeft]);
      columnLeft[j] += rowLeft;
      return;
    }
    for (let x = 0; x <= Math.min(rowLeft, columnLeft[j]); x++) {
      columnLeft[j] -= x;
      fill(i, j + 1, rowLeft - x, logP - logFactorial[x]);
      columnLeft[j] += x;
    }
  };
  fill(0, 0, rowSums[0], constant);
  return p;
}

/** The same definition in exact integers: P ∝ N!/Π x_ij!, ties compared as 10^7·m ≤ (10^7 + 1)·m_obs. */
function exactRationalP(observed: number[][]): number {
  const rowSums = observed.map((row) => row.reduce((a, b) => a + b, 0));
  const columnSums = observed[0].map((_, j) => observed.reduce((a, row) => a + row[j], 0));
  const total = rowSums.reduce((a, b) => a + b, 0);
  const factorial = [1n];
  for (let k = 1; k <= total; k++) factorial.push(factorial[k - 1] * BigInt(k));
  const multinomial = (cells: number[]): bigint => cells.reduce((m, x) => m / factorial[x], factorial[total]);
  const observedWeight = multinomial(observed.flat());
  const scale = 10_000_000n;
  let counted = 0n;
  let all = 0n;
  const rows = rowSums.length;
  const columns = columnSums.length;
  const cells: number[] = new Array<number>(rows * columns).fill(0);
  const columnLeft = [...columnSums];
  const fill = (i: number, j: number, rowLeft: number): void => {
    if (i === rows - 1) {
      for (let c = 0; c < columns; c++) cells[i * columns + c] = columnLeft[c];
      const weight = multinomial(cells);
      all += weight;
      if (scale * weight <= (scale + 1n) * observedWeight) counted += weight;
      return;
    }
    const high = j === columns - 1 ? rowLeft : Math.min(rowLeft, columnLeft[j]);
    for (let x = j === columns - 1 ? rowLeft : 0; x <= high; x++) {
      if (x > columnLeft[j]) return;
      cells[i * columns + j] = x;
      columnLeft[j] -= x;
      if (j === columns - 1) fill(i + 1, 0, rowSums[i + 1]);
      else fill(i, j + 1, rowLeft - x);
      columnLeft[j] += x;
    }
  };
  fill(0, 0, rowSums[0]);
  // Σ over tables of N!/Π x_ij! is N!²/(Π r_i! Π c_j!): a check on the enumeration itself.
  const denominator = [...rowSums, ...columnSums].reduce((d, m) => d * factorial[m], 1n);
  assert.equal(all * denominator, factorial[total] * factorial[total]);
  const bits = 64n;
  return Number((counted << bits) / all) / 2 ** 64;
}

function pOf(observed: number[][]): ExactPValue {
  const result = freemanHaltonExact(observed);
  assert.ok(result.ok, `search stopped: ${JSON.stringify(result)}`);
  return result.value;
}

interface RxcCase {
  name: string;
  input: number[][];
  expected: number;
  tolerance: number;
  reference: string;
}

function readRxcFixture(): { referenceVersion: string; cases: RxcCase[] } {
  let directory = __dirname;
  while (!existsSync(join(directory, 'package.json'))) directory = dirname(directory);
  return JSON.parse(readFileSync(join(directory, 'test', 'fixtures', 'scipy', 'rxc.json'), 'utf8')) as { referenceVersion: string; cases: RxcCase[] };
}

describe('freemanHaltonExact', () => {
  it('agrees with brute-force enumeration on 480 seeded random tables up to 4×4 and 2×6', () => {
    const random = seededRandom(20240611);
    const shapes: [number, number, number][] = [
      [2, 2, 25], [2, 3, 25], [2, 4, 25], [2, 5, 25], [2, 6, 25], [3, 2, 25], [3, 3, 25], [3, 4, 25], [4, 3, 25], [4, 4, 25], [6, 2, 20], [5, 3, 16],
    ];
    let checked = 0;
    for (const [rows, columns, largest] of shapes) {
      for (let n = 0; n < 40; n++) {
        const table = randomTable(random, rows, columns, 1 + Math.floor(random() * largest));
        assertClose(pOf(table).p, bruteForceP(table), BRUTE_FORCE_TOLERANCE, table);
        checked++;
      }
    }
    assert.equal(checked, 480);
  });

  it('agrees with brute-force enumeration on wide two-row tables with strong association', () => {
    // The two-row search's hardest kind: alternating or split dominance leaves a tiny p, and equal
    // column totals send many past values to a node by several paths.
    const random = seededRandom(4177);
    const shapes: [number, number, string][] = [[8, 50, 'alternating'], [8, 50, 'halves'], [9, 40, 'alternating'], [7, 60, 'halves'], [6, 80, 'alternating']];
    for (const [columns, total, kind] of shapes) {
      const weights = [0, 1].flatMap((row) => Array.from({ length: columns }, (_, column) =>
        (kind === 'alternating' ? row === column % 2 : (row === 0) === (column < columns / 2)) ? 5 : 1));
      const table = tableFromWeights(random, weights, 2, columns, total);
      const p = pOf(table).p;
      assert.ok(p < 0.05, `${JSON.stringify(table)} should show association, p = ${p}`);
      assertClose(p, bruteForceP(table), BRUTE_FORCE_TOLERANCE, table);
    }
  });

  it('counts tables tied with the observed one, as exact integer arithmetic does', () => {
    // Uniform and mirror-image margins make many tables exactly as probable as the observed one.
    const tables = [
      [[2, 1, 1], [1, 2, 1], [1, 1, 2]], [[3, 0, 1], [0, 3, 1], [1, 1, 2]], [[2, 2], [2, 2]], [[4, 0], [0, 4]],
      [[1, 1, 1, 1], [1, 1, 1, 1]], [[2, 0, 1, 1], [0, 2, 1, 1]], [[2, 1, 0], [0, 2, 1], [1, 0, 2]], [[5, 5], [5, 5], [5, 5]],
      [[1, 2, 3], [3, 2, 1]], [[2, 1, 1, 0], [1, 2, 0, 1], [1, 0, 2, 1], [0, 1, 1, 2]],
    ];
    for (const table of tables) assertClose(pOf(table).p, exactRationalP(table), BRUTE_FORCE_TOLERANCE, table);
  });

  it('matches the SciPy 2×2 values and the r×c enumerations of the fixture', () => {
    // test/fixtures/scipy/rxc.json, written by generate_rxc.py (versions recorded there).
    const fixture = readRxcFixture();
    assert.ok(fixture.cases.length >= 40);
    for (const testCase of fixture.cases) {
      assertClose(pOf(testCase.input).p, testCase.expected, testCase.tolerance, testCase.name);
    }
  });

  it('gives 34/70 for the lady tasting tea, three of four cups right', () => {
    // Fisher (1935), The Design of Experiments, ch. II: of the C(8,4) = 70 choices, 1 has all four
    // right, 16 three, 36 two; the two-sided test counts the 1 + 16 + 16 + 1 tables no more probable.
    assertClose(pOf([[3, 1], [1, 3]]).p, 34 / 70, 1e-14);
  });

  it('gives p = 0.10256 for the worked 2×2 example of the SciPy documentation', () => {
    // scipy.stats.fisher_exact documentation (SciPy 1.17.1), table [[6, 2], [1, 4]]: 0.10256410256410257.
    assertClose(pOf([[6, 2], [1, 4]]).p, 0.10256410256410257, 1e-12);
  });

  it('gives p = 0.7827 for the job satisfaction by income table of Agresti', () => {
    // Agresti (2002), Categorical Data Analysis, 2nd ed.: Fisher's exact test on this 4×4 table,
    // P = 0.7827 (from memory); the full enumeration of its 90,208,550 tables is in the fixture above.
    const table = [[1, 3, 10, 6], [2, 3, 10, 7], [1, 6, 14, 12], [0, 1, 9, 11]];
    const p = pOf(table).p;
    assert.equal(p.toFixed(4), '0.7827');
    const enumerated = readRxcFixture().cases.find((c) => c.name.startsWith('Agresti'));
    assert.ok(enumerated);
    assertClose(p, enumerated.expected, BRUTE_FORCE_TOLERANCE, table);
  });

  it('does not change when the table is transposed or its rows and columns are permuted', () => {
    const random = seededRandom(7);
    for (let n = 0; n < 40; n++) {
      const rows = 2 + Math.floor(random() * 3);
      const columns = 2 + Math.floor(random() * 4);
      const table = randomTable(random, rows, columns, 5 + Math.floor(random() * 40));
      const p = pOf(table).p;
      const transposed = table[0].map((_, j) => table.map((row) => row[j]));
      const shuffled = [...table].reverse().map((row) => [...row.slice(1), row[0]]);
      assertClose(pOf(transposed).p, p, 1e-12, table);
      assertClose(pOf(shuffled).p, p, 1e-12, table);
    }
  });

  it('ignores empty rows and columns, and gives p = 1 when only one row or column is left', () => {
    assertClose(pOf([[3, 0, 1], [0, 0, 0], [1, 0, 3]]).p, pOf([[3, 1], [1, 3]]).p, 1e-14);
    assert.equal(pOf([[0, 4, 7]]).p, 1);
    assert.equal(pOf([[0, 0], [5, 2]]).p, 1);
    assert.equal(pOf([[0, 0], [0, 0]]).p, 1);
  });

  it('keeps log10 p exact where p itself underflows', () => {
    // [[n, 0], [0, n]]: only the two corner tables are no more probable, p = 2 / C(2n, n); jStat's
    // gammaln gives log C(2n, n).
    for (const n of [50, 300, 700]) {
      const value = pOf([[n, 0], [0, n]]);
      const logChoose = jStat.gammaln(2 * n + 1) - 2 * jStat.gammaln(n + 1);
      assertClose(value.log10p, (Math.log(2) - logChoose) / Math.LN10, 1e-12, n);
      assert.ok(value.p >= 0 && value.p < 1e-20);
    }
  });

  it('reports the method, a p in (0, 1] and the time taken', () => {
    const value = pOf([[8, 2, 3], [1, 5, 4]]);
    assert.equal(value.method, 'freeman-halton-network');
    assert.ok(value.p > 0 && value.p <= 1 && Number.isFinite(value.log10p));
    assert.ok(value.elapsedMs >= 0);
  });

  describe('budget', () => {
    // A 6×6 table with N = 90 takes far longer than the limits set here.
    const hard = [[9, 1, 1, 2, 1, 1], [1, 8, 2, 1, 2, 1], [2, 1, 8, 1, 1, 2], [1, 2, 1, 9, 1, 1], [1, 1, 2, 1, 8, 2], [2, 1, 1, 1, 2, 7]];

    it('stops with reason time soon after the time limit', () => {
      const result = freemanHaltonExact(hard, { timeMs: 30 });
      assert.equal(result.ok, false);
      assert.ok(!result.ok && result.reason === 'time' && result.elapsedMs >= 30 && result.elapsedMs < 1000, JSON.stringify(result));
    });

    it('stops with reason memory when its tables outgrow the cap', () => {
      const result = freemanHaltonExact(hard, { memoryBytes: 100_000, timeMs: 60_000 });
      assert.ok(!result.ok && result.reason === 'memory', JSON.stringify(result));
    });

    it('stops with reason cancelled when asked to, and reports progress in [0, 1] until then', () => {
      const fractions: number[] = [];
      let polls = 0;
      const result = freemanHaltonExact(hard, {
        timeMs: 60_000,
        isCancelled: () => ++polls > 20,
        onProgress: (fraction) => fractions.push(fraction),
      });
      assert.ok(!result.ok && result.reason === 'cancelled', JSON.stringify(result));
      assert.ok(fractions.length >= 1 && fractions.every((f) => f >= 0 && f <= 1), JSON.stringify(fractions));
    });

    it('stops a two-row search too', () => {
      const wide = [[14, 5, 11, 4, 19, 2, 17, 4, 16, 3, 12, 5, 9], [3, 18, 3, 17, 2, 20, 5, 20, 3, 14, 4, 15, 2]];
      const result = freemanHaltonExact(wide, { timeMs: 20 });
      assert.ok(!result.ok && result.reason === 'time', JSON.stringify(result));
    });
  });

  it('throws a RangeError for malformed tables (callers validate user input first)', () => {
    assert.throws(() => freemanHaltonExact([[1, -1], [2, 3]]), RangeError);
    assert.throws(() => freemanHaltonExact([[1, 0.5], [2, 3]]), RangeError);
    assert.throws(() => freemanHaltonExact([[1, 2], [3]]), RangeError);
    assert.throws(() => freemanHaltonExact([]), RangeError);
    assert.throws(() => freemanHaltonExact([[1, Number.NaN], [2, 3]]), RangeError);
  });
});
