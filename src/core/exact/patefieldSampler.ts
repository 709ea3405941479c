import type { Xoshiro128StarStar } from './random';

/** Draws one table with the sampler's margins into `cells` (row-major, length rows × columns). */
export interface PatefieldSampler {
  readonly rows: number;
  readonly columns: number;
  sample(random: Xoshiro128StarStar, cells: Int32Array): void;
}

/**
 * A sampler of random r×c tables with both margins fixed, each table drawn with its probability
 * under independence, Π r_i! Π c_j! / (N! Π n_ij!) (Patefield, "Algorithm AS 159: An efficient method of generating random R×C tables
 * with given row and column totals", Applied Statistics 30(1), 91–97, 1981).
 *
 * Intuition: under independence with fixed margins, each cell given the cells already drawn is
 * hypergeometric, so a table is drawn cell by cell, rows 1..r−1 and columns 1..c−1, and the last
 * row and column follow from the margins.
 *
 * ## Method
 * Cell (l, m) given the earlier ones: of the `pool` observations left in rows l.. and columns m..,
 * `row` remain in row l and `column` in column m; the cell is hypergeometric: `row` draws from
 * `pool` with `column` successes. As in AS 159 it is drawn by inversion searching outward from the
 * centre; here the search starts at the mode ⌊(row + 1)(column + 1)/(pool + 2)⌋, whose probability
 * comes from the log-factorial table, its neighbours from the ratios P(x + 1)/P(x) = (row − x)(column − x)/((x + 1)(pool − row − column + x + 1)),
 * and the search steps to whichever neighbour is more probable (the mass is unimodal), so the
 * expected work per cell is about one standard deviation. If rounding leaves the uniform above the
 * summed mass, the search is repeated with a fresh uniform scaled to that mass. Cells whose range is a
 * single value take no random number. Nothing is allocated per table.
 *
 * @param rowTotals - row totals (nonnegative integers)
 * @param columnTotals - column totals with the same sum
 * @param logFactorials - log k! for k = 0..N, N the grand total
 * @returns a sampler reusing its work arrays
 */
export function patefieldSampler(rowTotals: readonly number[], columnTotals: readonly number[], logFactorials: Float64Array): PatefieldSampler {
  const rows = rowTotals.length;
  const columns = columnTotals.length;
  const rowTotal = Int32Array.from(rowTotals);
  const columnTotal = Int32Array.from(columnTotals);
  const grandTotal = rowTotal.reduce((sum, value) => sum + value, 0);
  if (columnTotal.reduce((sum, value) => sum + value, 0) !== grandTotal || logFactorials.length <= grandTotal) {
    throw new RangeError('patefieldSampler: the margins must share one total and the log-factorial table must reach it');
  }
  const columnLeft = new Int32Array(columns);
  const lf = logFactorials;

  function sample(random: Xoshiro128StarStar, cells: Int32Array): void {
    for (let m = 0; m < columns; m++) columnLeft[m] = columnTotal[m];
    let rowsPool = grandTotal;
    for (let l = 0; l < rows - 1; l++) {
      const offset = l * columns;
      let row = rowTotal[l];
      let pool = rowsPool;
      for (let m = 0; m < columns - 1; m++) {
        const column = columnLeft[m];
        const rest = pool - row - column;
        const low = rest < 0 ? -rest : 0;
        const high = row < column ? row : column;
        let cell = low;
        if (low !== high) {
          const mode = Math.floor(((row + 1) * (column + 1)) / (pool + 2));
          const modeMass = Math.exp(
            lf[row] + lf[pool - row] + lf[column] + lf[pool - column] - lf[pool] - lf[mode] - lf[row - mode] - lf[column - mode] - lf[rest + mode],
          );
          let u = random.nextFloat();
          search: for (;;) {
            let sum = modeMass;
            cell = mode;
            if (u < sum) break;
            let up = mode;
            let down = mode;
            let upMass = up < high ? (modeMass * (row - up) * (column - up)) / ((up + 1) * (rest + up + 1)) : 0;
            let downMass = down > low ? (modeMass * down * (rest + down)) / ((row - down + 1) * (column - down + 1)) : 0;
            while (upMass > 0 || downMass > 0) {
              if (upMass >= downMass) {
                up += 1;
                sum += upMass;
                cell = up;
                if (u < sum) break search;
                upMass = up < high ? (upMass * (row - up) * (column - up)) / ((up + 1) * (rest + up + 1)) : 0;
              } else {
                down -= 1;
                sum += downMass;
                cell = down;
                if (u < sum) break search;
                downMass = down > low ? (downMass * down * (rest + down)) / ((row - down + 1) * (column - down + 1)) : 0;
              }
            }
            u = random.nextFloat() * sum;
          }
        }
        cells[offset + m] = cell;
        columnLeft[m] = column - cell;
        row -= cell;
        pool -= column;
      }
      cells[offset + columns - 1] = row;
      columnLeft[columns - 1] -= row;
      rowsPool -= rowTotal[l];
    }
    const lastOffset = (rows - 1) * columns;
    for (let m = 0; m < columns; m++) cells[lastOffset + m] = columnLeft[m];
  }

  return { rows, columns, sample };
}
