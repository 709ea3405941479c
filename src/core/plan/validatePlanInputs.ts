import type { Issue } from '../types';

/**
 * Typed proportions may be rounded; sums within this of 1 are accepted and rescaled exactly
 * (0.333 + 0.333 + 0.334 passes; 0.33 × 3 = 0.99 does not, because it would change the plan visibly).
 */
export const PROPORTION_SUM_TOLERANCE = 1e-3;
/** The largest significance level the planner accepts (a two-sided test beyond .5 makes no sense). */
export const MAX_ALPHA = 0.5;

const badOption = (message: string): Issue => ({ code: 'bad-option', message });
const badExpected = (message: string): Issue => ({ code: 'bad-expected', message });

/** alpha in (0, 0.5]. */
export function checkAlpha(alpha: number): Issue | undefined {
  if (!(alpha > 0 && alpha <= MAX_ALPHA)) {
    return badOption(`The significance level must be above 0 and at most ${MAX_ALPHA} (got ${alpha}); 0.05 is the usual choice.`);
  }
  return undefined;
}

/** Target power in (0, 1), and above alpha (below it the test needs no data at all). */
export function checkPower(power: number, alpha?: number): Issue | undefined {
  if (!(power > 0 && power < 1)) return badOption(`The target power must be between 0 and 1, exclusive (got ${power}); 0.8 or 0.9 are usual.`);
  if (alpha !== undefined && !(power > alpha)) {
    return badOption(`The target power (${power}) must be above the significance level (${alpha}); any test rejects with probability alpha when there is no effect.`);
  }
  return undefined;
}

/** Effect size w > 0 and finite. */
export function checkEffectSize(w: number): Issue | undefined {
  if (!(w > 0) || !Number.isFinite(w)) return badOption(`The effect size w must be a positive number (got ${w}); Cohen's conventions are 0.1 small, 0.3 medium, 0.5 large.`);
  return undefined;
}

/** Degrees of freedom: a whole number of at least 1. */
export function checkDf(df: number): Issue | undefined {
  if (!Number.isInteger(df) || df < 1) return badOption(`The degrees of freedom must be a whole number of at least 1 (got ${df}); (rows − 1) × (columns − 1) for a table.`);
  return undefined;
}

/** A study size N that can carry the test: a whole number above df. */
export function checkSampleSize(n: number, df: number): Issue | undefined {
  if (!Number.isInteger(n) || !(n > df)) {
    return badOption(`The sample size must be a whole number above the degrees of freedom (${df}); got ${n}.`);
  }
  return undefined;
}

/** Allocation weights: one positive finite number per group. */
export function checkAllocation(weights: readonly number[], groups: number): Issue | undefined {
  if (weights.length !== groups) return badOption(`Give one allocation weight per group: ${groups} groups, but ${weights.length} weights.`);
  const bad = weights.findIndex((weight) => !(weight > 0) || !Number.isFinite(weight));
  if (bad >= 0) return badOption(`Allocation weights must be positive (weight ${bad + 1} is ${weights[bad]}); use 1,1 for equal groups or 1,2 for twice as many in group 2.`);
  return undefined;
}

/**
 * One set of proportions: at least two, each in [0, 1], summing to 1 within the rounding tolerance.
 *
 * @param what - how messages name the set, e.g. "group 2" or "the null proportions"
 */
export function checkProportions(proportions: readonly number[], what: string): Issue | undefined {
  if (proportions.length < 2) return badExpected(`${capitalise(what)} needs at least two categories (got ${proportions.length}).`);
  const bad = proportions.findIndex((value) => !(value >= 0 && value <= 1));
  if (bad >= 0) return badExpected(`${capitalise(what)}: proportion ${bad + 1} is ${proportions[bad]}; proportions lie between 0 and 1.`);
  const sum = proportions.reduce((acc, value) => acc + value, 0);
  if (Math.abs(sum - 1) > PROPORTION_SUM_TOLERANCE) {
    return badExpected(`${capitalise(what)}: the proportions sum to ${Number(sum.toPrecision(6))}, not 1; adjust them so that they add up to 1.`);
  }
  return undefined;
}

/** Proportions rescaled to sum exactly to 1 (after `checkProportions` accepted them). */
export function normaliseProportions(proportions: readonly number[]): number[] {
  const sum = proportions.reduce((acc, value) => acc + value, 0);
  return proportions.map((value) => value / sum);
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
