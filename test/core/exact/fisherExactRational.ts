/**
 * Fisher's exact test by its definition in exact rational arithmetic (BigInt), for checking the
 * floating-point implementation: P(x) = C(m, x)·C(n, k − x) / C(N, k) with integer numerators.
 */

export interface RationalFisher {
  p: number;
  pLess: number;
  pGreater: number;
  observed: number;
  midP: number;
}

const TIE_DENOMINATOR = 10_000_000n; // RELATIVE_TIE_TOLERANCE = 1e-7 = 1 / 10^7, exactly, here

export function binomial(n: number, k: number): bigint {
  if (k < 0 || k > n) return 0n;
  const r = Math.min(k, n - k);
  let result = 1n;
  for (let i = 1; i <= r; i++) result = (result * BigInt(n - r + i)) / BigInt(i);
  return result;
}

/** numerator / denominator as the nearest-ish double (within a few ulps), also for numbers beyond 1e308. */
export function ratioToNumber(numerator: bigint, denominator: bigint): number {
  if (numerator === 0n) return 0;
  const shift = numerator.toString(2).length - denominator.toString(2).length - 64;
  const quotient = shift >= 0 ? numerator / (denominator << BigInt(shift)) : (numerator << BigInt(-shift)) / denominator;
  return Number(quotient) * 2 ** shift;
}

export function rationalFisher(table: [[number, number], [number, number]]): RationalFisher {
  const [[a, b], [c, d]] = table;
  const m = a + b;
  const n = c + d;
  const k = a + c;
  const lowest = Math.max(0, k - n);
  const highest = Math.min(k, m);
  const weights = new Map<number, bigint>();
  // C(m, x + 1) = C(m, x)·(m − x)/(x + 1), and likewise for C(n, k − x): each step is exact.
  let left = binomial(m, lowest);
  let right = binomial(n, k - lowest);
  for (let x = lowest; x <= highest; x++) {
    weights.set(x, left * right);
    left = (left * BigInt(m - x)) / BigInt(x + 1);
    if (k - x > 0) right = (right * BigInt(k - x)) / BigInt(n - k + x + 1);
  }
  const denominator = binomial(m + n, k);
  const observed = weights.get(a)!;
  let two = 0n;
  let ties = 0n;
  let less = 0n;
  let greater = 0n;
  for (const [x, weight] of weights) {
    if (weight * TIE_DENOMINATOR <= observed * (TIE_DENOMINATOR + 1n)) {
      two += weight;
      if (observed * TIE_DENOMINATOR <= weight * (TIE_DENOMINATOR + 1n)) ties += weight;
    }
    if (x <= a) less += weight;
    if (x >= a) greater += weight;
  }
  return {
    p: ratioToNumber(two, denominator),
    pLess: ratioToNumber(less, denominator),
    pGreater: ratioToNumber(greater, denominator),
    observed: ratioToNumber(observed, denominator),
    midP: ratioToNumber(2n * two - ties, 2n * denominator),
  };
}
