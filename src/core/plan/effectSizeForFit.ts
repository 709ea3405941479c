/**
 * Cohen's w for a goodness-of-fit test: w² = Σ_j (p1_j − p0_j)² / p0_j, where p0 are the proportions
 * under the null hypothesis and p1 the anticipated ones (Cohen 1988, Statistical Power Analysis for
 * the Behavioral Sciences, 2nd ed., ch. 7, eq. 7.2.1).
 *
 * The chi-square per observation that the anticipated proportions would produce against the null.
 *
 * @param anticipated - proportions expected in the study (sum 1)
 * @param nullProportions - proportions the test checks against (sum 1, all > 0)
 * @returns w ≥ 0
 */
export function effectSizeForFit(anticipated: readonly number[], nullProportions: readonly number[]): number {
  let wSquared = 0;
  for (let j = 0; j < anticipated.length; j++) {
    const gap = anticipated[j] - nullProportions[j];
    wSquared += (gap * gap) / nullProportions[j];
  }
  return Math.sqrt(wSquared);
}
