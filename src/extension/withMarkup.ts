import type { Analysis, AnalyzeOptions } from '../core/analysis';
import { contributionsTable, expectedCountsTable } from '../core/report/markdownTables';
import { writeUp } from '../core/report/writeUp';

/**
 * The same analysis with its write-up and tables rendered in another markup (Markdown for the clipboard,
 * plain text for a plain-text file); the statistics, and any exact p, are reused, not recomputed.
 *
 * @param analysis - a finished analysis
 * @param markup - the markup wanted
 * @returns the analysis itself when it already has that markup, else a re-rendered copy
 */
export function withMarkup(analysis: Analysis, markup: AnalyzeOptions['markup']): Analysis {
  if (analysis.options.markup === markup) return analysis;
  const options = { ...analysis.options, markup };
  return {
    ...analysis,
    options,
    writeUp: writeUp(analysis, options),
    expectedTable: expectedCountsTable(analysis.result, analysis.table, options),
    contributionsTable: contributionsTable(analysis.result, analysis.table, options),
  };
}
