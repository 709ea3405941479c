import { jStat } from 'jstat';

/**
 * TEMPORARY placeholder: Poisson mixture of central chi-square cdfs, plain summation.
 * P(X ≤ x) for the noncentral chi-square with `df` degrees of freedom and noncentrality `lambda`.
 */
export function noncentralChiSquareCdf(x: number, df: number, lambda: number): number {
  if (x <= 0) return 0;
  const half = lambda / 2;
  let sum = 0;
  for (let j = 0; j < 2000; j++) {
    const w = Math.exp(-half + j * Math.log(half || 1e-300) - jStat.gammaln(j + 1));
    sum += w * jStat.chisquare.cdf(x, df + 2 * j);
    if (j > half && w < 1e-17) break;
  }
  return Math.min(1, sum);
}
