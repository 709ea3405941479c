import { jStat } from 'jstat';

/**
 * The Clopper–Pearson interval for the exact p behind a Monte Carlo estimate (Clopper & Pearson,
 * "The use of confidence or fiducial limits illustrated in the case of the binomial", Biometrika 26,
 * 404–413, 1934).
 *
 * Intuition: each replicate is a coin that lands "extreme" with probability equal to the exact
 * p-value, so b extreme out of R is binomial and the interval brackets the p an exhaustive
 * enumeration would give, with at least the stated coverage.
 *
 * ## Method
 * lower = Beta⁻¹(α/2; b, R − b + 1) (0 when b = 0), upper = Beta⁻¹(1 − α/2; b + 1, R − b) (1 when b = R),
 * α = 1 − level, with jstat's beta quantile (within 3e-9 relative of scipy's over
 * R ≤ 10⁶, checked in the tests; ample for an interval on a simulated p). The reported estimate
 * (b + 1)/(R + 1) always lies inside it.
 *
 * @param extreme - b, the replicates at least as extreme as the observed data (0 ≤ b ≤ R)
 * @param replicates - R (a positive integer)
 * @param level - confidence level in (0, 1), e.g. 0.99
 * @returns the interval and its level
 */
export function monteCarloInterval(extreme: number, replicates: number, level: number): { lower: number; upper: number; level: number } {
  if (!Number.isInteger(replicates) || replicates < 1 || !Number.isInteger(extreme) || extreme < 0 || extreme > replicates || !(level > 0 && level < 1)) {
    throw new RangeError(`monteCarloInterval: needs integers 0 ≤ b ≤ R, R ≥ 1 and 0 < level < 1 (got ${extreme}, ${replicates}, ${level})`);
  }
  const alpha = 1 - level;
  const lower = extreme === 0 ? 0 : jStat.beta.inv(alpha / 2, extreme, replicates - extreme + 1);
  const upper = extreme === replicates ? 1 : jStat.beta.inv(1 - alpha / 2, extreme + 1, replicates - extreme);
  return { lower, upper, level };
}
