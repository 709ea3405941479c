/**
 * Bergsma's (2013) bias-corrected Cramér's V (Bergsma, "A bias-correction for Cramér's V and
 * Tschuprow's T", Journal of the Korean Statistical Society 42, 323–328).
 *
 * Intuition: under independence φ² = X²/N still averages about (r − 1)(c − 1)/(N − 1), so that much
 * is subtracted, and the table's dimensions are shrunk the same way so that V can still reach 1.
 *
 * ## Method
 * φ̃² = max(0, φ² − (r − 1)(c − 1)/(N − 1)), r̃ = r − (r − 1)²/(N − 1), c̃ = c − (c − 1)²/(N − 1),
 * Ṽ = √(φ̃² / min(r̃ − 1, c̃ − 1)). When nothing is left (φ̃² = 0, or N so small that a dimension
 * shrinks to nothing) the result is 0. Rounding can push the ratio a hair past 1; it is capped there.
 *
 * @param statistic - Pearson's X² (uncorrected)
 * @param n - total count N (≥ 2)
 * @param rows - r ≥ 2
 * @param columns - c ≥ 2
 * @returns Ṽ in [0, 1]
 * @example bergsmaCorrectedV(30.07, 2757, 2, 3) // ≈ 0.1009 (plain V ≈ 0.1044)
 */
export function bergsmaCorrectedV(statistic: number, n: number, rows: number, columns: number): number {
  if (!(n >= 2)) throw new RangeError(`bergsmaCorrectedV: needs N ≥ 2 (got ${n})`);
  const phiSquared = statistic / n;
  const corrected = Math.max(0, phiSquared - ((rows - 1) * (columns - 1)) / (n - 1));
  const shrunkRows = rows - (rows - 1) ** 2 / (n - 1);
  const shrunkColumns = columns - (columns - 1) ** 2 / (n - 1);
  const denominator = Math.min(shrunkRows - 1, shrunkColumns - 1);
  if (corrected === 0 || !(denominator > 0)) return 0;
  return Math.min(1, Math.sqrt(corrected / denominator));
}
