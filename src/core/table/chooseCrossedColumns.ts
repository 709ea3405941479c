import { fail, ok, type Issue, type Result, type SourceLocation } from '../types';
import type { CrossTabulateOptions } from './crossTabulationTypes';
import { categoricalColumns, RAW_DATA_SAMPLE_ROWS } from './rawData';

const COUNT_LIKE_NAME = /^(?:counts?|n|freq|frequency|weights?|number|tally|observations?)$/i;

/** Positions in the header of the columns a cross-tabulation reads; -1 for an optional one not chosen. */
export interface CrossedColumns {
  rowIndex: number;
  columnIndex: number;
  weightIndex: number;
  stratumIndex: number;
}

/** A header column in words: its name in quotes, or its position when it has none. */
export function describeColumn(header: readonly string[], index: number): string {
  return header[index] === '' ? `column ${index + 1} (no name)` : `'${header[index]}'`;
}

/**
 * Checks the column names given as options against each other, before any text is read.
 *
 * @returns a message for a `bad-option` issue, or undefined
 */
export function checkColumnOptions(options: CrossTabulateOptions): string | undefined {
  const { columns, weight, stratum } = options;
  if (columns !== undefined && columns[0].trim() === columns[1].trim()) {
    return `Choose two different columns to cross; both are '${columns[0]}'.`;
  }
  if (columns !== undefined && weight !== undefined && columns.some((name) => name.trim() === weight.trim())) {
    return `The weight column '${weight}' cannot also be one of the crossed columns. Choose another weight or other columns.`;
  }
  if (stratum !== undefined) {
    if (stratum.trim() === '') return 'The stratum column name is empty. Name the column whose values split the rows into strata, such as a site or a shift.';
    if (columns !== undefined && columns.some((name) => name.trim() === stratum.trim())) {
      return `The stratum column '${stratum}' cannot also be one of the crossed columns. Choose a third column to split the rows into strata.`;
    }
    if (weight !== undefined && weight.trim() === stratum.trim()) {
      return `The stratum column '${stratum}' cannot also be the weight column. Choose another column for one of them.`;
    }
  }
  return undefined;
}

/** Finds a column by name: exact, else a unique case-insensitive match; an issue lists the columns there are. */
function findColumn(header: readonly string[], name: string, role: string, where: SourceLocation): Result<number> {
  const wanted = name.trim();
  let index = header.indexOf(wanted);
  if (index < 0) {
    const folded = header.map((column) => column.toLowerCase());
    const matches = folded.filter((column) => column === wanted.toLowerCase()).length;
    if (matches === 1) index = folded.indexOf(wanted.toLowerCase());
  }
  if (index >= 0) return ok(index);
  const available = header.map((_, at) => describeColumn(header, at)).join(', ');
  return fail({ code: 'unknown-column', message: `There is no column named '${name}' for the ${role} in the header. Available columns: ${available}.`, location: where });
}

/**
 * Settles which columns a cross-tabulation reads: the named ones, or else the first two categorical columns of
 * the sampled rows (see `categoricalColumns`) other than the weight and stratum columns.
 *
 * @param header - the header's column names, trimmed
 * @param sample - the first data rows, when columns must be chosen
 * @param options - the columns named by the person
 * @param headerLine - the header's document line, where issues point
 * @returns the column positions, or an issue
 */
export function chooseCrossedColumns(header: readonly string[], sample: readonly (readonly string[])[], options: CrossTabulateOptions, headerLine: number): Result<CrossedColumns> {
  const where = { line: headerLine, column: 1 };
  const chosen: CrossedColumns = { rowIndex: -1, columnIndex: -1, weightIndex: -1, stratumIndex: -1 };
  const { columns, weight, stratum } = options;
  if (weight !== undefined) {
    const found = findColumn(header, weight, 'weight', where);
    if (!found.ok) return found;
    chosen.weightIndex = found.value;
  }
  if (stratum !== undefined) {
    const found = findColumn(header, stratum, 'strata', where);
    if (!found.ok) return found;
    chosen.stratumIndex = found.value;
  }
  if (columns !== undefined) {
    const rows = findColumn(header, columns[0], 'rows', where);
    if (!rows.ok) return rows;
    const crossed = findColumn(header, columns[1], 'columns', where);
    if (!crossed.ok) return crossed;
    chosen.rowIndex = rows.value;
    chosen.columnIndex = crossed.value;
    const used = [chosen.rowIndex, chosen.columnIndex, chosen.weightIndex, chosen.stratumIndex].filter((index) => index >= 0);
    if (new Set(used).size < used.length) {
      const twice = used.find((index, at) => used.indexOf(index) !== at) as number;
      return fail({ code: 'bad-option', message: `The names given select the same column twice (${describeColumn(header, twice)}). Choose two different columns to cross, and other columns as weight and strata.`, location: where });
    }
    return ok(chosen);
  }
  if (chosen.stratumIndex >= 0 && chosen.stratumIndex === chosen.weightIndex) {
    return fail({ code: 'bad-option', message: `The names given select the same column twice (${describeColumn(header, chosen.stratumIndex)}). Choose other columns as weight and strata.`, location: where });
  }
  const categorical = categoricalColumns(header, sample).filter((index) => index !== chosen.weightIndex && index !== chosen.stratumIndex);
  if (categorical.length < 2) {
    const found = categorical.length === 0 ? 'none' : `only ${describeColumn(header, categorical[0])}`;
    const besides = chosen.stratumIndex >= 0 ? ' besides the stratum column' : '';
    return fail({ code: 'too-few-categories', message: `Two columns of categories are needed to cross-tabulate, but in the first ${RAW_DATA_SAMPLE_ROWS} rows ${found}${besides} holds repeating text values. Name the two columns to cross (a numeric column can be chosen by name).`, location: where });
  }
  [chosen.rowIndex, chosen.columnIndex] = categorical;
  return ok(chosen);
}

/** A `raw-data` warning when rows are counted once although a column is named like counts, or undefined. */
export function countColumnWarning(header: readonly string[], chosen: CrossedColumns, headerLine: number): Issue | undefined {
  if (chosen.weightIndex >= 0) return undefined;
  const countColumn = header.findIndex((name, index) => index !== chosen.rowIndex && index !== chosen.columnIndex && index !== chosen.stratumIndex && COUNT_LIKE_NAME.test(name));
  if (countColumn < 0) return undefined;
  return {
    code: 'raw-data',
    message: `Each row was counted once, but the column ${describeColumn(header, countColumn)} looks like it holds counts. If each row stands for several observations, choose it as the weight column.`,
    location: { line: headerLine, column: 1 },
  };
}
