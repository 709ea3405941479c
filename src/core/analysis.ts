import type { CochranMantelHaenszelResult } from './designs/cochranMantelHaenszel';
import type { DesignOptions } from './designs/designOptions';
import type { FollowUps } from './designs/followUps';
import type { ExactStratifiedResult } from './designs/exactStratifiedTest';
import type { MantelFleissCheck } from './designs/mantelFleissCriterion';
import type { McNemarResult } from './designs/mcnemarTest';
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

export type AnalyzeOptions = TestOptions & ReportOptions & PValueOptions & DesignOptions;

/** The test that leads the result, decided by the design and the table's shape. */
export type AnalysisKind = 'independence' | 'goodness-of-fit' | 'paired' | 'stratified';

/** A paired 2×2: McNemar's test leads; `p` is the one the write-up reports and `pMethod` says which. */
export interface PairedAnalysis extends McNemarResult {
  /** The p that leads: mid-p by default (Fagerland, Lydersen & Laake 2013), exact or asymptotic on request. */
  leading: { p: number; log10p: number; method: 'mid-p' | 'exact' | 'asymptotic' };
}

/** Several 2×2 strata tested together; `Analysis.table` is then their sum, kept for context. */
export interface StratifiedAnalysis {
  strata: { label: string; table: CountTable }[];
  cmh: CochranMantelHaenszelResult;
  mantelFleiss: MantelFleissCheck;
  /** The exact conditional test, which leads when the Mantel–Fleiss criterion fails (or when asked). */
  exact?: ExactStratifiedResult;
  /** Why the exact p leads, or why it could not be computed; one sentence for the write-up. */
  exactReason?: string;
}

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
    /** Set when the rows were split into strata by this column. */
    stratumColumn?: string;
    rowsRead: number;
    rowsSkipped: number;
  };
}

/** Everything a user sees about one analysed table: pure data, no formatting decisions left. */
export interface Analysis {
  kind: AnalysisKind;
  /** The table tested; for a stratified analysis the strata summed (shown beside the strata). */
  table: CountTable;
  origin: TableOrigin;
  /** The r×c or goodness-of-fit result; for paired and stratified designs, of the (summed) table, for context. */
  result: TestResult;
  /** Independence only: pairwise comparisons and tests for order. */
  followUps?: FollowUps;
  paired?: PairedAnalysis;
  stratified?: StratifiedAnalysis;
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
