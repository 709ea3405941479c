import type { AnalyzeRequest } from '../core/analyze';
import { locateTable } from '../core/table/locateTable';
import { readCountTable } from '../core/table/readCountTable';
import { ok, type Result } from '../core/types';

/** The pointed-at table read as the anticipated values of the next study. */
export interface TableForPlan {
  /** Rows are groups, columns outcomes; counts become each row's proportions. Absent for one row or column. */
  groups?: number[][];
  /** A single row or column: the anticipated category proportions (a goodness-of-fit plan needs null proportions too). */
  categories?: { labels: string[]; proportions: number[] };
  /** 1-based last line of the table, where a paragraph can go below it. */
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
  const located = locateTable(request.text, { format: request.format, line: request.line, selection: request.selection });
  if (!located.ok) return located;
  const read = readCountTable(located.value.grid);
  if (!read.ok) return read;
  const { observed, rowLabels, columnLabels, endLine } = read.value;
  const share = (counts: number[]) => {
    const total = counts.reduce((a, b) => a + b, 0);
    return counts.map((count) => count / total);
  };
  if (observed.length === 1) return ok({ categories: { labels: columnLabels, proportions: share(observed[0]) }, endLine });
  if (observed[0].length === 1) return ok({ categories: { labels: rowLabels, proportions: share(observed.map((row) => row[0])) }, endLine });
  return ok({ groups: observed.map(share), endLine });
}
