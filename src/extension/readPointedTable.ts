import type { AnalyzeRequest } from '../core/analyze';
import { locateTable } from '../core/table/locateTable';
import { readCountTable } from '../core/table/readCountTable';
import type { CountTable, Result } from '../core/types';

/** The count table a command points at (cursor or selection), read as the engine reads it. */
export function readPointedTable(request: Pick<AnalyzeRequest, 'text' | 'format' | 'line' | 'selection'>): Result<CountTable> {
  const located = locateTable(request.text, { format: request.format, line: request.line, selection: request.selection });
  if (!located.ok) return located;
  return readCountTable(located.value.grid);
}
