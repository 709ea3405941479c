/**
 * The engine's data model. Every layer (CLI, extension, panel) reads these shapes; the JSON
 * names documented in the README come from here, so renaming a field is an interface change.
 *
 * Conventions:
 * - Lines and columns are 1-based, as a person reads them ("line 12, column 5"). The editor
 *   layer converts to 0-based positions.
 * - Parsers and the engine never throw on bad input: they return `{ ok: false, issue }`.
 *   Only programmer errors throw.
 * - Validity problems and things the engine did on the user's behalf (dropped a zero row,
 *   excluded a totals column) are `Issue`s in a `warnings` or `notes` list: data the report shows.
 */

/** A place in the user's document. */
export interface SourceLocation {
  /** 1-based line number. */
  line: number;
  /** 1-based column (UTF-16 code units, as editors count). */
  column: number;
}

/** Stable machine-readable kinds of problems; the message is for people. */
export type IssueCode =
  | 'no-table'
  | 'not-a-count-table'
  | 'empty-cell'
  | 'negative-count'
  | 'non-integer-count'
  | 'text-in-count-cell'
  | 'percentages-not-counts'
  | 'ragged-row'
  | 'too-few-categories'
  | 'zero-row-dropped'
  | 'zero-column-dropped'
  | 'all-zero-table'
  | 'table-too-large'
  | 'ambiguous-number'
  | 'totals-mismatch'
  | 'totals-excluded'
  | 'bad-expected'
  | 'bad-option'
  | 'unknown-column'
  | 'raw-data'
  | 'validity'
  | 'sparse-fit'
  | 'rescaled-expected'
  | 'unreadable'
  | 'paired-labels'
  | 'heterogeneity'
  | 'empty-strata'
  | 'strata'
  | 'cancelled';

export interface Issue {
  code: IssueCode;
  /** One or two plain sentences: what is wrong and what to do. Names the cell where there is one. */
  message: string;
  location?: SourceLocation;
}

export type Result<T> = { ok: true; value: T } | { ok: false; issue: Issue };

export function ok<T>(value: T): Result<T> {
  return { ok: true, value };
}

export function fail<T>(issue: Issue): Result<T> {
  return { ok: false, issue };
}

export type TableFormat = 'markdown' | 'delimited' | 'aligned' | 'crosstab';

/** One cell's text as it stands in the document, with where it starts. */
export interface RawCell {
  /** The cell text with surrounding whitespace removed (markup not yet stripped). */
  text: string;
  line: number;
  column: number;
}

/** A table as a grid of texts, before anything is decided about labels or counts. */
export interface RawGrid {
  format: Exclude<TableFormat, 'crosstab'>;
  rows: RawCell[][];
  /** First and last document lines of the table (1-based, inclusive). */
  startLine: number;
  endLine: number;
  /** For delimited text: the delimiter that was detected. */
  delimiter?: string;
}

/** A table of non-negative whole counts with labels, ready for a test. */
export interface CountTable {
  format: TableFormat;
  rowLabels: string[];
  columnLabels: string[];
  /** observed[row][column]; excludes totals rows/columns and dropped all-zero rows/columns. */
  observed: number[][];
  /** Where each observed cell stands in the document (same shape as `observed`); absent for cross-tabulations. */
  cellLocations?: SourceLocation[][];
  startLine: number;
  endLine: number;
  /** Labels that look ordered (numbers, ranges like `0-4`, `5+`), so merges keep neighbours together. */
  rowsOrdered: boolean;
  columnsOrdered: boolean;
  /** True when labels were generated because the document had none. */
  generatedRowLabels: boolean;
  generatedColumnLabels: boolean;
  /** What reading the table did on the user's behalf, and totals that did not add up. */
  warnings: Issue[];
}

/** An estimate with a two-sided confidence interval. */
export interface Interval {
  estimate: number;
  lower: number;
  upper: number;
  /** Confidence level, e.g. 0.95. */
  level: number;
  method: string;
}

/** An upper-tail probability, kept also as log10 so that p below the smallest double is never shown as 0. */
export interface TailProbability {
  p: number;
  log10p: number;
}

export interface CellRef {
  row: number;
  column: number;
}

export interface ValidityCheck {
  rule: 'cochran-1954';
  minExpected: number;
  /** Share of cells with expected count below 5 (0..1). */
  shareBelow5: number;
  cellsBelow5: number;
  cellsBelow1: number;
  cellCount: number;
  ok: boolean;
  /** Cells whose expected count is below 5 (those below 1 always fail the rule). */
  sparseCells: (CellRef & { expected: number })[];
}

/** A proposed merge of categories that makes the table pass Cochran's rule, with the merged table's result. */
export interface MergeProposal {
  dimension: 'rows' | 'columns';
  /** Each group lists the original labels merged into one category, e.g. [["0", "1"], ["2"], ["3", "4+"]]. */
  groups: string[][];
  labels: string[];
  observed: number[][];
  /** True when the merged table passes Cochran's rule. */
  passes: boolean;
  statistic: number;
  df: number;
  p: number;
  log10p: number;
  /** Why these categories (adjacent for ordered, sparsest for nominal). */
  reason: string;
}
