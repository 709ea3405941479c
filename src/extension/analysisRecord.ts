import type { Analysis } from '../core/analysis';
import type { AnalyzeRequest } from '../core/analyze';
import type { TableJob } from './analysisWorker';
import type { InsertionSnapshot } from './planInsertion';

export type ChartKind = 'proportions' | 'mosaic';

/** Where an analysis came from: the panel keeps this because, while it has focus, there is no active editor. */
export interface AnalysisSnapshot extends InsertionSnapshot {
  /** The document's URI as a string, and its version when the analysis ran. */
  uri: string;
  version: number;
  /** The document's path (for chart file names) and language id. */
  path: string;
  languageId: string;
}

/** One analysis shown in a panel, with what is needed to act on it later. */
export interface AnalysisRecord {
  /** Document URI + table start line (+ the crossed columns): re-running the same table updates the same panel. */
  key: string;
  analysis: Analysis;
  snapshot: AnalysisSnapshot;
  /** The job that produced the analysis, to re-run with another p-value method. */
  job: Omit<AnalyzeRequest, 'control'> | TableJob;
  /** Chart files saved beside the document, by kind, as paths relative to it. */
  charts: Partial<Record<ChartKind, string>>;
}

/** The panel key for a table: the same table in the same document always gets the same key. */
export function panelKey(uri: string, analysis: Analysis): string {
  const crossed = analysis.origin.crossTabulation?.columns;
  return `${uri}#${analysis.table.startLine}${crossed ? `:${crossed.join('×')}` : ''}`;
}

/** The lines startLine..endLine (1-based, inclusive) of a text, as the snapshot keeps them. */
export function tableLines(text: string, startLine: number, endLine: number): string {
  return text.split(/\r?\n/).slice(startLine - 1, endLine).join('\n');
}
