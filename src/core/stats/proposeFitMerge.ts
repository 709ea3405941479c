import { chiSquareUpperTail } from '../special/chiSquareUpperTail';
import type { MergeProposal } from '../types';
import { checkCochranRule } from './checkCochranRule';
import { mergedLabel } from './mergedLabel';
import { planCategoryMerges } from './planCategoryMerges';

/**
 * Proposes pooling categories of a goodness-of-fit test so that the expected counts meet Cochran's
 * (1954) rule, and re-tests the pooled counts (Cochran, Biometrics 10, 417–451, §6 recommends pooling
 * thin tail classes of a fitted distribution).
 *
 * Intuition: a fitted distribution's thin tail gives tiny expected counts; pooling, say, 4 and 5+
 * into 4+ removes them while keeping the scale.
 *
 * ## Method
 * Pooling is by expected count (`planCategoryMerges`: neighbours only when `ordered`), until the rule
 * passes or only `estimatedParameters + 2` categories remain, so at least one degree of freedom is
 * left. The pooled expected counts are sums of the original ones: an estimated parameter keeps its
 * value from the full counts (common practice), and df = (pooled k) − 1 − estimatedParameters.
 *
 * @param observed - the counts, one per category
 * @param expected - their expected counts under the hypothesis
 * @param estimatedParameters - parameters fitted from the counts
 * @param labels - category labels, one per count
 * @param layout - `ordered` categories are only joined to neighbours; `categoriesAlong` sets the
 *   dimension and the merged table's shape (a column of counts for 'rows')
 * @returns a proposal, or undefined when the rule already holds or nothing can be pooled
 * @example proposeFitMerge([30, 40, 20, 6, 3, 1], [28, 40, 22, 7, 2.4, 0.6], 1, ['0', '1', '2', '3', '4', '5+'], { ordered: true, categoriesAlong: 'rows' })
 *   // labels ['0', '1', '2', '3', '4+'] (pooling 4 and 5+)
 */
export function proposeFitMerge(
  observed: number[],
  expected: number[],
  estimatedParameters: number,
  labels: string[],
  layout: { ordered: boolean; categoriesAlong: 'rows' | 'columns' },
): MergeProposal | undefined {
  const minimumGroups = estimatedParameters + 2;
  const shape = (values: number[]) => (layout.categoriesAlong === 'rows' ? values.map((value) => [value]) : [values]);
  const sumOver = (values: number[], group: number[]) => group.reduce((sum, index) => sum + values[index], 0);
  const validityOf = (groups: number[][]) => checkCochranRule(shape(groups.map((group) => sumOver(expected, group))));
  if (validityOf(observed.map((_, index) => [index])).ok || observed.length <= minimumGroups) return undefined;
  const plan = planCategoryMerges(expected, layout.ordered, (groups) => validityOf(groups).ok, minimumGroups);
  const mergedObserved = plan.groups.map((group) => sumOver(observed, group));
  const mergedExpected = plan.groups.map((group) => sumOver(expected, group));
  const statistic = mergedObserved.reduce((sum, count, i) => sum + (count - mergedExpected[i]) ** 2 / mergedExpected[i], 0);
  const df = plan.groups.length - 1 - estimatedParameters;
  const groups = plan.groups.map((group) => group.map((index) => labels[index]));
  const times = plan.merges === 1 ? 'once' : `${plan.merges} times`;
  const how = layout.ordered
    ? `The categories lie on a scale, so only neighbours were pooled: each time the one with the smallest expected count went to its smaller neighbour (${times})`
    : `The categories are unordered, so the one with the smallest expected count was pooled with the next smallest (${times})`;
  const outcome = plan.passes
    ? 'after which every expected count is at least 1 and at most 20% are below 5, as Cochran\'s rule asks'
    : `but even with ${plan.groups.length} categories left, which is as few as the test allows, Cochran's rule is not met`;
  return {
    dimension: layout.categoriesAlong,
    groups,
    labels: groups.map((group) => mergedLabel(group, layout.ordered)),
    observed: shape(mergedObserved),
    passes: plan.passes,
    statistic,
    df,
    ...chiSquareUpperTail(statistic, df),
    reason: `${how}, ${outcome}.`,
  };
}
