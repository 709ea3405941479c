import quantile from '@stdlib/stats-base-dists-normal-quantile';

/** Standard normal quantile: the z with P(Z ≤ z) = p. Returns NaN outside (0, 1). */
export function normalQuantile(p: number): number {
  return quantile(p, 0, 1);
}
