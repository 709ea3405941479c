import { chiSquareCriticalValue } from '../special/chiSquareCriticalValue';
import { fail, ok } from '../types';
import type { Issue, Result } from '../types';
import { allocateGroups } from './allocateGroups';
import { chiSquarePower } from './chiSquarePower';
import { effectSizeForFit } from './effectSizeForFit';
import { effectSizeFromGroups } from './effectSizeFromGroups';
import { fleissTwoProportionSizes } from './fleissTwoProportionSizes';
import { POWER_CURVE_POINTS, powerCurve } from './powerCurve';
import { requiredNoncentrality } from './requiredNoncentrality';
import type { PlanResult } from './types';
import {
  checkAllocation, checkAlpha, checkDf, checkEffectSize, checkPower, checkProportions, normaliseProportions,
} from './validatePlanInputs';

/** Common practice: a 5% two-sided level and 80% power (Cohen 1988, ch. 2, proposes .80 as a convention). */
export const DEFAULT_PLAN_ALPHA = 0.05;
export const DEFAULT_PLAN_POWER = 0.8;
/** Above this total a plan is refused: no study of that size is meant, and whole numbers stop being exact. */
const MAX_TOTAL = 1e12;
/** Rounding each group up moves the shares slightly; a handful of extra observations always restores the power. */
const MAX_TOP_UPS = 10000;

export interface PlanSettings {
  /** Significance level (default 0.05). */
  alpha?: number;
  /** Target power (default 0.8). */
  power?: number;
}

export type PlanRequest = PlanSettings & (
  | { design: 'effect-size'; w: number; df: number }
  | { design: 'independence'; groups: number[][]; allocation?: number[] }
  | { design: 'goodness-of-fit'; anticipated: number[]; nullProportions: number[] }
  | {
    design: 'two-proportions';
    p1: number;
    /** The second proportion, or one of `difference` (p2 − p1), `ratio` (p2 / p1), `oddsRatio`. */
    p2?: number;
    difference?: number;
    ratio?: number;
    oddsRatio?: number;
    /** n2 / n1 (default 1). */
    allocationRatio?: number;
  }
);

/**
 * The total and per-group sample sizes a chi-square test needs to reach the target power, from
 * anticipated proportions per group, anticipated vs null proportions, two proportions, or an effect
 * size w (Cohen 1988, Statistical Power Analysis for the Behavioral Sciences, 2nd ed., ch. 7).
 *
 * How many observations make a true effect of the anticipated size come out significant that often.
 *
 * ## Method
 * λ* solves P(χ²(df, λ) > c_alpha) = power (`requiredNoncentrality`); the continuous total is λ* / w².
 * Each group is rounded up (`allocateGroups`), the power recomputed with w at the whole groups'
 * actual shares, and the total raised one observation at a time while it falls short. The curve
 * spans df + 1 to twice the planned total. 2×2 plans also carry the Fleiss normal-approximation sizes.
 *
 * @param request - the design, its anticipated values, alpha and power
 * @returns the plan, or the first input problem ('bad-option', 'bad-expected')
 */
