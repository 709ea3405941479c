import type { AnalyzeRequest } from '../core/analyze';
import { describeLocation } from '../core/table/describeLocation';
import { fail, ok, type Result } from '../core/types';
import { readPointedTable } from './readPointedTable';

/**
 * The categories a goodness-of-fit test of the pointed-at table would have, so the expected-proportions
 * box can check the user's pattern against their number as they type.
 *
 * @param request - where the table is (text, format, line or selection)
 * @returns the category labels, or the engine's issue (no table, not counts, not one row or column)
 */
export function fitCategories(request: Pick<AnalyzeRequest, 'text' | 'format' | 'line' | 'selection'>): Result<string[]> {
  const read = readPointedTable(request);
  if (!read.ok) return read;
  const table = read.value;
  if (table.rowLabels.length === 1) return ok(table.columnLabels);
  if (table.columnLabels.length === 1) return ok(table.rowLabels);
  const location = { line: table.startLine, column: 1 };
  return fail({
    code: 'bad-option',
    message: `${describeLocation(location)}: testing against expected proportions needs a single row or a single column of counts; this table is ${table.rowLabels.length}×${table.columnLabels.length}. Select one row or column (with its header) and try again.`,
    location,
  });
}
