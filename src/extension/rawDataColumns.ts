import { parseDelimited } from '../core/table/parseDelimited';
import { categoricalColumns, looksLikeRawData } from '../core/table/rawData';

/**
 * The columns a person can cross-tabulate when a delimited file holds one row per observation.
 *
 * @param text - the whole delimited file
 * @returns the categorical column names (two or more), or undefined when the file is a table of counts or unreadable
 */
export function rawDataColumns(text: string): string[] | undefined {
  const grid = parseDelimited(text);
  if (!grid.ok || grid.value.rows.length < 2) return undefined;
  const header = grid.value.rows[0].map((cell) => cell.text);
  const rows = grid.value.rows.slice(1).map((row) => row.map((cell) => cell.text));
  if (!looksLikeRawData(header, rows)) return undefined;
  return categoricalColumns(header, rows).map((index) => header[index]);
}
