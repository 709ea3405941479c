/** Rows become columns: the table read the other way round (rows and columns swap roles). */
export function transpose(matrix: readonly (readonly number[])[]): number[][] {
  return matrix[0].map((_, column) => matrix.map((row) => row[column]));
}
