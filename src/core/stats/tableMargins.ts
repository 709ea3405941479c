/** Totals and expected counts of a two-way table under independence. */
export interface TableMargins {
  n: number;
  rowTotals: number[];
  columnTotals: number[];
  /** rowTotal · columnTotal / n for each cell. */
  expected: number[][];
}

/**
 * Row and column totals and the expected counts E = (row total)(column total)/N under independence
 * (Pearson 1904; Agresti 2013, Categorical Data Analysis 3rd ed., §3.2).
 *
 * Intuition: if the rows and columns are unrelated, each row splits across the columns in the same
 * shares as the whole table does.
 *
 * Programmer errors throw: a ragged or empty matrix, a count that is negative or not finite, or a
 * row or column totalling zero (the table reader drops those before any test).
 *
 * @param observed - counts, observed[row][column]
 * @returns N, the margins and the expected counts
 * @example tableMargins([[10, 20], [30, 40]]).expected // [[12, 18], [28, 42]]
 */
export function tableMargins(observed: number[][]): TableMargins {
  const rows = observed.length;
  const columns = rows > 0 ? observed[0].length : 0;
  if (rows === 0 || columns === 0) throw new RangeError('tableMargins: the table is empty');
  const rowTotals = new Array<number>(rows).fill(0);
  const columnTotals = new Array<number>(columns).fill(0);
  observed.forEach((values, i) => {
    if (values.length !== columns) {
      throw new RangeError(`tableMargins: row ${i + 1} has ${values.length} cells, row 1 has ${columns}`);
    }
    values.forEach((value, j) => {
      if (!(Number.isFinite(value) && value >= 0)) {
        throw new RangeError(`tableMargins: cell (${i + 1}, ${j + 1}) is ${value}; counts must be finite and non-negative`);
      }
      rowTotals[i] += value;
      columnTotals[j] += value;
    });
  });
  const emptyRow = rowTotals.findIndex((total) => total === 0);
  const emptyColumn = columnTotals.findIndex((total) => total === 0);
  if (emptyRow >= 0 || emptyColumn >= 0) {
    throw new RangeError(`tableMargins: ${emptyRow >= 0 ? `row ${emptyRow + 1}` : `column ${emptyColumn + 1}`} totals zero; drop it before testing`);
  }
  const n = rowTotals.reduce((sum, total) => sum + total, 0);
  const expected = rowTotals.map((rowTotal) => columnTotals.map((columnTotal) => (rowTotal * columnTotal) / n));
  return { n, rowTotals, columnTotals, expected };
}