export function planStudy(request: PlanRequest): Result<PlanResult> {
  const alpha = request.alpha ?? DEFAULT_PLAN_ALPHA;
  const power = request.power ?? DEFAULT_PLAN_POWER;
  const settingsIssue = checkAlpha(alpha) ?? checkPower(power, alpha);
  if (settingsIssue) return fail(settingsIssue);
  const design = describeDesign(request);
  if (!design.ok) return design;
  const { w, df, allocation, effectAt, assumptions } = design.value;
  if (!(w > 0)) {
    return fail(badExpected('The anticipated proportions are the same in every group or category (w = 0), so there is no difference to detect; ' +
      'enter the difference you expect.'));
  }
  const lambdaNeeded = requiredNoncentrality(df, alpha, power);
  const continuous = lambdaNeeded / (w * w);
  if (!(continuous <= MAX_TOTAL)) {
    return fail({ code: 'bad-option', message: `An effect of w = ${w.toPrecision(3)} would need more than ${MAX_TOTAL.toExponential(0)} observations; plan for a larger effect or check the anticipated values.` });
  }
  const critical = chiSquareCriticalValue(alpha, df);
  let total = Math.max(Math.ceil(continuous - 1e-9 * continuous), df + 1);
  let perGroup = allocateGroups(total, allocation);
  let achieved = powerAt(perGroup);
  for (let topUp = 0; achieved.power < power; topUp++) {
    if (topUp >= MAX_TOP_UPS) throw new Error('planStudy: the rounded sizes never reached the target power');
    total += 1;
    perGroup = allocateGroups(total, allocation);
    achieved = powerAt(perGroup);
  }
  const n = perGroup.reduce((acc, size) => acc + size, 0);
  const from = df + 1;
  const curve = powerCurve(w, df, alpha, from, Math.max(2 * n, from + POWER_CURVE_POINTS - 1));
  const plan: PlanResult = {
    design: request.design, w, df, alpha, power, achievedPower: achieved.power, n, perGroup, allocation,
    criticalValue: critical, lambda: achieved.lambda, curve, assumptions,
  };
  if (request.design === 'two-proportions' && design.value.twoProportions) {
    const { p1, p2, ratio } = design.value.twoProportions;
    plan.twoProportions = { p1, p2, allocationRatio: ratio, normalApproximation: fleissTwoProportionSizes(p1, p2, alpha, power, ratio) };
  }
  return ok(plan);

  function powerAt(sizes: number[]): { power: number; lambda: number } {
    const sum = sizes.reduce((acc, size) => acc + size, 0);
    const effect = effectAt(sizes.map((size) => size / sum));
    const lambda = sum * effect * effect;
    return { power: chiSquarePower(lambda, df, alpha, critical), lambda };
  }
}

interface DesignFacts {
  w: number;
  df: number;
  allocation: number[];
  /** w at the given group shares (the rounded sizes shift them slightly). */
  effectAt: (shares: number[]) => number;
  assumptions: string[];
  twoProportions?: { p1: number; p2: number; ratio: number };
}

function describeDesign(request: PlanRequest): Result<DesignFacts> {
  switch (request.design) {
    case 'effect-size': {
      const issue = checkEffectSize(request.w) ?? checkDf(request.df);
      if (issue) return fail(issue);
      return ok({
        w: request.w, df: request.df, allocation: [1], effectAt: () => request.w,
        assumptions: [`The true effect is at least w = ${request.w} on a chi-square test with ${request.df} degree${request.df === 1 ? '' : 's'} of freedom.`],
      });
    }
    case 'goodness-of-fit': {
      const issue = checkProportions(request.anticipated, 'the anticipated proportions') ?? checkProportions(request.nullProportions, 'the null proportions') ??
        (request.anticipated.length !== request.nullProportions.length
          ? badExpected(`The anticipated proportions have ${request.anticipated.length} categories but the null proportions ${request.nullProportions.length}; give one of each per category.`)
          : undefined) ??
        (request.nullProportions.some((value) => !(value > 0)) ? badExpected('Every null proportion must be above 0: a category the null rules out cannot be tested by chi-square.') : undefined);
      if (issue) return fail(issue);
      const anticipated = normaliseProportions(request.anticipated);
      const nullProportions = normaliseProportions(request.nullProportions);
      const w = effectSizeForFit(anticipated, nullProportions);
      return ok({
        w, df: anticipated.length - 1, allocation: [1], effectAt: () => w,
        assumptions: [
          `The categories occur in proportions ${listOf(anticipated)} in the study population.`,
          `The test checks them against the null proportions ${listOf(nullProportions)}.`,
          'Observations are independent, each falling in exactly one category.',
        ],
      });
    }
    case 'independence':
      return groupsDesign(request.groups, request.allocation ?? request.groups.map(() => 1));
    case 'two-proportions': {
      const p2 = secondProportion(request);
      if (!p2.ok) return p2;
      const ratio = request.allocationRatio ?? 1;
      if (!(ratio > 0) || !Number.isFinite(ratio)) return fail({ code: 'bad-option', message: `The allocation ratio n2/n1 must be positive (got ${ratio}); 1 means equal groups.` });
      const design = groupsDesign([[request.p1, 1 - request.p1], [p2.value, 1 - p2.value]], [1, ratio]);
      if (!design.ok) return design;
      return ok({ ...design.value, twoProportions: { p1: request.p1, p2: p2.value, ratio } });
    }
  }
}

