import { fail, ok } from '../types';
import type { CountTable, Issue, RawCell, RawGrid, Result, SourceLocation } from '../types';
import { classifyCell } from './classifyCell';
import type { CellKind } from './classifyCell';
import { describeLocation } from './describeLocation';
import { parseCount } from './parseCount';
import { stripInlineMarkup } from './stripInlineMarkup';

/** Size limits of the reader, so that a pasted log or data dump fails fast instead of freezing the editor. */
export const MAX_TABLE_ROWS = 1000;
export const MAX_TABLE_COLUMNS = 1000;
export const MAX_TABLE_CELLS = 10000;

export interface ReadCountTableOptions {
  /** Keep rows and columns whose counts are all 0 instead of dropping them with a note (default false). */
  keepZeroLines?: boolean;
}

/**
 * Turns a grid of cell texts into a table of counts with labels, deciding the layout and checking
 * every count.
 *
 * Layout: a Markdown table's header row always holds column labels (GFM makes it a header; all
 * empty means no labels). The first column holds row labels when any of its body cells is text,
 * when its body cells are years in order, or when the header's corner cell is empty. In delimited
 * and aligned text the first row is a header when a cell above the counts holds text (the corner
 * may hold a title), or when numbers above the counts sit beside an empty corner or are years.
 * So `North,12,7` over `South,3,4` is two rows of counts, not a header. Missing labels are
 * generated ("Row 1", "Column A") and flagged.
 *
 * Totals rows and columns (Total, Totals, Sum, All, Σ, Grand total, any case or markup) are
 * checked against the sums (a 'totals-mismatch' warning) and left out (a 'totals-excluded' note).
 * All-zero rows and columns of a table with two or more columns / rows are dropped with a note,
 * because their expected counts are zero; a one-row or one-column table (goodness of fit) keeps
 * its zero categories.
 *
 * Errors, each naming the line and column: one row per observation ('raw-data'), ragged rows,
 * bad counts (see parseCount), percentages or proportions, an all-zero table, a single count, or
 * more than 1,000 rows or columns or 10,000 cells.
 *
 * @param grid - cells as found by a table parser
 * @param options - `keepZeroLines`: keep all-zero rows and columns (a stratum of a stratified 2×2×K table may
 *   have one; it then carries no information but still belongs to the layout)
 * @returns the count table, or the first problem found in reading order
 */
