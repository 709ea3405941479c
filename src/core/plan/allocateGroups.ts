/**
 * Whole group sizes for a total of at least `total` split by `allocation`: each group gets
 * ⌈total·q_i⌉, so no group falls below its planned share (the sum may exceed `total` by up to the
 * number of groups).
 *
 * Rounding each group up keeps the plan on the safe side of its power.
 *
 * @param total - the continuous or whole total sample size (> 0)
 * @param allocation - shares per group (sum 1)
 * @returns whole sizes, one per group, each ≥ 1
 */
export function allocateGroups(total: number, allocation: readonly number[]): number[] {
  // The 1e-9 guard keeps 100·0.5 = 50.000000000000007 from rounding up to 51.
  return allocation.map((share) => Math.max(1, Math.ceil(total * share - 1e-9)));
}
