/**
 * Exact p-values by full enumeration, straight from the definitions, for checking the fast code on
 * small inputs. Deliberately simple: no bounds, no pruning, no shared code with src/core/exact.
 */
import gammaln from '@stdlib/math-base-special-gammaln';

const TIE = 1e-7;
const logFactorial = (n: number): number => gammaln(n + 1);

/** Calls `visit` with every table (row-major) having the given margins. */
export function forEachTable(rowTotals: number[], columnTotals: number[], visit: (cells: number[]) => void): void {
  const rows = rowTotals.length;
  const columns = columnTotals.length;
  const cells = new Array<number>(rows * columns).fill(0);
  const columnLeft = [...columnTotals];
  const fill = (i: number, j: number, rowLeft: number): void => {
    if (i === rows - 1) {
      for (let c = 0; c < columns; c++) cells[i * columns + c] = columnLeft[c];
      visit(cells);
      return;
    }
    if (j === columns - 1) {
      if (rowLeft > columnLeft[j]) return;
      cells[i * columns + j] = rowLeft;
      columnLeft[j] -= rowLeft;
      fill(i + 1, 0, rowTotals[i + 1]);
      columnLeft[j] += rowLeft;
      return;
    }
    for (let x = 0; x <= Math.min(rowLeft, columnLeft[j]); x++) {
      cells[i * columns + j] = x;
      columnLeft[j] -= x;
      fill(i, j + 1, rowLeft - x);
      columnLeft[j] += x;
    }
  };
  fill(0, 0, rowTotals[0]);
}

export function margins(observed: number[][]): { rowTotals: number[]; columnTotals: number[]; total: number } {
  const rowTotals = observed.map((row) => row.reduce((s, v) => s + v, 0));
  const columnTotals = observed[0].map((_, j) => observed.reduce((s, row) => s + row[j], 0));
  return { rowTotals, columnTotals, total: rowTotals.reduce((s, v) => s + v, 0) };
}

/** log P(table | margins) = Σ log r! + Σ log c! − log N! − Σ log n_ij!. */
export function logTableProbability(cells: number[], rowTotals: number[], columnTotals: number[]): number {
  const total = rowTotals.reduce((s, v) => s + v, 0);
  let value = -logFactorial(total);
  for (const r of rowTotals) value += logFactorial(r);
  for (const c of columnTotals) value += logFactorial(c);
  for (const n of cells) value -= logFactorial(n);
  return value;
}

export function pearsonIndependence(cells: number[], rowTotals: number[], columnTotals: number[]): number {
  const total = rowTotals.reduce((s, v) => s + v, 0);
  let sum = 0;
  rowTotals.forEach((r, i) =>
    columnTotals.forEach((c, j) => {
      const e = (r * c) / total;
      if (e > 0) sum += (cells[i * columnTotals.length + j] - e) ** 2 / e;
    }),
  );
  return sum;
}

/** Exact conditional p of independence by enumeration: probability or Pearson criterion. */
export function exactIndependenceP(observed: number[][], statistic: 'probability' | 'pearson'): number {
  const { rowTotals, columnTotals } = margins(observed);
  const flat = observed.flat();
  const observedLogP = logTableProbability(flat, rowTotals, columnTotals);
  const observedX2 = pearsonIndependence(flat, rowTotals, columnTotals);
  let p = 0;
  forEachTable(rowTotals, columnTotals, (cells) => {
    const logP = logTableProbability(cells, rowTotals, columnTotals);
    const extreme =
      statistic === 'probability' ? logP <= observedLogP + Math.log1p(TIE) : pearsonIndependence(cells, rowTotals, columnTotals) >= observedX2 * (1 - TIE);
    if (extreme) p += Math.exp(logP);
  });
  return p;
}

/** Calls `visit` with every vector of `parts` nonnegative integers summing to `total`. */
export function forEachOutcome(total: number, parts: number, visit: (counts: number[]) => void): void {
  const counts = new Array<number>(parts).fill(0);
  const fill = (j: number, left: number): void => {
    if (j === parts - 1) {
      counts[j] = left;
      visit(counts);
      return;
    }
    for (let x = 0; x <= left; x++) {
      counts[j] = x;
      fill(j + 1, left - x);
    }
  };
  fill(0, total);
}

export function logMultinomialProbability(counts: number[], proportions: number[]): number {
  const total = counts.reduce((s, v) => s + v, 0);
  const sum = proportions.reduce((s, v) => s + v, 0);
  let value = logFactorial(total);
  counts.forEach((x, j) => {
    if (x > 0) value += x * Math.log(proportions[j] / sum) - logFactorial(x);
  });
  return value;
}

/** Exact goodness-of-fit p by enumeration: multinomial probability or Pearson criterion. */
export function exactGoodnessOfFitP(observed: number[], proportions: number[], statistic: 'probability' | 'pearson'): number {
  const total = observed.reduce((s, v) => s + v, 0);
  const sum = proportions.reduce((s, v) => s + v, 0);
  const pearson = (counts: number[]): number => counts.reduce((s, x, j) => s + (x - (total * proportions[j]) / sum) ** 2 / ((total * proportions[j]) / sum), 0);
  const observedLogP = logMultinomialProbability(observed, proportions);
  const observedX2 = pearson(observed);
  let p = 0;
  forEachOutcome(total, observed.length, (counts) => {
    const logP = logMultinomialProbability(counts, proportions);
    const extreme = statistic === 'probability' ? logP <= observedLogP + Math.log1p(TIE) : pearson(counts) >= observedX2 * (1 - TIE);
    if (extreme) p += Math.exp(logP);
  });
  return p;
}

/** A small seeded linear congruential generator for choosing test inputs (not for statistics). */
export function testInputs(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}
