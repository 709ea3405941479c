import type { AdjustmentMethod } from './adjustPValues';

/**
 * How the counts were collected, which decides the test:
 * - `independent`: each observation is one unit in one group (the r×c test, or goodness of fit);
 * - `paired`: a 2×2 of the same units measured twice (before/after, two raters), rows the first
 *   answer and columns the second (McNemar);
 * - `stratified`: the same 2×2 comparison in several strata (sites, shifts), tested together (CMH).
 */
export type StudyDesign = 'independent' | 'paired' | 'stratified';

/** Which dimensions carry an order; `auto` trusts labels that read as numbers or ranges. */
export type OrderedDimensions = 'auto' | 'none' | 'rows' | 'columns' | 'both';

/** Follow-up pairwise comparisons after an r×c test, or none. */
export type PairwiseAdjustment = AdjustmentMethod | 'off';

export interface DesignOptions {
  design: StudyDesign;
  ordered: OrderedDimensions;
  /** Scores for ordered rows / columns (one per category); default 0, 1, …, k − 1. */
  rowScores?: number[];
  columnScores?: number[];
  pairwise: PairwiseAdjustment;
}

export const DEFAULT_DESIGN_OPTIONS: DesignOptions = { design: 'independent', ordered: 'auto', pairwise: 'holm' };

/** A message naming the bad design option, or undefined when the options are usable. */
export function designOptionProblem(options: DesignOptions): string | undefined {
  if (!['independent', 'paired', 'stratified'].includes(options.design)) {
    return `The design must be independent, paired or stratified (got "${String(options.design)}").`;
  }
  if (!['auto', 'none', 'rows', 'columns', 'both'].includes(options.ordered)) {
    return `Ordered dimensions must be auto, none, rows, columns or both (got "${String(options.ordered)}").`;
  }
  if (!['holm', 'bonferroni', 'off'].includes(options.pairwise)) {
    return `Pairwise comparisons must be holm, bonferroni or off (got "${String(options.pairwise)}").`;
  }
  for (const [name, scores] of [['row', options.rowScores], ['column', options.columnScores]] as const) {
    if (scores === undefined) continue;
    if (!Array.isArray(scores) || scores.length < 2 || !scores.every(Number.isFinite)) {
      return `The ${name} scores must be at least two finite numbers, one per ${name} (got ${JSON.stringify(scores)}).`;
    }
  }
  return undefined;
}
