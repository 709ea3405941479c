import type { AnalyzeRequest } from '../core/analyze';
import { ok, type Result } from '../core/types';
import { readPointedTable } from './readPointedTable';

/** The pointed-at table read as the anticipated values of the next study. */
export interface TableForPlan {
  /** Rows are groups, columns outcomes; counts become each row's proportions. Absent for one row or column. */
  groups?: number[][];
  /** A single row or column: the anticipated category proportions (a goodness-of-fit plan needs null proportions too). */
  categories?: { labels: string[]; proportions: number[] };
  /** The counts as read, with their labels: a finished study's table, for the sensitivity of its size. */
  observed: number[][];
  rowLabels: string[];
  columnLabels: string[];
  /** 1-based first and last lines of the table; a paragraph can go below the last. */
  startLine: number;
  endLine: number;
}

/**
 * Reads the table at the cursor (or selection) as anticipated proportions for `planStudy`: a pilot
 * table's counts per group become that group's outcome proportions (groups equal in size unless the
 * person says otherwise).
 *
 * @param request - where the table is
 * @returns the groups or categories, or the engine's issue (no table, not counts)
 */
export function planFromTable(request: Pick<AnalyzeRequest, 'text' | 'format' | 'line' | 'selection'>): Result<TableForPlan> {
  const read = readPointedTable(request);
  if (!read.ok) return read;
  const { observed, rowLabels, columnLabels, startLine, endLine } = read.value;
  const source = { observed, rowLabels, columnLabels, startLine, endLine };
  const share = (counts: number[]) => {
    const total = counts.reduce((a, b) => a + b, 0);
    return counts.map((count) => count / total);
  };
  if (observed.length === 1) return ok({ categories: { labels: columnLabels, proportions: share(observed[0]) }, ...source });
  if (observed[0].length === 1) return ok({ categories: { labels: rowLabels, proportions: share(observed.map((row) => row[0])) }, ...source });
  return ok({ groups: observed.map(share), ...source });
}
