import type { ChosenPValue, PValueOptions } from './exact/choosePValue';
import type { TestOptions, TestResult } from './stats/types';
import type { CountTable, Issue } from './types';

/** How the report reads: a full paragraph or the one-line result; Markdown emphasis or plain text. */
export interface ReportOptions {
  /** Decimal places for statistics and effect sizes (p-values follow their own rule). */
  decimals: number;
  style: 'paragraph' | 'line';
  markup: 'markdown' | 'plain';
}

export const DEFAULT_REPORT_OPTIONS: ReportOptions = { decimals: 2, style: 'paragraph', markup: 'markdown' };

export type AnalyzeOptions = TestOptions & ReportOptions & PValueOptions;

/** Where the table came from and how it was chosen. */
export interface TableOrigin {
  /** 1-based index of the table among those found in the document. */
  index: number;
  /** How many tables the document holds. */
  count: number;
  /** Set when raw observations were cross-tabulated. */
  crossTabulation?: {
    columns: [string, string];
    weightColumn?: string;
    rowsRead: number;
    rowsSkipped: number;
  };
}

/** Everything a user sees about one analysed table: pure data, no formatting decisions left. */
export interface Analysis {
  table: CountTable;
  origin: TableOrigin;
  result: TestResult;
  /**
   * The exact or Monte Carlo p that leads the result when Cochran's rule fails (or when asked);
   * absent when the asymptotic p leads.
   */
  exact?: ChosenPValue;
  /** Why no exact p was computed although the rule failed (e.g. a fitted distribution). */
  exactNote?: string;
  /** Reading notes, totals mismatches, validity problems: each with a location where there is one. */
  warnings: Issue[];
  writeUp: string;
  /** Markdown (or plain) tables ready to insert. */
  expectedTable: string;
  contributionsTable: string;
  options: AnalyzeOptions;
}
