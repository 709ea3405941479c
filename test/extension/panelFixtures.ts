import { analyze, type AnalyzeRequest } from '../../src/core/analyze';
import type { Analysis } from '../../src/core/analysis';

// Invented tables for the panel's tests (scenarios of our own).

/** Greenhouse: seedlings' condition after three weeks, by bench (4×3, every expected count ≥ 5). */
export const GREENHOUSE = [
  '| Bench | Thriving | Wilting | Lost |',
  '|---|---|---|---|',
  '| North | 48 | 12 | 6 |',
  '| South | 31 | 22 | 9 |',
  '| Glass roof | 55 | 8 | 5 |',
  '| Shade net | 20 | 25 | 14 |',
].join('\n');

/** Ski school: passed the first-day test, by lesson format (2×2). */
export const SKI_SCHOOL = [
  '| Lesson | Passed | Not yet |',
  '|---|---|---|',
  '| Group | 41 | 19 |',
  '| Private | 33 | 7 |',
].join('\n');

/** Bus depot: breakdowns by route colour; one column is sparse, so Cochran's rule fails. */
export const BUS_DEPOT_SPARSE = [
  '| Route | Engine | Doors | Tyres |',
  '|---|---|---|---|',
  '| Green | 10 | 1 | 12 |',
  '| Blue | 9 | 0 | 14 |',
  '| Black | 11 | 2 | 8 |',
].join('\n');

/** Bakery: loaves returned per weekday (goodness of fit to equal shares). */
export const BAKERY_RETURNS = [
  '| Day | Mon | Tue | Wed | Thu | Fri |',
  '|---|---|---|---|---|---|',
  '| Returned | 22 | 17 | 25 | 31 | 45 |',
].join('\n');

export const HOSTILE_ROW = '<img src=x onerror=alert(1)>';
export const HOSTILE_COLUMN = '</script><script>alert(2)</script>';

/**
 * The engine strips markup from labels when it reads a table, but the panel must not rely on that:
 * this puts hostile labels straight into an analysed table, as a future reader might let through.
 */
export function withHostileLabels(analysis: Analysis): Analysis {
  const rowLabels = analysis.table.rowLabels.map((label, i) => (i === 0 ? HOSTILE_ROW : `${label} & "quoted" 'row'`));
  const columnLabels = analysis.table.columnLabels.map((label, i) => (i === 0 ? HOSTILE_COLUMN : label));
  return { ...analysis, table: { ...analysis.table, rowLabels, columnLabels } };
}

/** Runs the engine on a fixture; fails the test loudly when the engine refuses it. */
export function analyzed(text: string, request: Partial<AnalyzeRequest> = {}): Analysis {
  const result = analyze({ text, format: 'markdown', ...request });
  if (!result.ok) throw new Error(`fixture did not analyse: ${result.issue.message}`);
  return result.value;
}
