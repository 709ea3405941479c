import type { TestOptions } from './types';

/**
 * What a goodness-of-fit test compares the counts with, ready to run. Built by `buildFitRequest`
 * from a parsed spec and the category labels, or directly by the engine (expected counts from a
 * table row or column labelled "Expected").
 */
export type FitRequest =
  | { kind: 'equal' }
  /** Positive parts, one per category, e.g. 9:3:3:1. */
  | { kind: 'ratio'; ratio: number[]; text: string }
  /** One proportion per category, already checked to total 1 (or 100%). */
  | { kind: 'proportions'; proportions: number[]; text: string }
  /** Positive expected counts, one per category; rescaled to N when they total something else. */
  | { kind: 'expected-counts'; counts: number[] }
  /** Category values 0, 1, 2, … read from the labels; `openEnded` when the last label is like "5+". */
  | { kind: 'poisson'; values: number[]; openEnded: boolean }
  /** Category values 0, 1, …; `trials` ≥ the largest value; `openEnded` when the last label is like "5+". */
  | { kind: 'binomial'; values: number[]; trials: number; openEnded: boolean };

/** A hypothesis as the user wrote it, before the category labels are read (see `parseFitSpec`). */
export type FitSpec =
  | { kind: 'equal' }
  | { kind: 'ratio'; ratio: number[]; text: string }
  | { kind: 'proportions'; proportions: number[]; text: string }
  | { kind: 'poisson' }
  /** `trials` absent: the largest category value. */
  | { kind: 'binomial'; trials?: number };

/** Options of `testGoodnessOfFit`: the test options plus what a merge proposal needs. */
export interface GoodnessOfFitOptions extends TestOptions {
  /** Category labels; when given and Cochran's rule fails, a merge proposal is made. */
  labels?: string[];
  /** Whether the categories form a scale (merges then join neighbours); Poisson and binomial fits always do. */
  ordered?: boolean;
  /** Whether the categories run down a column ('rows', the default) or along a row ('columns'); sets CellRefs and the merged table's shape. */
  categoriesAlong?: 'rows' | 'columns';
}
