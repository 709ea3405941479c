/** Brent's method stops here at the latest; it needs far fewer steps on the smooth monotone functions used here. */
const MAX_ITERATIONS = 200;

/**
 * A root of `f` between `a` and `b`, where f(a) and f(b) have opposite signs, by Brent's method
 * (Brent 1973, Algorithms for Minimization without Derivatives, ch. 4, procedure zero).
 *
 * Intuition: take secant or inverse-quadratic steps while they stay inside the bracket and shrink it
 * fast enough, and fall back to bisection otherwise, so convergence is never slower than bisection.
 *
 * ## Method
 * The bracket [b, c] always holds a sign change; b is the best estimate. Each step tries inverse
 * quadratic interpolation (or the secant when only two points are distinct) and accepts it only
 * when it lands within three quarters of the bracket and shrinks faster than the step before last.
 *
 * @param f - a continuous function
 * @param a - one end of the bracket
 * @param b - the other end, with sign(f(a)) ≠ sign(f(b))
 * @param tolerance - absolute tolerance on the root (> 0)
 * @returns x with |x − root| ≤ tolerance + 4ε|x|
 * @example findRootBracketed((x) => x * x - 2, 0, 2, 1e-12) // ≈ 1.414213562373
 */
export function findRootBracketed(f: (x: number) => number, a: number, b: number, tolerance: number): number {
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (!((fa < 0 && fb > 0) || (fa > 0 && fb < 0))) {
    throw new RangeError(`findRootBracketed: f(${a}) = ${fa} and f(${b}) = ${fb} do not bracket a root`);
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
    if (Math.sign(fb) === Math.sign(fc)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tolerance;
    const half = 0.5 * (c - b);
    if (Math.abs(half) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * half * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * half * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * half * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = half;
        e = half;
      }
    } else {
      d = half;
      e = half;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : half > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}
