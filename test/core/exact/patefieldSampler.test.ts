import assert from 'node:assert/strict';
import { jStat } from 'jstat';
import { monteCarloLogFactorials } from '../../../src/core/exact/monteCarloLogFactorials';
import { patefieldSampler } from '../../../src/core/exact/patefieldSampler';
import { createRandom } from '../../../src/core/exact/random';
import { forEachTable, logTableProbability } from './bruteForce';

/** Chi-square goodness of fit of observed frequencies to expected ones, bins with expected < 5 pooled. */
function chiSquareP(observed: number[], expected: number[]): { statistic: number; df: number; p: number } {
  let statistic = 0;
  let bins = 0;
  let pooledObserved = 0;
  let pooledExpected = 0;
  observed.forEach((o, i) => {
    if (expected[i] >= 5) {
      statistic += (o - expected[i]) ** 2 / expected[i];
      bins += 1;
    } else {
      pooledObserved += o;
      pooledExpected += expected[i];
    }
  });
  if (pooledExpected > 0) {
    statistic += (pooledObserved - pooledExpected) ** 2 / pooledExpected;
    bins += 1;
  }
  const df = bins - 1;
  return { statistic, df, p: 1 - jStat.chisquare.cdf(statistic, df) };
}

function draw(rowTotals: number[], columnTotals: number[], seed: number, count: number, visit: (cells: Int32Array) => void): void {
  const total = rowTotals.reduce((s, v) => s + v, 0);
  const sampler = patefieldSampler(rowTotals, columnTotals, monteCarloLogFactorials(total));
  const cells = new Int32Array(rowTotals.length * columnTotals.length);
  const random = createRandom(seed, 0);
  for (let i = 0; i < count; i++) {
    sampler.sample(random, cells);
    visit(cells);
  }
}

describe('patefieldSampler', () => {
  it('always reproduces both margins, including zero rows and columns', () => {
    const rowTotals = [7, 0, 30, 13];
    const columnTotals = [0, 12, 25, 9, 4];
    draw(rowTotals, columnTotals, 5, 5000, (cells) => {
      rowTotals.forEach((r, i) => assert.equal(cells.slice(i * 5, i * 5 + 5).reduce((s, v) => s + v, 0), r));
      columnTotals.forEach((c, j) => assert.equal([0, 1, 2, 3].reduce((s, i) => s + cells[i * 5 + j], 0), c));
      assert.ok(cells.every((v) => v >= 0));
    });
  });

  it('draws the first cell of a 2×2 table from the hypergeometric distribution (jstat)', () => {
    // Rows 12, 18; columns 10, 20: n11 ~ Hypergeometric(N = 30, K = 10 successes, n = 12 draws).
    const draws = 200_000;
    const frequencies = new Array<number>(11).fill(0);
    draw([12, 18], [10, 20], 11, draws, (cells) => {
      frequencies[cells[0]] += 1;
    });
    const expected = frequencies.map((_, x) => draws * jStat.hypgeom.pdf(x, 30, 10, 12));
    const test = chiSquareP(frequencies, expected);
    assert.ok(test.p > 1e-4, `chi-square ${test.statistic} on ${test.df} df, p = ${test.p}`);
  });

  it('draws every 3×3 table with its exact probability given the margins (enumeration)', () => {
    const rowTotals = [4, 6, 5];
    const columnTotals = [3, 7, 5];
    const index = new Map<string, number>();
    const probabilities: number[] = [];
    forEachTable(rowTotals, columnTotals, (cells) => {
      index.set(cells.join(','), probabilities.length);
      probabilities.push(Math.exp(logTableProbability(cells, rowTotals, columnTotals)));
    });
    assert.ok(Math.abs(probabilities.reduce((s, v) => s + v, 0) - 1) < 1e-12);
    const draws = 300_000;
    const frequencies = new Array<number>(probabilities.length).fill(0);
    draw(rowTotals, columnTotals, 12, draws, (cells) => {
      const at = index.get(Array.from(cells).join(','));
      assert.ok(at !== undefined, 'a drawn table has the margins');
      frequencies[at] += 1;
    });
    const test = chiSquareP(
      frequencies,
      probabilities.map((p) => p * draws),
    );
    assert.ok(test.df > 30 && test.p > 1e-4, `chi-square ${test.statistic} on ${test.df} df, p = ${test.p}`);
  });

  for (const [rows, columns, total] of [
    [5, 5, 1000],
    [10, 10, 1000],
    [3, 7, 120],
  ]) {
    it(`gives cell means r_i c_j / N in ${rows}×${columns} tables with N = ${total}`, () => {
      const shape = (count: number, seed: number): number[] => {
        const weights = Array.from({ length: count }, (_, i) => 1 + ((i * seed) % 5));
        const sum = weights.reduce((s, v) => s + v, 0);
        const totals = weights.map((w) => Math.floor((w / sum) * total));
        totals[0] += total - totals.reduce((s, v) => s + v, 0);
        return totals;
      };
      const rowTotals = shape(rows, 3);
      const columnTotals = shape(columns, 7);
      const draws = 20_000;
      const sums = new Float64Array(rows * columns);
      draw(rowTotals, columnTotals, 99, draws, (cells) => cells.forEach((v, i) => (sums[i] += v)));
      rowTotals.forEach((r, i) =>
        columnTotals.forEach((c, j) => {
          // Cell variance under fixed margins: r c (N − r)(N − c) / (N²(N − 1)).
          const mean = (r * c) / total;
          const variance = (r * c * (total - r) * (total - c)) / (total * total * (total - 1));
          const z = (sums[i * columns + j] / draws - mean) / Math.sqrt(variance / draws);
          assert.ok(Math.abs(z) < 5, `cell (${i}, ${j}): mean ${sums[i * columns + j] / draws} vs ${mean}, z = ${z}`);
        }),
      );
    });
  }
});