export function readCountTable(grid: RawGrid, options: ReadCountTableOptions = {}): Result<CountTable> {
  const rows = grid.rows.filter((row) => row.length > 0);
  const tableStart: SourceLocation = rows[0]?.[0] ?? { line: grid.startLine, column: 1 };
  if (rows.length === 0 || rows.every((row) => row.every((cell) => cell.text === ''))) {
    return failAt(tableStart, 'no-table', 'this table has no cells with text; add the counts with their labels.');
  }
  if (rows.length > MAX_TABLE_ROWS + 2 || rows.some((row) => row.length > MAX_TABLE_COLUMNS + 2)) return tooLarge(grid, tableStart);
  const kinds = rows.map((row) => row.map((cell) => classifyCell(cell.text)));
  const { header, labelColumn, body, bodyKinds, width } = decideLayout(grid.format, rows, kinds);

  const rawData = findRawData(header, body, bodyKinds, width);
  if (rawData) return fail(rawData);
  const ragged = findRaggedRow(header, body, width, grid.format);
  if (ragged) return fail(ragged);
  if (body.length === 0) {
    return failAt(tableStart, 'not-a-count-table', 'this table has a header row but no rows of counts below it; add the counts.');
  }
  const firstData = labelColumn ? 1 : 0;
  if (width <= firstData) {
    return failAt(tableStart, 'not-a-count-table', 'this table has labels but no column of counts; add a column with the number of cases.');
  }

  const headerLabels = header && !header.every((cell) => cell.text === '') ? header.map((cell) => stripInlineMarkup(cell.text)) : undefined;
  const rowLabelTexts = body.map((row) => (labelColumn ? stripInlineMarkup(row[0].text) : ''));
  const totalRows = labelColumn ? pickTotals(body.map((_, index) => index), (index) => isTotalsLabel(rowLabelTexts[index])) : new Set<number>();
  const countColumns = Array.from({ length: width - firstData }, (_, index) => index + firstData);
  const totalColumns = headerLabels ? pickTotals(countColumns, (column) => isTotalsLabel(headerLabels[column])) : new Set<number>();
  const dataRows = body.map((_, index) => index).filter((index) => !totalRows.has(index));
  const dataColumns = countColumns.filter((column) => !totalColumns.has(column));
  if (dataRows.length > MAX_TABLE_ROWS || dataColumns.length > MAX_TABLE_COLUMNS || dataRows.length * dataColumns.length > MAX_TABLE_CELLS) {
    return tooLarge(grid, tableStart);
  }

  const decimalComma = grid.delimiter === ';' && rows.some((row) => row.some((cell) => /\d,\d/.test(cell.text)));
  const proportions = findProportions(body, dataRows, dataColumns, decimalComma);
  if (proportions) return fail(proportions);

  const observed: number[][] = [];
  for (const rowIndex of dataRows) {
    const values: number[] = [];
    for (const column of dataColumns) {
      const cell = body[rowIndex][column];
      const count = parseCount(cell.text, { line: cell.line, column: cell.column }, { decimalComma });
      if (!count.ok) return count;
      values.push(count.value);
    }
    observed.push(values);
  }

  const rowLabels = dataRows.map((rowIndex, position) => rowLabelTexts[rowIndex] || `Row ${position + 1}`);
  const columnLabels = dataColumns.map((column, position) => headerLabels?.[column] || `Column ${columnLetters(position)}`);
  const warnings: Issue[] = [];
  checkTotals({ body, header, dataRows, dataColumns, totalRows, totalColumns, observed, rowLabels, columnLabels, decimalComma, rowLabelTexts, headerLabels }, warnings);

  // Whole numbers that add up to 100 per row may be percentages or a design with 100 per group:
  // the test goes ahead, and the note (shown in every report) asks the user to check.
  const percentages = findWholePercentages(observed, body, dataRows, dataColumns);
  if (percentages) warnings.push(percentages);
  if (observed.every((values) => values.every((value) => value === 0))) {
    const first = body[dataRows[0]][dataColumns[0]];
    return failAt(first, 'all-zero-table', 'every count in this table is 0; there is nothing to test. Enter the counts.');
  }

  const locations = dataRows.map((rowIndex) => dataColumns.map((column) => ({ line: body[rowIndex][column].line, column: body[rowIndex][column].column })));
  const table = options.keepZeroLines ? { observed, locations, rowLabels, columnLabels } : dropZeroLines({ observed, locations, rowLabels, columnLabels }, warnings);
  if (table.observed.length * table.columnLabels.length < 2) {
    const only = table.locations[0][0];
    return failAt(only, 'too-few-categories', 'this table has a single count; a test needs at least two categories. Add the other rows or columns.');
  }
  return ok({
    format: grid.format,
    rowLabels: table.rowLabels,
    columnLabels: table.columnLabels,
    observed: table.observed,
    cellLocations: table.locations,
    startLine: grid.startLine,
    endLine: grid.endLine,
    rowsOrdered: labelColumn && table.rowLabels.every(isOrderedLabel),
    columnsOrdered: headerLabels !== undefined && table.columnLabels.every(isOrderedLabel),
    generatedRowLabels: !labelColumn,
    generatedColumnLabels: headerLabels === undefined,
    warnings,
  });
}

function failAt<T>(where: SourceLocation, code: Issue['code'], problem: string): Result<T> {
  const location = { line: where.line, column: where.column };
  return fail({ code, message: `${describeLocation(location)}: ${problem}`, location });
}

function tooLarge<T>(grid: RawGrid, where: SourceLocation): Result<T> {
  const width = grid.rows.reduce((widest, row) => Math.max(widest, row.length), 0);
  return failAt(where, 'table-too-large',
    `this table has ${grid.rows.length} rows and ${width} columns; Tallywise reads at most ${MAX_TABLE_ROWS} rows, ` +
    `${MAX_TABLE_COLUMNS} columns and ${MAX_TABLE_CELLS} counts. Summarise the data into a smaller table first.`);
}