function groupsDesign(groups: number[][], weights: number[]): Result<DesignFacts> {
  if (groups.length < 2) return fail(badExpected(`Comparing groups needs at least two groups (got ${groups.length}); for one group against fixed proportions plan a goodness-of-fit test.`));
  const width = groups[0].length;
  const ragged = groups.findIndex((group) => group.length !== width);
  if (ragged >= 0) return fail(badExpected(`Group 1 has ${width} outcome categories but group ${ragged + 1} has ${groups[ragged].length}; give the same categories for every group.`));
  for (let i = 0; i < groups.length; i++) {
    const issue = checkProportions(groups[i], `group ${i + 1}`);
    if (issue) return fail(issue);
  }
  const weightIssue = checkAllocation(weights, groups.length);
  if (weightIssue) return fail(weightIssue);
  // An outcome no group is expected to show has no expected counts; the test would drop it, so its df go too.
  const used = groups[0].map((_, j) => groups.some((group) => group[j] > 0));
  const proportions = groups.map((group) => normaliseProportions(group).filter((_, j) => used[j]));
  const allocation = normaliseProportions(weights);
  const categories = used.filter(Boolean).length;
  if (categories < 2) return fail(badExpected('Only one outcome category has a proportion above 0, so there is nothing to compare; give at least two outcomes.'));
  const df = (groups.length - 1) * (categories - 1);
  const equal = allocation.every((share) => Math.abs(share - allocation[0]) < 1e-12);
  return ok({
    w: effectSizeFromGroups(proportions, allocation), df, allocation,
    effectAt: (shares) => effectSizeFromGroups(proportions, shares),
    assumptions: [
      ...proportions.map((group, index) => `Group ${index + 1} has outcome proportions ${listOf(group)}.`),
      equal ? `The ${groups.length} groups are of equal size.` : `The groups take shares ${listOf(allocation)} of the sample.`,
      'Observations are independent, each in one group and one outcome category.',
      ...(categories < width ? [`${width - categories} outcome categor${width - categories === 1 ? 'y' : 'ies'} expected in no group ${width - categories === 1 ? 'is' : 'are'} left out.`] : []),
    ],
  });
}

function secondProportion(request: Extract<PlanRequest, { design: 'two-proportions' }>): Result<number> {
  const { p1 } = request;
  if (!(p1 > 0 && p1 < 1)) return fail(badExpected(`The first proportion must be between 0 and 1, exclusive (got ${p1}).`));
  const given = [request.p2, request.difference, request.ratio, request.oddsRatio].filter((value) => value !== undefined).length;
  if (given !== 1) return fail({ code: 'bad-option', message: 'Give the second group as exactly one of: its proportion, the difference p2 − p1, the ratio p2/p1, or the odds ratio.' });
  let p2: number;
  let how: string;
  if (request.p2 !== undefined) [p2, how] = [request.p2, 'the second proportion'];
  else if (request.difference !== undefined) [p2, how] = [p1 + request.difference, `p1 + difference = ${p1} + ${request.difference}`];
  else if (request.ratio !== undefined) [p2, how] = [p1 * request.ratio, `p1 × ratio = ${p1} × ${request.ratio}`];
  else {
    const odds = (request.oddsRatio as number) * (p1 / (1 - p1));
    [p2, how] = [odds / (1 + odds), `the odds ratio ${request.oddsRatio}`];
    if (!((request.oddsRatio as number) > 0)) return fail(badExpected(`The odds ratio must be positive (got ${request.oddsRatio}).`));
  }
  if (!(p2 > 0 && p2 < 1)) return fail(badExpected(`The second proportion from ${how} is ${Number(p2.toPrecision(6))}; it must be between 0 and 1, exclusive.`));
  if (Math.abs(p2 - p1) < 1e-12) return fail(badExpected(`The two proportions are equal (${p1}); there is no difference to detect.`));
  return ok(p2);
}

function badExpected(message: string): Issue {
  return { code: 'bad-expected', message };
}

function listOf(values: readonly number[]): string {
  return values.map((value) => Number(value.toPrecision(4)).toString()).join(', ');
}
