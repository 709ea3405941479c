/**
 * Expected counts e_ij = r_i c_j / N of an r×c table (row-major) and their reciprocals (0 where
 * e_ij = 0: such cells are always empty given the margins and add nothing to X²).
 *
 * @param rowTotals - r_i
 * @param columnTotals - c_j, same sum
 * @returns expected counts and reciprocals, row-major
 */
export function monteCarloIndependenceExpected(rowTotals: readonly number[], columnTotals: readonly number[]): { expected: Float64Array; inverseExpected: Float64Array } {
  const rows = rowTotals.length;
  const columns = columnTotals.length;
  const total = rowTotals.reduce((sum, value) => sum + value, 0);
  const expected = new Float64Array(rows * columns);
  const inverseExpected = new Float64Array(rows * columns);
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < columns; j++) {
      const e = total === 0 ? 0 : (rowTotals[i] * columnTotals[j]) / total;
      expected[i * columns + j] = e;
      inverseExpected[i * columns + j] = e > 0 ? 1 / e : 0;
    }
  }
  return { expected, inverseExpected };
}
