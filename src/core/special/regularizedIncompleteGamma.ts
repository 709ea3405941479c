import { logPoissonProbability } from './logPoissonProbability';

/** Both regularized incomplete gamma functions, each also as a natural logarithm. */
export interface IncompleteGamma {
  /** P(a, z) = γ(a, z) / Γ(a): the gamma(a) distribution function at z. */
  lower: number;
  /** Q(a, z) = Γ(a, z) / Γ(a) = 1 − P(a, z), computed without that subtraction when it would cancel. */
  upper: number;
  /** log P(a, z), finite even where `lower` underflows to 0. */
  logLower: number;
  /** log Q(a, z), finite even where `upper` underflows to 0. */
  logUpper: number;
}

/** The series stops when a bound on its remaining terms falls below this share of the sum (≈ eps/2). */
const SERIES_TOLERANCE = 1e-16;
/** The continued fraction stops when a Lentz factor is within this of 1 (machine epsilon, as in Numerical Recipes). */
const FRACTION_TOLERANCE = Number.EPSILON;
/**
 * Iteration cap, BASE + PER_ROOT·√a. Just below z = a + 1 the series needs about 8.4·√a terms
 * (they fall like exp(−n²/2a)); just above it the continued fraction needs fewer (1.5·√a at
 * a = 5e4, 59 steps at a = ½). Measured, not derived: the cap leaves a sixfold margin.
 */
const ITERATIONS_BASE = 500;
const ITERATIONS_PER_ROOT_A = 50;
/** Lentz's guard against a zero denominator (Press et al., Numerical Recipes, §5.2). */
const TINY = 1e-300;

const NAN_RESULT: IncompleteGamma = { lower: NaN, upper: NaN, logLower: NaN, logUpper: NaN };

/**
 * The regularized incomplete gamma functions P(a, z) and Q(a, z), each to a relative error of
 * about 1e-13 for a ≥ ½ (not only the larger one), with logarithms that stay accurate in far tails.
 *
 * Q(a, z) is the chance that a gamma(a) variable exceeds z; Q(df/2, x/2) is the chi-square upper tail.
 * References: Press et al., Numerical Recipes (3rd ed.), §6.2 (series and Legendre continued fraction,
 * modified Lentz evaluation); Loader (2000) for the prefactor.
 *
 * ## Method
 * Prefactor D = z^a·e^(−z)/Γ(a + 1) in log space by `logPoissonProbability` (absolute error about
 * eps·|log D|, not eps·a). For z < a + 1, P = D·Σ_{n≥0} z^n / ((a+1)…(a+n)) and Q = 1 − P, which
 * cancels little there: P < 0.92 for a ≥ ½ (at most a factor 12 lost, at a = ½), though the loss
 * grows like 1/a below that (3e-13 at a = 0.005, 3e-11 at a = 5e-5). Otherwise
 * Q = a·D·F with F the continued fraction 1/(z+1−a− 1(1−a)/(z+3−a− 2(2−a)/(z+5−a− …))),
 * and P = 1 − Q. Logs come from log D + log(sum) and log1p(−other).
 *
 * @param a - Shape, a > 0.
 * @param z - Argument, z ≥ 0 (Infinity allowed).
 * @returns P, Q and their logs; all NaN for invalid input or (never seen) non-convergence.
 */
export function regularizedIncompleteGamma(a: number, z: number): IncompleteGamma {
  if (!(a > 0) || a === Infinity || !(z >= 0)) return NAN_RESULT;
  if (z === 0) return { lower: 0, upper: 1, logLower: -Infinity, logUpper: 0 };
  if (z === Infinity) return { lower: 1, upper: 0, logLower: 0, logUpper: -Infinity };
  const maxIterations = ITERATIONS_BASE + ITERATIONS_PER_ROOT_A * Math.sqrt(a);
  const logPrefactor = logPoissonProbability(a, z);

  if (z < a + 1) {
    let term = 1;
    let sum = 1;
    let converged = false;
    for (let n = 1; n <= maxIterations; n++) {
      term *= z / (a + n);
      sum += term;
      // Later terms shrink at least by r = z/(a+n+1) < 1 each, so they add at most term·r/(1 − r).
      if (term * z <= SERIES_TOLERANCE * sum * (a + n + 1 - z)) {
        converged = true;
        break;
      }
    }
    if (!converged) return NAN_RESULT;
    const logLower = logPrefactor + Math.log(sum);
    const lower = Math.exp(logLower);
    return { lower, upper: 1 - lower, logLower, logUpper: Math.log1p(-lower) };
  }

  let b = z + 1 - a;
  let c = 1 / TINY;
  let d = 1 / b;
  let fraction = d;
  let converged = false;
  for (let i = 1; i <= maxIterations; i++) {
    const numerator = -i * (i - a);
    b += 2;
    d = numerator * d + b;
    if (Math.abs(d) < TINY) d = TINY;
    c = b + numerator / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const factor = d * c;
    fraction *= factor;
    if (Math.abs(factor - 1) <= FRACTION_TOLERANCE) {
      converged = true;
      break;
    }
  }
  if (!converged) return NAN_RESULT;
  const logUpper = logPrefactor + Math.log(a) + Math.log(fraction);
  const upper = Math.exp(logUpper);
  return { lower: 1 - upper, upper, logLower: Math.log1p(-upper), logUpper };
}
