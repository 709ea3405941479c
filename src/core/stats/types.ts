import type { CellRef, Interval, MergeProposal, TailProbability, ValidityCheck } from '../types';

/** How Yates' continuity correction is applied to 2×2 tables. */
export type ContinuityPolicy = 'none' | 'yates';

export interface TestOptions {
  /** Significance level used for flags and wording (default 0.05). */
  alpha: number;
  /** Confidence level for intervals (default 0.95). */
  confidenceLevel: number;
  /** 2×2 only; default 'none' (see DEVELOPERS.md: the correction is conservative). */
  continuity: ContinuityPolicy;
  /** Ordered rows/columns change which categories a merge proposal joins. */
  rowsOrdered: boolean;
  columnsOrdered: boolean;
}

export const DEFAULT_TEST_OPTIONS: TestOptions = {
  alpha: 0.05,
  confidenceLevel: 0.95,
  continuity: 'none',
  rowsOrdered: false,
  columnsOrdered: false,
};

/** The likelihood-ratio test. */
export interface GTest extends TailProbability {
  statistic: number;
  /** Williams' (1976) correction divisor q ≥ 1. */
  williamsQ: number;
  /** G² / q and its p. */
  corrected: TailProbability & { statistic: number };
}

export interface EffectSizes {
  cramersV: number;
  /** Bergsma (2013) bias-corrected V; 0 when the correction leaves nothing. */
  cramersVCorrected: number;
  cohensW: number;
  /** 2×2 only: signed phi (positive when the diagonal a·d exceeds b·c). */
  phi?: number;
  /** Interval for V from inverting the noncentral chi-square in its noncentrality. */
  cramersVInterval: Interval;
}

/** 2×2 comparisons: first row vs second row, first column as the outcome of interest. */
export interface TwoByTwoMeasures {
  /** p1 − p2 with Newcombe's (1998) hybrid score interval (method 10). */
  riskDifference: Interval;
  /** p1 / p2 with the log (Katz) interval. */
  relativeRisk: Interval;
  /** (a·d)/(b·c) with the log (Woolf) interval; 0.5 added to every cell when a cell is zero (Haldane–Anscombe). */
  oddsRatio: Interval;
  /** True when 0.5 was added to each cell for the ratios. */
  zeroCellCorrection: boolean;
}

export interface AdjustedResidualFlag extends CellRef {
  residual: number;
}

export interface IndependenceResult extends TailProbability {
  test: 'independence';
  n: number;
  df: number;
  rows: number;
  columns: number;
  /** Pearson X² (with Yates' correction only when `continuityCorrected`). */
  statistic: number;
  /** Uncorrected Pearson X² and p, always present. */
  pearson: TailProbability & { statistic: number };
  /** Yates-corrected X² for 2×2 tables (reported alongside, applied when the policy says so). */
  yates?: TailProbability & { statistic: number };
  continuityCorrected: boolean;
  expected: number[][];
  /** (O − E)² / E per cell; sums to the uncorrected X². */
  contributions: number[][];
  /** contribution / X² per cell (0..1). */
  contributionShares: number[][];
  /** (O − E) / √E. */
  pearsonResiduals: number[][];
  /** Haberman (1973): (O − E) / √(E (1 − rowShare)(1 − columnShare)). */
  adjustedResiduals: number[][];
  /** Two-sided Bonferroni critical value for |adjusted residual| over all cells at alpha. */
  residualCriticalValue: number;
  /** Cells beyond the critical value, largest |residual| first. */
  flaggedCells: AdjustedResidualFlag[];
  g: GTest;
  effect: EffectSizes;
  twoByTwo?: TwoByTwoMeasures;
  /** Row proportions (each row sums to 1) with Wilson score intervals. */
  rowProportions: Interval[][];
  /** Column proportions (each column sums to 1) with Wilson score intervals. */
  columnProportions: Interval[][];
  rowTotals: number[];
  columnTotals: number[];
  validity: ValidityCheck;
  /** Present when validity fails and a merge of categories can fix it. */
  mergeProposal?: MergeProposal;
}

/** What the counts were tested against. */
export type FitHypothesis =
  | { kind: 'equal' }
  | { kind: 'ratio'; ratio: number[]; text: string }
  | { kind: 'proportions'; proportions: number[]; text: string }
  | { kind: 'expected-counts'; counts: number[]; rescaled: boolean }
  | { kind: 'poisson'; mean: number; openEnded: boolean }
  | { kind: 'binomial'; trials: number; probability: number };

export interface GoodnessOfFitResult extends TailProbability {
  test: 'goodness-of-fit';
  n: number;
  /** k − 1 − (parameters estimated from the data). */
  df: number;
  categories: number;
  estimatedParameters: number;
  hypothesis: FitHypothesis;
  statistic: number;
  /** Expected proportions under the hypothesis (sum to 1). */
  expectedProportions: number[];
  expected: number[];
  contributions: number[];
  contributionShares: number[];
  /** (O − E) / √E. */
  pearsonResiduals: number[];
  /** (O − E) / √(E (1 − π)), approximately standard normal under the hypothesis. */
  standardizedResiduals: number[];
  residualCriticalValue: number;
  flaggedCells: { index: number; residual: number }[];
  g: GTest;
  cohensW: number;
  /** Observed proportions with Wilson score intervals. */
  proportions: Interval[];
  validity: ValidityCheck;
  mergeProposal?: MergeProposal;
}

export type TestResult = IndependenceResult | GoodnessOfFitResult;