interface Layout {
  header: RawCell[] | undefined;
  labelColumn: boolean;
  body: RawCell[][];
  bodyKinds: CellKind[][];
  width: number;
}

function decideLayout(format: RawGrid['format'], rows: RawCell[][], kinds: CellKind[][]): Layout {
  const first = kinds[0];
  const labelsBelow = hasLabelColumn(rows.slice(1), kinds.slice(1));
  let hasHeader: boolean;
  if (format === 'markdown') {
    hasHeader = true;
  } else {
    // The corner above a column of labels may hold a title, so only the cells above counts decide.
    const aboveCounts = labelsBelow ? first.slice(1) : first;
    const numericLabels = labelsBelow && first.length >= 2 && aboveCounts.every((kind) => kind === 'number')
      && (first[0] === 'empty' || looksLikeYears(rows[0].slice(1)));
    hasHeader = aboveCounts.includes('text') || numericLabels;
  }
  let header = hasHeader ? rows[0] : undefined;
  const body = rows.slice(hasHeader ? 1 : 0);
  const bodyKinds = kinds.slice(hasHeader ? 1 : 0);
  if (header && format === 'delimited' && body.length > 0 && body.every((row) => row.length === header!.length + 1)) {
    header = [{ text: '', line: header[0].line, column: header[0].column }, ...header];
  }
  const width = header ? header.length : rows[0].length;
  const headerNamed = header !== undefined && header.some((cell) => cell.text !== '');
  const labelColumn = hasLabelColumn(body, bodyKinds) || (headerNamed && width >= 2 && header![0].text === '') ||
    (header !== undefined && looksLikeScalePoints(header, body));
  return { header, labelColumn, body, bodyKinds, width };
}

/**
 * A two-way table of scale points: the corner names the row variable ("Visits"), the other header
 * cells read as numbers or ranges, and the first column runs 0, 1, 2, … or 1, 2, 3, … (at least
 * three rows). Counts in that first column would have to be exactly consecutive integers, so it is
 * read as labels (our judgement call, like the years rule).
 */
function looksLikeScalePoints(header: RawCell[], body: RawCell[][]): boolean {
  const corner = stripInlineMarkup(header[0]?.text ?? '');
  if (corner === '' || isOrderedLabel(corner) || header.length < 3 || body.length < 3) return false;
  if (!header.slice(1).every((cell) => isOrderedLabel(stripInlineMarkup(cell.text)))) return false;
  const firsts = body.map((row) => stripInlineMarkup(row[0]?.text ?? ''));
  if (!firsts.every((text) => /^\d+$/.test(text))) return false;
  const values = firsts.map(Number);
  return (values[0] === 0 || values[0] === 1) && values.every((value, index) => value === values[0] + index);
}

/** Row labels: some first cell is text, or the first cells are years (2021, 2022, ...), which no one tests as counts. */
function hasLabelColumn(body: RawCell[][], bodyKinds: CellKind[][]): boolean {
  if (bodyKinds.some((row) => row[0] === 'text')) return true;
  return body.length >= 2 && body.every((row) => row.length >= 2) && looksLikeYears(body.map((row) => row[0]));
}

/** Calendar years in order, the usual numeric labels; the range 1900-2100 is our judgement call. */
const FIRST_YEAR = 1900;
const LAST_YEAR = 2100;

function looksLikeYears(cells: RawCell[]): boolean {
  const years = cells.map((cell) => stripInlineMarkup(cell.text));
  if (years.length < 2 || !years.every((year) => /^\d{4}$/.test(year))) return false;
  const values = years.map(Number);
  if (!values.every((year) => year >= FIRST_YEAR && year <= LAST_YEAR)) return false;
  const ascending = values.every((year, index) => index === 0 || year > values[index - 1]);
  const descending = values.every((year, index) => index === 0 || year < values[index - 1]);
  return ascending || descending;
}

