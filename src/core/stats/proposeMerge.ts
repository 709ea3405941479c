import type { MergeProposal, ValidityCheck } from '../types';
import { checkCochranRule } from './checkCochranRule';
import { independenceStatistic } from './independenceStatistic';
import { mergedLabel } from './mergedLabel';
import { planCategoryMerges, type MergePlan } from './planCategoryMerges';
import { tableMargins } from './tableMargins';
import { transpose } from './transpose';
import type { TestOptions } from './types';

type Dimension = 'rows' | 'columns';

interface Attempt {
  dimension: Dimension;
  plan: MergePlan;
  observed: number[][];
  validity: ValidityCheck;
  ordered: boolean;
}

/** A test of independence needs at least two categories on each dimension. */
const MINIMUM_CATEGORIES = 2;

/**
 * Proposes joining categories of one dimension so that an r×c table meets Cochran's (1954) rule,
 * with the merged table's X², df and p (Cochran, Biometrics 10, 417–451, recommends pooling
 * sparse classes; the choice of which to pool follows `planCategoryMerges`).
 *
 * Intuition: small expected counts come from thin rows or columns; pooling the thinnest with its
 * closest or next-thinnest partner fixes them at the least cost in detail.
 *
 * ## Method
 * Each dimension with more than two categories is merged on its own, by its margin totals
 * (neighbours only when `rowsOrdered`/`columnsOrdered`), until the merged table passes or two
 * categories remain. A dimension that passes beats one that does not; then fewer merges win, then
 * rows. When neither passes, the attempt closest to passing (fewest cells below 1, then the smallest
 * share below 5) is returned with `passes: false`. The merged table is tested with the same
 * continuity policy as the original.
 *
 * @param observed - counts, observed[row][column], with no zero row or column
 * @param labels - row and column labels, matching `observed`
 * @param options - `rowsOrdered`, `columnsOrdered` and `continuity` are used
 * @returns a proposal, or undefined when the table already passes or no dimension has more than two categories
 * @example proposeMerge([[20, 18], [15, 17], [2, 1]], { rows: ['A', 'B', 'C'], columns: ['x', 'y'] }, DEFAULT_TEST_OPTIONS)
 *   // groups [["A"], ["B", "C"]], labels ["A", "B + C"], passes true
 */
export function proposeMerge(
  observed: number[][],
  labels: { rows: string[]; columns: string[] },
  options: TestOptions,
): MergeProposal | undefined {
  if (labels.rows.length !== observed.length || labels.columns.length !== observed[0].length) {
    throw new RangeError('proposeMerge: labels do not match the table');
  }
  if (checkCochranRule(tableMargins(observed).expected).ok) return undefined;
  const attempts = (['rows', 'columns'] as const)
    .map((dimension) => attemptMerge(observed, dimension, dimension === 'rows' ? options.rowsOrdered : options.columnsOrdered))
    .filter((attempt): attempt is Attempt => attempt !== undefined);
  if (attempts.length === 0) return undefined;
  attempts.sort(compareAttempts);
  const best = attempts[0];
  const originalLabels = best.dimension === 'rows' ? labels.rows : labels.columns;
  const groups = best.plan.groups.map((group) => group.map((index) => originalLabels[index]));
  const tested = independenceStatistic(best.observed, options.continuity);
  const other = attempts[1];
  return {
    dimension: best.dimension,
    groups,
    labels: groups.map((group) => mergedLabel(group, best.ordered)),
    observed: best.observed,
    passes: best.plan.passes,
    statistic: tested.statistic,
    df: tested.df,
    p: tested.p,
    log10p: tested.log10p,
    reason: reasonFor(best, other),
  };
}

function attemptMerge(observed: number[][], dimension: Dimension, ordered: boolean): Attempt | undefined {
  const lines = dimension === 'rows' ? observed : transpose(observed);
  if (lines.length <= MINIMUM_CATEGORIES) return undefined;
  const merge = (groups: number[][]) => {
    const merged = groups.map((group) => lines[group[0]].map((_, j) => group.reduce((sum, index) => sum + lines[index][j], 0)));
    return dimension === 'rows' ? merged : transpose(merged);
  };
  const validityOf = (groups: number[][]) => checkCochranRule(tableMargins(merge(groups)).expected);
  const totals = lines.map((line) => line.reduce((sum, count) => sum + count, 0));
  const plan = planCategoryMerges(totals, ordered, (groups) => validityOf(groups).ok, MINIMUM_CATEGORIES);
  return { dimension, plan, observed: merge(plan.groups), validity: validityOf(plan.groups), ordered };
}

function compareAttempts(x: Attempt, y: Attempt): number {
  if (x.plan.passes !== y.plan.passes) return x.plan.passes ? -1 : 1;
  if (x.plan.passes) return x.plan.merges - y.plan.merges;
  if (x.validity.cellsBelow1 !== y.validity.cellsBelow1) return x.validity.cellsBelow1 - y.validity.cellsBelow1;
  return x.validity.shareBelow5 - y.validity.shareBelow5;
}

function reasonFor(best: Attempt, other: Attempt | undefined): string {
  const noun = best.dimension === 'rows' ? 'rows' : 'columns';
  const times = best.plan.merges === 1 ? 'once' : `${best.plan.merges} times`;
  const how = best.ordered
    ? `The ${noun} are ordered, so only neighbours were joined: each time the ${noun === 'rows' ? 'row' : 'column'} with the smallest total went to its smaller neighbour (${times})`
    : `The ${noun} are unordered, so the ${noun === 'rows' ? 'row' : 'column'} with the smallest total was joined to the next smallest (${times})`;
  const outcome = best.plan.passes
    ? 'after which every expected count is at least 1 and at most 20% are below 5, as Cochran\'s rule asks'
    : `but even with two ${noun} left, ${Math.round(best.validity.shareBelow5 * 100)}% of expected counts are below 5${best.validity.cellsBelow1 > 0 ? ' and some are below 1' : ''}, so Cochran's rule is still not met`;
  const comparison = other
    ? other.plan.passes
      ? `; merging ${other.dimension} instead would take ${other.plan.merges === 1 ? 'one merge' : `${other.plan.merges} merges`}`
      : `; merging ${other.dimension} instead would not meet the rule`
    : '';
  return `${how}, ${outcome}${comparison}.`;
}
