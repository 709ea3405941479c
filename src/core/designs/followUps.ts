import { transpose } from '../stats/transpose';
import type { IndependenceResult } from '../stats/types';
import { describeLocation } from '../table/describeLocation';
import { fail, ok, type CountTable, type Result } from '../types';
import { cochranArmitageTrend, type TrendResult } from './cochranArmitageTrend';
import type { DesignOptions } from './designOptions';
import { linearByLinear, type LinearByLinearResult } from './linearByLinear';
import { pairwiseComparisons, type PairwiseResult } from './pairwiseComparisons';

/** Which groups differ, compared two at a time along the dimension that holds the groups. */
export interface PairwiseFollowUp extends PairwiseResult {
  /** 'rows' when the table has 3 or more rows; 'columns' for a 2×c table with c ≥ 3. */
  groupsAlong: 'rows' | 'columns';
}

/** A Cochran–Armitage trend along the ordered dimension of a 2×k (or k×2) table. */
export interface TrendFollowUp extends TrendResult {
  /** The ordered dimension the scores belong to. */
  orderedAlong: 'rows' | 'columns';
  /** The labels of the ordered categories, in order. */
  orderedLabels: string[];
  /** The outcome whose share is tested for a trend (the first label of the two-way dimension). */
  outcomeLabel: string;
  /** True when the user set the scores; false for the default 0, 1, …, k − 1. */
  scoresGiven: boolean;
}

export interface LinearByLinearFollowUp extends LinearByLinearResult {
  scoresGiven: boolean;
}

/** Tests that follow the overall r×c test, each present only where the table's shape and order allow it. */
export interface FollowUps {
  pairwise?: PairwiseFollowUp;
  trend?: TrendFollowUp;
  linearByLinear?: LinearByLinearFollowUp;
  /** The order the analysis used (after `auto` looked at the labels). */
  rowsOrdered: boolean;
  columnsOrdered: boolean;
  /** Why an ordered test was not run although a dimension is ordered (e.g. a row with no counts). */
  notes: string[];
}

/**
 * The follow-up tests for an independence result: pairwise comparisons (3 or more groups), a trend
 * test (2×k with ordered k ≥ 3) and the linear-by-linear test (both dimensions ordered, neither 2).
 * Fails only on user-set scores that do not fit the table.
 */
export function followUps(table: CountTable, result: IndependenceResult, options: DesignOptions & { alpha: number }): Result<FollowUps> {
  const rows = table.rowLabels.length;
  const columns = table.columnLabels.length;
  const location = { line: table.startLine, column: 1 };
  for (const [name, scores, count] of [['row', options.rowScores, rows], ['column', options.columnScores, columns]] as const) {
    if (scores && scores.length !== count) {
      return fail({
        code: 'bad-option',
        message: `${describeLocation(location)}: ${scores.length} ${name} scores were given but the table has ${count} ${name}s; give one score per ${name}, in order.`,
        location,
      });
    }
  }
  const rowsOrdered = isOrdered('rows', options, table.rowsOrdered) || options.rowScores !== undefined;
  const columnsOrdered = isOrdered('columns', options, table.columnsOrdered) || options.columnScores !== undefined;
  const notes: string[] = [];
  const out: FollowUps = { rowsOrdered, columnsOrdered, notes };

  // Ordered columns of a 2×k table get the trend test instead: pairs of neighbouring doses answer a weaker question.
  if (options.pairwise !== 'off' && (rows >= 3 || (rows === 2 && columns >= 3 && !columnsOrdered))) {
    const groupsAlong = rows >= 3 ? 'rows' : 'columns';
    const observed = groupsAlong === 'rows' ? table.observed : transpose(table.observed);
    const labels = groupsAlong === 'rows' ? table.rowLabels : table.columnLabels;
    out.pairwise = { ...pairwiseComparisons(observed, labels, options.pairwise, options.alpha, { exactWhenSparse: true }), groupsAlong };
  }

  const trendAlong = rows === 2 && columns >= 3 && columnsOrdered ? 'columns' : columns === 2 && rows >= 3 && rowsOrdered ? 'rows' : undefined;
  if (trendAlong) {
    const observed = trendAlong === 'columns' ? table.observed : transpose(table.observed);
    const scores = trendAlong === 'columns' ? options.columnScores : options.rowScores;
    const trend = guarded(() => cochranArmitageTrend(observed, scores));
    if (trend) {
      out.trend = {
        ...trend,
        orderedAlong: trendAlong,
        orderedLabels: trendAlong === 'columns' ? table.columnLabels : table.rowLabels,
        outcomeLabel: trendAlong === 'columns' ? table.rowLabels[0] : table.columnLabels[0],
        scoresGiven: scores !== undefined,
      };
    } else {
      notes.push('No trend test: one outcome has no counts, or the scores do not vary over the non-empty categories.');
    }
  } else if (rowsOrdered && columnsOrdered && rows >= 3 && columns >= 3) {
    const association = guarded(() => linearByLinear(table.observed, options.rowScores, options.columnScores));
    if (association) out.linearByLinear = { ...association, scoresGiven: options.rowScores !== undefined || options.columnScores !== undefined };
    else notes.push('No linear-by-linear test: the scores do not vary over the non-empty rows or columns.');
  }
  return ok(out);
}

function isOrdered(dimension: 'rows' | 'columns', options: DesignOptions, fromLabels: boolean): boolean {
  if (options.ordered === 'auto') return fromLabels;
  return options.ordered === dimension || options.ordered === 'both';
}

/** The designs' functions throw only on degenerate input they document; here that means "not applicable". */
function guarded<T>(compute: () => T): T | undefined {
  try {
    return compute();
  } catch (error) {
    if (error instanceof RangeError) return undefined;
    throw error;
  }
}
