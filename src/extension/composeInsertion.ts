import type { Analysis } from '../core/analysis';
import type { ChartKind } from './analysisRecord';
import { chartReference } from './chartFiles';

export interface InsertionChoices {
  withExpectedTable: boolean;
  withChartLink: boolean;
}

/**
 * The text to insert under a table: the write-up, then (if asked) the expected-count table and links to
 * the charts saved so far, separated by blank lines. The analysis's markup decides Markdown or plain text.
 *
 * @param analysis - the analysis, rendered in the document's markup
 * @param charts - saved chart files relative to the document
 * @param choices - what to add beside the write-up
 * @returns the text, without surrounding blank lines, and whether a chart link was asked for but none is saved
 */
export function composeInsertion(analysis: Analysis, charts: Partial<Record<ChartKind, string>>, choices: InsertionChoices): { text: string; missingChart: boolean } {
  const parts = [analysis.writeUp.trim()];
  if (choices.withExpectedTable) parts.push(analysis.expectedTable.trim());
  const saved = (['proportions', 'mosaic'] as const).filter((kind) => charts[kind] !== undefined);
  if (choices.withChartLink) {
    for (const kind of saved) parts.push(chartReference(charts[kind]!, kind, analysis.options.markup === 'markdown'));
  }
  return { text: parts.filter((part) => part !== '').join('\n\n'), missingChart: choices.withChartLink && saved.length === 0 };
}
