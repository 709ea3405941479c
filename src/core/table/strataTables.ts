import type { CountTable, Issue } from '../types';

/** One stratum of a stratified 2×2×K design: its name and its 2×2 table. */
export interface LabelledStratum {
  label: string;
  table: CountTable;
}

/**
 * The strata of a stratified 2×2×K design, ready for the Cochran–Mantel–Haenszel test: every table has the
 * same two row labels and two column labels, in the same order (`rowLabels`, `columnLabels`).
 */
export interface StrataTables {
  strata: LabelledStratum[];
  rowLabels: string[];
  columnLabels: string[];
  /** 1-based numbers of the first and last table used among `count` tables in the document (1 for raw data). */
  firstIndex: number;
  lastIndex: number;
  count: number;
  /** First and last document lines of the tables used (1-based, inclusive). */
  startLine: number;
  endLine: number;
  /** What gathering the strata did on the person's behalf (reordered labels, where the run of tables stopped). */
  notes: Issue[];
}

/** Label comparison across strata: trimmed, case-insensitive (project decision: "Ginger" and "ginger " are one label). */
export function labelKey(label: string): string {
  return label.trim().toLowerCase();
}

/** Positions of `wanted` in `labels` by `labelKey`, or undefined when they are not the same labels. */
function matchOrder(labels: readonly string[], wanted: readonly string[]): number[] | undefined {
  if (labels.length !== wanted.length) return undefined;
  const keys = labels.map(labelKey);
  const order = wanted.map((label) => keys.indexOf(labelKey(label)));
  return order.every((at) => at >= 0) && new Set(order).size === order.length ? order : undefined;
}

/** How a table's labels relate to the reference stratum's: the same, reordered, transposed, or different. */
export type Alignment =
  | { kind: 'same' }
  | { kind: 'reordered'; rowOrder: number[]; columnOrder: number[] }
  | { kind: 'transposed'; rowOrder: number[]; columnOrder: number[] }
  | { kind: 'different' };

/**
 * Compares a table's row and column labels with the reference's.
 *
 * @returns for `reordered`, the table's row/column positions in the reference's order; for `transposed`, the
 *   table's column positions that become the rows (`rowOrder`) and its row positions that become the columns
 */
export function alignLabels(table: Pick<CountTable, 'rowLabels' | 'columnLabels'>, reference: Pick<CountTable, 'rowLabels' | 'columnLabels'>): Alignment {
  const rowOrder = matchOrder(table.rowLabels, reference.rowLabels);
  const columnOrder = matchOrder(table.columnLabels, reference.columnLabels);
  if (rowOrder && columnOrder) {
    const identity = rowOrder.every((at, index) => at === index) && columnOrder.every((at, index) => at === index);
    return identity ? { kind: 'same' } : { kind: 'reordered', rowOrder, columnOrder };
  }
  const rowsFromColumns = matchOrder(table.columnLabels, reference.rowLabels);
  const columnsFromRows = matchOrder(table.rowLabels, reference.columnLabels);
  if (rowsFromColumns && columnsFromRows) return { kind: 'transposed', rowOrder: rowsFromColumns, columnOrder: columnsFromRows };
  return { kind: 'different' };
}

/**
 * The table rearranged to the reference's label order (labels keep the reference's spelling, so the strata
 * read alike); a `different` alignment is a programmer error.
 */
export function applyAlignment(table: CountTable, alignment: Alignment, reference: Pick<CountTable, 'rowLabels' | 'columnLabels'>): CountTable {
  if (alignment.kind === 'same') return { ...table, rowLabels: [...reference.rowLabels], columnLabels: [...reference.columnLabels] };
  if (alignment.kind === 'different') throw new Error('applyAlignment() called with tables whose labels differ');
  const { rowOrder, columnOrder } = alignment;
  const cell = <T>(grid: T[][], row: number, column: number): T =>
    alignment.kind === 'reordered' ? grid[rowOrder[row]][columnOrder[column]] : grid[columnOrder[column]][rowOrder[row]];
  const rearrange = <T>(grid: T[][]): T[][] => rowOrder.map((_, row) => columnOrder.map((__, column) => cell(grid, row, column)));
  const transposed = alignment.kind === 'transposed';
  const rearranged: CountTable = {
    ...table,
    rowLabels: [...reference.rowLabels],
    columnLabels: [...reference.columnLabels],
    observed: rearrange(table.observed),
    rowsOrdered: transposed ? table.columnsOrdered : table.rowsOrdered,
    columnsOrdered: transposed ? table.rowsOrdered : table.columnsOrdered,
    generatedRowLabels: transposed ? table.generatedColumnLabels : table.generatedRowLabels,
    generatedColumnLabels: transposed ? table.generatedRowLabels : table.generatedColumnLabels,
  };
  if (table.cellLocations) rearranged.cellLocations = rearrange(table.cellLocations);
  return rearranged;
}

/** Whether a table is 2×2 (after totals are left out). */
export function isTwoByTwo(table: Pick<CountTable, 'rowLabels' | 'columnLabels'>): boolean {
  return table.rowLabels.length === 2 && table.columnLabels.length === 2;
}
