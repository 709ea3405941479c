import type { StratumTable } from './cochranMantelHaenszel';

/** Distance of Σ E(a) from the nearest bound of Σ a over strata, and whether it meets the rule of 5. */
export interface MantelFleissCheck {
  /** Σ max(0, m₁ − n₂): the smallest Σ a the margins allow. */
  lowerBound: number;
  /** Σ E(a) = Σ n₁m₁/n. */
  expected: number;
  /** Σ min(n₁, m₁): the largest Σ a the margins allow. */
  upperBound: number;
  /** min(expected − lowerBound, upperBound − expected). */
  distance: number;
  /** distance ≥ 5. */
  ok: boolean;
}

/** The rule's threshold: the chi-square approximation to CMH is adequate at 5 or more (Mantel & Fleiss 1980). */
const MIN_DISTANCE = 5;

/**
 * The Mantel–Fleiss criterion for the CMH chi-square approximation (Mantel & Fleiss 1980, American
 * Journal of Epidemiology 112, 129–134; the statement of the rule here is from memory): the summed
 * expected top-left count must lie at least 5 from both the smallest and the largest sum the
 * margins allow. It plays the part Cochran's rule plays for one table.
 *
 * @param strata - the strata used by the CMH test (n ≥ 2 each)
 */
export function mantelFleissCriterion(strata: readonly StratumTable[]): MantelFleissCheck {
  let lowerBound = 0;
  let expected = 0;
  let upperBound = 0;
  for (const [[a, b], [c, d]] of strata) {
    const n = a + b + c + d;
    if (n < 2) continue;
    const firstRow = a + b;
    const secondRow = c + d;
    const firstColumn = a + c;
    lowerBound += Math.max(0, firstColumn - secondRow);
    upperBound += Math.min(firstRow, firstColumn);
    expected += (firstRow * firstColumn) / n;
  }
  const distance = Math.min(expected - lowerBound, upperBound - expected);
  return { lowerBound, expected, upperBound, distance, ok: distance >= MIN_DISTANCE };
}
