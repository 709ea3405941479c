/**
 * Cohen's w for comparing groups on a categorical outcome, from anticipated outcome proportions per
 * group and the share of the sample in each group (Cohen 1988, Statistical Power Analysis for the
 * Behavioral Sciences, 2nd ed., ch. 7, eq. 7.2.1 applied to the joint proportions q_i·p_ij):
 * w² = Σ_i Σ_j q_i (p_ij − p̄_j)² / p̄_j with p̄_j = Σ_i q_i p_ij.
 *
 * How far the groups' outcome profiles are from their pooled profile, weighted by group size.
 *
 * @param groups - groups[i][j]: anticipated proportion of outcome j in group i (each row sums to 1)
 * @param allocation - share of the sample in each group (sums to 1)
 * @returns w ≥ 0
 */
export function effectSizeFromGroups(groups: readonly (readonly number[])[], allocation: readonly number[]): number {
  const categories = groups[0].length;
  let wSquared = 0;
  for (let j = 0; j < categories; j++) {
    let pooled = 0;
    for (let i = 0; i < groups.length; i++) pooled += allocation[i] * groups[i][j];
    if (pooled === 0) continue;
    for (let i = 0; i < groups.length; i++) {
      const gap = groups[i][j] - pooled;
      wSquared += (allocation[i] * gap * gap) / pooled;
    }
  }
  return Math.sqrt(wSquared);
}
