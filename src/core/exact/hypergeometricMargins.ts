/** The margins of a 2×2 table [[a, b], [c, d]] that fix the distribution of a, with its support and mode. */
export interface HypergeometricMargins {
  /** a + b: the first row's total (the "successes" among which a is drawn). */
  rowTotal: number;
  /** c + d: the second row's total. */
  otherRowTotal: number;
  /** a + c: the first column's total (the number drawn). */
  columnTotal: number;
  /** a + b + c + d. */
  total: number;
  /** Smallest possible a: max(0, columnTotal − otherRowTotal). */
  lowest: number;
  /** Largest possible a: min(columnTotal, rowTotal). */
  highest: number;
  /** A most probable a under independence (of two tied modes, either may be returned). */
  mode: number;
}

/**
 * The margins, support and mode of the (central) hypergeometric distribution of the top-left cell
 * of a 2×2 table, given its row and column totals.
 *
 * Intuition: with all four totals fixed, the whole table follows from a, which can only range
 * between `lowest` and `highest`. Johnson, Kemp & Kotz (2005), Univariate Discrete Distributions,
 * 3rd ed., §6.2: the mode is ⌊(k + 1)(m + 1)/(N + 2)⌋.
 *
 * @param table - [[a, b], [c, d]] of non-negative safe integers whose sum is a safe integer
 * @returns the margins, support and mode
 * @throws RangeError when a cell is negative, not an integer, not finite, or the total is not a safe integer
 *   (a programmer error: the engine validates counts first)
 */
export function hypergeometricMargins(table: readonly (readonly number[])[]): HypergeometricMargins {
  if (table.length !== 2 || table[0]?.length !== 2 || table[1]?.length !== 2) {
    throw new RangeError('a 2×2 table [[a, b], [c, d]] is required');
  }
  const [[a, b], [c, d]] = table;
  for (const cell of [a, b, c, d]) {
    if (!Number.isSafeInteger(cell) || cell < 0) throw new RangeError(`cell counts must be non-negative integers, got ${cell}`);
  }
  const total = a + b + c + d;
  if (!Number.isSafeInteger(total)) throw new RangeError(`the table total ${total} exceeds the safe integer range`);
  const rowTotal = a + b;
  const otherRowTotal = c + d;
  const columnTotal = a + c;
  const lowest = Math.max(0, columnTotal - otherRowTotal);
  const highest = Math.min(columnTotal, rowTotal);
  let mode = Math.min(highest, Math.max(lowest, Math.floor(((columnTotal + 1) * (rowTotal + 1)) / (total + 2))));
  // The product above can round for totals beyond ~9e7; the ratio test settles the mode exactly.
  const upRatio = (x: number) => ((rowTotal - x) * (columnTotal - x)) / ((x + 1) * (otherRowTotal - columnTotal + x + 1));
  while (mode < highest && upRatio(mode) > 1) mode += 1;
  while (mode > lowest && upRatio(mode - 1) < 1) mode -= 1;
  return { rowTotal, otherRowTotal, columnTotal, total, lowest, highest, mode };
}
