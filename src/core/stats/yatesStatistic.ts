/**
 * Yates' (1934) continuity-corrected X² for a 2×2 table (Yates, "Contingency tables involving small
 * numbers and the χ² test", Suppl. J. R. Stat. Soc. 1, 217–235):
 * X²_Y = N · max(0, |ad − bc| − N/2)² / (r₁ r₂ c₁ c₂).
 *
 * Intuition: moving every cell half a count toward its expected value makes the continuous chi-square
 * closer to the discrete counts' tail; it is known to be conservative.
 *
 * When |O − E| < ½ in a cell the correction would overshoot, so the statistic is 0.
 *
 * @param observed - a 2×2 table [[a, b], [c, d]] with no zero row or column
 * @returns the corrected statistic
 * @example yatesStatistic([[12, 5], [7, 14]]) // ≈ 3.832
 */
export function yatesStatistic(observed: number[][]): number {
  if (observed.length !== 2 || observed[0].length !== 2 || observed[1].length !== 2) {
    throw new RangeError('yatesStatistic: needs a 2×2 table');
  }
  const [[a, b], [c, d]] = observed;
  const n = a + b + c + d;
  const excess = Math.max(0, Math.abs(a * d - b * c) - n / 2);
  return (n * excess * excess) / ((a + b) * (c + d) * (a + c) * (b + d));
}
