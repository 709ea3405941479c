import type { AnalyzeRequest } from '../core/analyze';
import { ok, type Result } from '../core/types';
import { readPointedTable } from './readPointedTable';

/** What the design questions need to know about the pointed-at table: its labels and which read as ordered. */
export interface TableShape {
  rowLabels: string[];
  columnLabels: string[];
  rowsOrdered: boolean;
  columnsOrdered: boolean;
}

/**
 * The labels of the table a command points at, so the ordered-categories step can offer the dimensions
 * whose labels read as numbers or ranges and check typed scores against the number of categories.
 */
export function tableShape(request: Pick<AnalyzeRequest, 'text' | 'format' | 'line' | 'selection'>): Result<TableShape> {
  const read = readPointedTable(request);
  if (!read.ok) return read;
  const { rowLabels, columnLabels, rowsOrdered, columnsOrdered } = read.value;
  return ok({ rowLabels, columnLabels, rowsOrdered, columnsOrdered });
}

/** "0, 1, 2, 5" → numbers; a message when the list is not one finite number per category. */
export function parseScores(text: string, count: number): Result<number[] | undefined> {
  const trimmed = text.trim();
  if (trimmed === '') return ok(undefined);
  const parts = trimmed.split(/[,;\s]+/).filter((part) => part !== '');
  const scores = parts.map(Number);
  if (scores.some((score) => !Number.isFinite(score))) {
    return { ok: false, issue: { code: 'bad-option', message: `Scores must be numbers separated by commas, like 0, 1, 2, 5 (got "${trimmed}").` } };
  }
  if (scores.length !== count) {
    return { ok: false, issue: { code: 'bad-option', message: `Give ${count} scores, one per category in order (got ${scores.length}).` } };
  }
  if (new Set(scores).size < 2) return { ok: false, issue: { code: 'bad-option', message: 'The scores must not all be equal.' } };
  return ok(scores);
}
