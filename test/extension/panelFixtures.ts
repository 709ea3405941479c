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

/** Sailing school: the same 66 pupils' knot test before and after a lesson (paired 2×2). */
export const SAILING_KNOTS = [
  '| Before \\ After | Tied | Not tied |',
  '|---|---|---|',
  '| Tied | 40 | 3 |',
  '| Not tied | 14 | 9 |',
].join('\n');

/** Laundry: torn sheets by machine in three shifts, one 2×2 table per shift (strata). */
export const LAUNDRY_SHIFTS = [
  '## Early', '', '| Machine | Torn | Fine |', '|---|---|---|', '| Old | 9 | 93 |', '| New | 4 | 97 |', '',
  '## Late', '', '| Machine | Torn | Fine |', '|---|---|---|', '| Old | 12 | 70 |', '| New | 6 | 80 |', '',
  '## Night', '', '| Machine | Torn | Fine |', '|---|---|---|', '| Old | 5 | 40 |', '| New | 3 | 45 |',
].join('\n');

/** The same analysis with a stratum named like markup (the reader strips tags from headings, so this tests the panel alone). */
export function withHostileStratum(analysis: Analysis): Analysis {
  if (!analysis.stratified) throw new Error('withHostileStratum needs a stratified analysis');
  const strata = analysis.stratified.strata.map((stratum, index) => (index === 1 ? { ...stratum, label: HOSTILE_ROW } : stratum));
  return { ...analysis, stratified: { ...analysis.stratified, strata } };
}