function columnName(header: RawCell[] | undefined, column: number): string {
  const label = header?.[column] ? stripInlineMarkup(header[column].text) : '';
  return label !== '' ? label : columnLetters(column);
}

/** Two or more columns mostly of text: a list of observations, not a table of counts. */
function findRawData(header: RawCell[] | undefined, body: RawCell[][], bodyKinds: CellKind[][], width: number): Issue | undefined {
  if (body.length === 0) return undefined;
  const textColumns: number[] = [];
  for (let column = 0; column < width; column += 1) {
    const texts = bodyKinds.filter((row) => row[column] === 'text').length;
    if (texts * 2 > body.length) textColumns.push(column);
  }
  if (textColumns.length < 2) return undefined;
  const names = textColumns.slice(0, 2).map((column) => columnName(header, column));
  const joined = names.join(',');
  const flag = /[\s"']/.test(joined) ? `"${joined.replaceAll('"', '\\"')}"` : joined;
  const firstText = body.find((_, index) => bodyKinds[index][textColumns[0]] === 'text')![textColumns[0]];
  const location = { line: firstText.line, column: firstText.column };
  return {
    code: 'raw-data',
    message: `${describeLocation(location)}: columns "${names[0]}" and "${names[1]}" hold text in most rows, so this looks like one row ` +
      `per observation, not a table of counts. Cross-tabulate two of its columns (--columns ${flag}).`,
    location,
  };
}

function findRaggedRow(header: RawCell[] | undefined, body: RawCell[][], width: number, format: RawGrid['format']): Issue | undefined {
  const reference = header ?? body[0];
  const referenceName = header ? 'the header row' : 'the first row';
  for (const row of header ? body : body.slice(1)) {
    if (row.length === width || (row.length > width && row.slice(width).every((cell) => cell.text === ''))) continue;
    const where = row.length > width ? row[width] : row[row.length - 1];
    const location = { line: where.line, column: where.column };
    const cells = row.length === 1 ? '1 cell' : `${row.length} cells`;
    // GFM reads a line right after a table as one more row, so a caption typed there lands here.
    const fix = format === 'markdown' && row.length === 1
      ? 'if this line is not part of the table, leave a blank line before it; otherwise add the missing cells (0 for none)'
      : 'add the missing cells (0 for none) or remove the extra ones';
    return {
      code: 'ragged-row',
      message: `${describeLocation(location)}: line ${where.line} has ${cells} but ${referenceName} (line ${reference[0].line}) has ${width}; ${fix}.`,
      location,
    };
  }
  return undefined;
}

const TOTALS_LABEL = /^(?:grand\s+)?(?:totals?|sum|all|σ|∑)\s*:?$/iu;

function isTotalsLabel(label: string): boolean {
  return TOTALS_LABEL.test(label);
}

/** Totals are excluded only when at least one other row (or column) is left to test. */
function pickTotals(candidates: number[], isTotals: (index: number) => boolean): Set<number> {
  const totals = candidates.filter(isTotals);
  return totals.length < candidates.length ? new Set(totals) : new Set();
}

/** Slack for binary floating-point error in a sum of a few short decimals (far below any printed digit). */
const FLOATING_SUM_SLACK = 1e-9;

/** Half a unit in the last printed decimal, per summed cell: the most rounding can move a printed sum. */
function roundingAllowance(cells: number, decimals: number): number {
  return cells * 0.5 * 10 ** -decimals + FLOATING_SUM_SLACK;
}

function findProportions(body: RawCell[][], dataRows: number[], dataColumns: number[], decimalComma: boolean): Issue | undefined {
  const decimal = decimalComma ? /^(\d*),(\d+)$|^\d+$/ : /^(\d*)\.(\d+)$|^\d+$/;
  let decimals = 0;
  let firstFraction: RawCell | undefined;
  const values: number[][] = [];
  for (const rowIndex of dataRows) {
    const rowValues: number[] = [];
    for (const column of dataColumns) {
      const cell = body[rowIndex][column];
      const visible = stripInlineMarkup(cell.text);
      const match = decimal.exec(visible);
      if (!match) return undefined;
      if (match[2] !== undefined && /[1-9]/.test(match[2])) {
        firstFraction ??= cell;
        decimals = Math.max(decimals, match[2].length);
      }
      rowValues.push(Number(visible.replace(',', '.')));
    }
    values.push(rowValues);
  }
  if (!firstFraction) return undefined;
  const rowCount = values.length;
  const columnCount = dataColumns.length;
  const rowSums = values.map((row) => row.reduce((sum, value) => sum + value, 0));
  const columnSums = dataColumns.map((_, column) => values.reduce((sum, row) => sum + row[column], 0));
  const total = rowSums.reduce((sum, value) => sum + value, 0);
  let found: string | undefined;
  for (const target of [1, 100]) {
    const addsUpToTarget = (cells: number, sum: number): boolean => Math.abs(sum - target) <= roundingAllowance(cells, decimals);
    if (columnCount >= 2 && rowSums.every((sum) => addsUpToTarget(columnCount, sum))) found = 'each row adds up to ' + target;
    else if (rowCount >= 2 && columnSums.every((sum) => addsUpToTarget(rowCount, sum))) found = 'each column adds up to ' + target;
    else if (addsUpToTarget(rowCount * columnCount, total)) found = 'the cells add up to ' + target;
    if (found) break;
  }
  if (!found) return undefined;
  const location = { line: firstFraction.line, column: firstFraction.column };
  return {
    code: 'percentages-not-counts',
    message: `${describeLocation(location)}: ${found}, so these look like proportions or percentages; enter the counts, not percentages: ` +
      'the number of cases in each cell.',
    location,
  };
}

function findWholePercentages(observed: number[][], body: RawCell[][], dataRows: number[], dataColumns: number[]): Issue | undefined {
  const rowCount = observed.length;
  const columnCount = dataColumns.length;
  if (rowCount < 2 || columnCount < 2) return undefined;
  const rowsAre100 = observed.every((row) => row.reduce((sum, value) => sum + value, 0) === PERCENT_TOTAL);
  const columnsAre100 = dataColumns.every((_, column) => observed.reduce((sum, row) => sum + row[column], 0) === PERCENT_TOTAL);
  if (!rowsAre100 && !columnsAre100) return undefined;
  const first = body[dataRows[0]][dataColumns[0]];
  const location = { line: first.line, column: first.column };
  return {
    code: 'percentages-not-counts',
    message: `${describeLocation(location)}: every ${rowsAre100 ? 'row' : 'column'} adds up to exactly 100. If these are percentages the test is not valid: ` +
      'enter the counts, not percentages (the number of cases in each cell). If each group really has 100 cases, this note can be ignored.',
    location,
  };
}

const PERCENT_TOTAL = 100;

interface TotalsInput {
  body: RawCell[][];
  header: RawCell[] | undefined;
  dataRows: number[];
  dataColumns: number[];
  totalRows: Set<number>;
  totalColumns: Set<number>;
  observed: number[][];
  rowLabels: string[];
  columnLabels: string[];
  rowLabelTexts: string[];
  headerLabels: string[] | undefined;
  decimalComma: boolean;
}

function checkTotals(input: TotalsInput, warnings: Issue[]): void {
  const { body, header, dataRows, dataColumns, totalRows, totalColumns, observed, rowLabels, columnLabels, decimalComma } = input;
  const stated = (cell: RawCell | undefined): number | undefined => {
    if (!cell) return undefined;
    const count = parseCount(cell.text, { line: cell.line, column: cell.column }, { decimalComma });
    return count.ok ? count.value : undefined;
  };
  const mismatch = (cell: RawCell, what: string, said: number, actual: number): void => {
    const location = { line: cell.line, column: cell.column };
    warnings.push({
      code: 'totals-mismatch',
      message: `${describeLocation(location)}: ${what} says ${said}, but the counts add up to ${actual}; check the counts and the total.`,
      location,
    });
  };
  const rowSums = observed.map((row) => row.reduce((sum, value) => sum + value, 0));
  const columnSums = dataColumns.map((_, position) => observed.reduce((sum, row) => sum + row[position], 0));
  const grandTotal = rowSums.reduce((sum, value) => sum + value, 0);
  for (const rowIndex of totalRows) {
    const label = input.rowLabelTexts[rowIndex];
    dataColumns.forEach((column, position) => {
      const cell = body[rowIndex][column];
      const said = stated(cell);
      if (said !== undefined && said !== columnSums[position]) mismatch(cell, `the ${label} row for "${columnLabels[position]}"`, said, columnSums[position]);
    });
    for (const column of totalColumns) {
      const cell = body[rowIndex][column];
      const said = stated(cell);
      if (said !== undefined && said !== grandTotal) mismatch(cell, `the grand total`, said, grandTotal);
    }
    const labelCell = body[rowIndex][0];
    warnings.push(note(labelCell, 'totals-excluded', `the "${label}" row (line ${labelCell.line}) was left out of the test; it holds totals, which were checked against the counts.`));
  }
  for (const column of totalColumns) {
    const label = input.headerLabels?.[column] ?? '';
    dataRows.forEach((rowIndex, position) => {
      const cell = body[rowIndex][column];
      const said = stated(cell);
      if (said !== undefined && said !== rowSums[position]) mismatch(cell, `the ${label} column for "${rowLabels[position]}"`, said, rowSums[position]);
    });
    const labelCell = header![column];
    warnings.push(note(labelCell, 'totals-excluded', `the "${label}" column was left out of the test; it holds totals, which were checked against the counts.`));
  }
}

function note(cell: RawCell, code: Issue['code'], text: string): Issue {
  const location = { line: cell.line, column: cell.column };
  return { code, message: `${describeLocation(location)}: ${text}`, location };
}

interface LabelledCounts {
  observed: number[][];
  locations: SourceLocation[][];
  rowLabels: string[];
  columnLabels: string[];
}

function dropZeroLines(input: LabelledCounts, warnings: Issue[]): LabelledCounts {
  let { observed, locations, rowLabels, columnLabels } = input;
  if (columnLabels.length >= 2) {
    const keep = observed.map((row) => row.some((value) => value !== 0));
    observed.forEach((_, position) => {
      if (keep[position]) return;
      const where = locations[position][0];
      warnings.push(note({ text: '', line: where.line, column: where.column }, 'zero-row-dropped',
        `the row "${rowLabels[position]}" was left out: all its counts are 0, so its expected counts are 0 and it cannot be tested.`));
    });
    observed = observed.filter((_, position) => keep[position]);
    locations = locations.filter((_, position) => keep[position]);
    rowLabels = rowLabels.filter((_, position) => keep[position]);
  }
  if (observed.length >= 2) {
    const keep = columnLabels.map((_, column) => observed.some((row) => row[column] !== 0));
    columnLabels.forEach((label, column) => {
      if (keep[column]) return;
      const where = locations[0][column];
      warnings.push(note({ text: '', line: where.line, column: where.column }, 'zero-column-dropped',
        `the column "${label}" was left out: all its counts are 0, so its expected counts are 0 and it cannot be tested.`));
    });
    observed = observed.map((row) => row.filter((_, column) => keep[column]));
    locations = locations.map((row) => row.filter((_, column) => keep[column]));
    columnLabels = columnLabels.filter((_, column) => keep[column]);
  }
  return { observed, locations, rowLabels, columnLabels };
}

/** Numbers and numeric ranges: `3`, `0-4`, `5–9`, `10+`, `<5`, `≥ 65`. */
const ORDERED_LABEL = /^(?:[<>≤≥]=?\s*)?\d+(?:[.,]\d+)?(?:\s*[-–—]\s*\d+(?:[.,]\d+)?|\s*\+)?$/u;

function isOrderedLabel(label: string): boolean {
  return ORDERED_LABEL.test(label);
}

/** Spreadsheet-independent bijective base-26 names: A..Z, AA, AB, ... */
function columnLetters(position: number): string {
  let name = '';
  let rest = position + 1;
  while (rest > 0) {
    const digit = (rest - 1) % 26;
    name = String.fromCharCode(65 + digit) + name;
    rest = Math.floor((rest - 1) / 26);
  }
  return name;
}
