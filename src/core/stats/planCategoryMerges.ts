/** The outcome of merging categories along one dimension. */
export interface MergePlan {
  /** Original category indices per merged category, in the original order. */
  groups: number[][];
  merges: number;
  passes: boolean;
}

/**
 * Joins categories one pair at a time until `passes` accepts the grouping or only `minimumGroups`
 * remain. Ordered categories are only ever joined to a neighbour: the sparsest to its sparser
 * neighbour, so an ordered scale stays a scale (typically pooling a thin tail, as in Cochran 1954,
 * Biometrics 10, 417–451, §6). Unordered categories: the sparsest joined to the next sparsest.
 *
 * Intuition: the smallest categories cause the small expected counts, so they are pooled first,
 * with the least disturbance to the rest of the table.
 *
 * Ties go to the earlier category, so the plan is deterministic.
 *
 * @param sizes - how much each category holds (a margin total or an expected count); > 0
 * @param ordered - whether the categories form a scale
 * @param passes - whether a grouping is good enough (e.g. the merged table meets Cochran's rule)
 * @param minimumGroups - fewest categories to leave (≥ 1)
 * @returns the groups, how many merges were made, and whether the last grouping passes
 * @example planCategoryMerges([40, 3, 2], true, (g) => g.length <= 2, 2).groups // [[0], [1, 2]]
 */
export function planCategoryMerges(
  sizes: number[],
  ordered: boolean,
  passes: (groups: number[][]) => boolean,
  minimumGroups: number,
): MergePlan {
  let groups = sizes.map((_size, index) => [index]);
  let merges = 0;
  const sizeOf = (group: number[]) => group.reduce((sum, index) => sum + sizes[index], 0);
  let accepted = passes(groups);
  while (!accepted && groups.length > minimumGroups) {
    const groupSizes = groups.map(sizeOf);
    const sparsest = indexOfSmallest(groupSizes, () => true);
    const partner = ordered
      ? sparserNeighbour(groupSizes, sparsest)
      : indexOfSmallest(groupSizes, (index) => index !== sparsest);
    const [keep, drop] = sparsest < partner ? [sparsest, partner] : [partner, sparsest];
    groups = groups
      .map((group, index) => (index === keep ? [...group, ...groups[drop]].sort((x, y) => x - y) : group))
      .filter((_group, index) => index !== drop);
    merges++;
    accepted = passes(groups);
  }
  return { groups, merges, passes: accepted };
}

function indexOfSmallest(values: number[], eligible: (index: number) => boolean): number {
  let best = -1;
  values.forEach((value, index) => {
    if (eligible(index) && (best < 0 || value < values[best])) best = index;
  });
  return best;
}

function sparserNeighbour(sizes: number[], index: number): number {
  if (index === 0) return 1;
  if (index === sizes.length - 1) return index - 1;
  return sizes[index - 1] <= sizes[index + 1] ? index - 1 : index + 1;
}
