import { findRootBracketed } from '../stats/findRootBracketed';
import type { Interval } from '../types';
import { hypergeometricMargins } from './hypergeometricMargins';
import { hypergeometricNoncentralMoments } from './hypergeometricNoncentralMoments';

/** Roots are found on log ψ to this absolute tolerance, i.e. ψ to a relative 1e-10, far below any reported digit. */
const LOG_ODDS_TOLERANCE = 1e-10;
/** exp(700) is still a finite double; a bound this far out means the data put all mass on one end. */
const MAX_ABS_LOG_ODDS = 700;
/** Doubling the step from ~one standard error reaches MAX_ABS_LOG_ODDS well within this many steps. */
const MAX_BRACKET_STEPS = 60;
/** Haldane (1956): half a count in every cell gives a finite starting guess for log ψ. */
const HALDANE_ADDEND = 0.5;
const METHOD = 'conditional maximum likelihood, exact (Cornfield) interval';

/**
 * The conditional maximum-likelihood estimate of the odds ratio ψ of a 2×2 table [[a, b], [c, d]],
 * with its exact confidence interval.
 *
 * Intuition: given all four totals, a follows Fisher's noncentral hypergeometric distribution with
 * parameter ψ; the estimate is the ψ under which a is the expected value, and the interval holds the
 * ψ under which a is not in either 2.5% tail. Fisher (1935), "The logic of inductive inference",
 * JRSS 98, 39–82; Cornfield (1956), "A statistical problem arising from retrospective studies",
 * Proc. Third Berkeley Symposium 4, 135–148; Breslow & Day (1980), Statistical Methods in Cancer
 * Research I, §4.2.
 *
 * ## Method
 * Estimate: the root of E_ψ[X] = a. Lower limit: the root of P_ψ(X ≥ a) = α/2; upper limit: the
 * root of P_ψ(X ≤ a) = α/2, with α = 1 − level. Each side is monotone in ψ. Roots are bracketed on
 * log ψ by doubling steps from the estimate (or Haldane's ½-corrected log ad/bc), starting at the
 * Woolf-type standard error, then found by Brent's method (findRootBracketed) to LOG_ODDS_TOLERANCE.
 * At a's smallest possible value the estimate and lower limit are 0; at its largest, the estimate
 * and upper limit are Infinity.
 *
 * @param table - [[a, b], [c, d]] of non-negative integers
 * @param level - confidence level in (0, 1), default 0.95
 * @returns estimate and interval; null when a row or column total is 0 (ψ is then not identified)
 * @throws RangeError for a cell that is not a non-negative integer, or a level outside (0, 1)
 * @example conditionalOddsRatio([[12, 5], [4, 11]])?.estimate // ≈ 6.166
 */
export function conditionalOddsRatio(table: readonly (readonly number[])[], level = 0.95): Interval | null {
  if (!(level > 0 && level < 1)) throw new RangeError(`the confidence level must lie in (0, 1), got ${level}`);
  const margins = hypergeometricMargins(table);
  const { lowest, highest } = margins;
  if (lowest === highest) return null;
  const [[a, b], [c, d]] = table;
  const halfAlpha = (1 - level) / 2;
  const step = Math.sqrt(1 / (a + HALDANE_ADDEND) + 1 / (b + HALDANE_ADDEND) + 1 / (c + HALDANE_ADDEND) + 1 / (d + HALDANE_ADDEND));
  const haldane = Math.log(((a + HALDANE_ADDEND) * (d + HALDANE_ADDEND)) / ((b + HALDANE_ADDEND) * (c + HALDANE_ADDEND)));
  const moments = (logOdds: number) => hypergeometricNoncentralMoments(margins, logOdds, a);

  let logEstimate: number;
  if (a === lowest) logEstimate = -Infinity;
  else if (a === highest) logEstimate = Infinity;
  else logEstimate = increasingRoot((t) => moments(t).mean - a, haldane, step);
  const start = Number.isFinite(logEstimate) ? logEstimate : haldane;
  const logLower = a === lowest ? -Infinity : increasingRoot((t) => moments(t).pAtLeast - halfAlpha, start, step);
  const logUpper = a === highest ? Infinity : increasingRoot((t) => halfAlpha - moments(t).pAtMost, start, step);
  return { estimate: Math.exp(logEstimate), lower: Math.exp(logLower), upper: Math.exp(logUpper), level, method: METHOD };
}

/** The root of an increasing f, bracketed by doubling steps away from `start` toward the sign change. */
function increasingRoot(evaluate: (t: number) => number, start: number, initialStep: number): number {
  // Brent's method re-evaluates both ends of the bracket; each evaluation is a walk over the support.
  const known = new Map<number, number>();
  const f = (t: number) => {
    let value = known.get(t);
    if (value === undefined) {
      value = evaluate(t);
      known.set(t, value);
    }
    return value;
  };
  const atStart = f(start);
  if (atStart === 0) return start;
  const direction = atStart < 0 ? 1 : -1;
  let inner = start;
  let step = initialStep;
  for (let i = 0; i < MAX_BRACKET_STEPS; i++) {
    const outer = Math.max(-MAX_ABS_LOG_ODDS, Math.min(MAX_ABS_LOG_ODDS, start + direction * step));
    const atOuter = f(outer);
    if (atOuter === 0) return outer;
    if (Math.sign(atOuter) !== Math.sign(atStart)) return findRootBracketed(f, inner, outer, LOG_ODDS_TOLERANCE);
    if (Math.abs(outer) === MAX_ABS_LOG_ODDS) return outer;
    inner = outer;
    step *= 2;
  }
  return inner;
}
