import type { Result } from '../types';
import type { CrossTabulateOptions, CrossTabulation, CrossTabulator } from './crossTabulationTypes';
import { StreamingCrossTabulator } from './streamingCrossTabulator';

export type { CrossTabulateOptions, CrossTabulation, CrossTabulator, StratumCounts } from './crossTabulationTypes';
export { BLANK_LABEL, MAX_CATEGORIES } from './labelSet';

// The public entry of raw-data cross-tabulation. The work is split by purpose: delimitedScanner.ts (the CSV state
// machine), labelSet.ts (label interning), chooseCrossedColumns.ts (which columns to read), parseWeight.ts,
// orderLabels.ts (display order) and streamingCrossTabulator.ts (the counting).

/**
 * Starts a streaming cross-tabulation of raw data: delimited text with a header line and one line per
 * observation, counted into a table of the two chosen categorical columns (optionally weighted).
 *
 * Intuition: a log of observations becomes a count table by tallying how often each pair of categories occurs.
 *
 * ## Method
 * Reference: Y. Shafranovich, RFC 4180, "Common Format and MIME Type for Comma-Separated Values (CSV) Files", 2005
 * (quoting rules); the leniencies below are our own.
 *
 * A hand-written CSV state machine walks each chunk once, reading single
 * characters with `charCodeAt` and jumping to the next delimiter, line break or quote with `indexOf`. Apart from
 * the header and the first 50 rows (kept only when the columns must be chosen), it slices just the weight field
 * and those crossed fields it cannot recognise in place (an unquoted label seen before is found by a hash of its
 * characters); no row arrays are built, so memory follows the number of categories, not the length of the text.
 * Quoted fields may hold delimiters, doubled quotes and line breaks; a
 * quote inside an unquoted field, or text after a closing quote, is kept as written. Line breaks are LF, CRLF
 * or CR; a leading byte order mark is dropped. Chunks may split the text anywhere, including inside a quoted
 * field or between CR and LF. Without `delimiter`, the one of `,` tab `;` `|` that occurs most often outside
 * quotes in the first non-blank line is used (ties go to the earlier in that list).
 *
 * Without `columns`, the first two categorical columns of the first 50 data rows are crossed (see
 * `categoricalColumns`); any column, numeric too, can be chosen by name (exact, else a unique case-insensitive match).
 * Labels are trimmed. Rows with an empty value are counted under `(blank)` and a warning gives how many.
 * Lines that are empty (a single blank field) are skipped and counted in `rowsSkipped`. Each row counts once unless
 * `weight` names a column of whole counts; a column named like counts (`count`, `n`, `weight`...) left unused
 * draws a `raw-data` warning. `startLine` is the header's line, `endLine` the last line with data.
 *
 * Category order: when every label of a variable reads as a number or a numeric range (`3`, `0-4`, `<5`, `65+`),
 * labels are sorted numerically and `rowsOrdered`/`columnsOrdered` is true; otherwise they are sorted alphabetically
 * (English collation, digits compared as numbers), so the table never depends on the order of the rows.
 * `(blank)` always comes last.
 *
 * With `stratum`, the rows are also split by the values of that column (trimmed, in order of first appearance) into
 * `strata`: one table per value on the whole table's row and column labels, in the same order, with zeros where a
 * combination is absent, so the strata add up to `observed`. Rows with an empty stratum value are left out of every
 * table, counted in `rowsSkipped`, and a warning says how many. Any column can be the stratum column by name; it
 * cannot also be crossed or be the weight.
 *
 * Problems are returned by `finish()` as an `Issue` with a 1-based line and column: an unknown column name
 * (listing the available ones), fewer than two columns, a row with a different number of fields from the header,
 * a weight that is empty, not a number, negative or not whole, more than 1,000 distinct values in a crossed
 * column (`table-too-large`), an unclosed quote, or no data rows.
 *
 * @param options - Columns to cross, weight column, delimiter and the document line of the text's first line.
 * @returns A tabulator; call `push` with each chunk, then `finish`.
 * @example
 * const tabulator = createCrossTabulator({ columns: ['level', 'completed'] });
 * tabulator.push('instructor,level,completed\nIna,novice,yes\nOle,');
 * tabulator.push('novice,no\n');
 * tabulator.finish(); // ok: rowLabels ['novice'], columnLabels ['no', 'yes'], observed [[1, 1]]
 */
export function createCrossTabulator(options: CrossTabulateOptions = {}): CrossTabulator {
  return new StreamingCrossTabulator(options);
}

/**
 * Cross-tabulates raw data held in one string; see `createCrossTabulator` for the rules.
 *
 * @param text - The whole delimited text.
 * @param options - As for `createCrossTabulator`.
 * @returns The count table of the two crossed columns, or the first problem found.
 * @example crossTabulateText('shift,fault\nearly,brakes\nlate,brakes\n').ok // true
 */
export function crossTabulateText(text: string, options: CrossTabulateOptions = {}): Result<CrossTabulation> {
  const tabulator = createCrossTabulator(options);
  tabulator.push(text);
  return tabulator.finish();
}
