import { findMarkdownTables } from '../core/table/findMarkdownTables';
import { readCountTable } from '../core/table/readCountTable';

/** Documents longer than this get no CodeLens: reading every table on each edit would lag typing (project decision). */
export const MAX_LENS_DOCUMENT_LENGTH = 1_000_000;
/** At most this many lenses per document, for the same reason (project decision). */
export const MAX_LENS_TABLES = 200;

export interface LensTable {
  /** 1-based first and last lines of the table. */
  startLine: number;
  endLine: number;
}

/**
 * The Markdown tables worth a "Test this table" lens: those that read as a table of counts. Uses only the
 * light table finder and reader, never the statistics, so the lens costs no engine load.
 *
 * @param text - the whole Markdown document
 * @returns the count tables in document order
 */
export function countTablesForLens(text: string): LensTable[] {
  if (text.length > MAX_LENS_DOCUMENT_LENGTH) return [];
  const found: LensTable[] = [];
  for (const grid of findMarkdownTables(text)) {
    if (found.length >= MAX_LENS_TABLES) break;
    if (readCountTable(grid).ok) found.push({ startLine: grid.startLine, endLine: grid.endLine });
  }
  return found;
}
