// jstat ships no type declarations; only the parts Tallywise calls are declared.
declare module 'jstat' {
  export const jStat: {
    chisquare: { cdf(x: number, df: number): number; pdf(x: number, df: number): number; inv(p: number, df: number): number };
    normal: { cdf(x: number, mean: number, sd: number): number; inv(p: number, mean: number, sd: number): number };
    poisson: { pdf(k: number, lambda: number): number; cdf(k: number, lambda: number): number };
    binomial: { pdf(k: number, n: number, p: number): number; cdf(k: number, n: number, p: number): number };
    beta: { inv(p: number, alpha: number, beta: number): number; cdf(x: number, alpha: number, beta: number): number };
    hypgeom: { pdf(k: number, population: number, successes: number, draws: number): number };
    gammaln(x: number): number;
    corrcoeff(x: number[], y: number[]): number;
    lowRegGamma(a: number, x: number): number;
  };
}
