import type { AdjustmentMethod } from './adjustPValues';

/**
 * How the counts were collected, which decides the test:
 * - `independent`: each observation is one unit in one group (the r×c test, or goodness of fit);
 * - `paired`: a 2×2 of the same units measured twice (before/after, two raters), rows the first
 *   answer and columns the second (McNemar);
 * - `stratified`: the same 2×2 comparison in several strata (sites, shifts), tested together (CMH).
 */
export const STUDY_DESIGNS = ['independent', 'paired', 'stratified'] as const;
export type StudyDesign = (typeof STUDY_DESIGNS)[number];

/** Which dimensions carry an order; `auto` trusts labels that read as numbers or ranges. */
export const ORDERED_DIMENSIONS = ['auto', 'none', 'rows', 'columns', 'both'] as const;
export type OrderedDimensions = (typeof ORDERED_DIMENSIONS)[number];

/** Follow-up pairwise comparisons after an r×c test, or none. */
export const PAIRWISE_ADJUSTMENTS = ['holm', 'bonferroni', 'off'] as const satisfies readonly (AdjustmentMethod | 'off')[];
export type PairwiseAdjustment = (typeof PAIRWISE_ADJUSTMENTS)[number];

/** "a, b or c" for messages that list the allowed values. */
export function listChoices(values: readonly string[], quote = ''): string {
  const quoted = values.map((value) => `${quote}${value}${quote}`);
  return `${quoted.slice(0, -1).join(', ')} or ${quoted[quoted.length - 1]}`;
}

/** Whether `value` is one of `allowed` (a type guard for option values read from outside). */
export function isOneOf<T extends string>(allowed: readonly T[], value: unknown): value is T {
  return (allowed as readonly unknown[]).includes(value);
}

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
  if (!isOneOf(STUDY_DESIGNS, options.design)) {
    return `The design must be ${listChoices(STUDY_DESIGNS)} (got "${String(options.design)}").`;
  }
  if (!isOneOf(ORDERED_DIMENSIONS, options.ordered)) {
    return `Ordered dimensions must be ${listChoices(ORDERED_DIMENSIONS)} (got "${String(options.ordered)}").`;
  }
  if (!isOneOf(PAIRWISE_ADJUSTMENTS, options.pairwise)) {
    return `Pairwise comparisons must be ${listChoices(PAIRWISE_ADJUSTMENTS)} (got "${String(options.pairwise)}").`;
  }
  for (const [name, scores] of [['row', options.rowScores], ['column', options.columnScores]] as const) {
    if (scores === undefined) continue;
    if (!Array.isArray(scores) || scores.length < 2 || !scores.every(Number.isFinite)) {
      return `The ${name} scores must be at least two finite numbers, one per ${name} (got ${JSON.stringify(scores)}).`;
    }
  }
  return undefined;
}
