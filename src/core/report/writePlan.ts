import type { PlanResult, SensitivityResult } from '../plan/types';
import { formatFixed, formatPercent } from './formatNumber';

/**
 * A planning paragraph: what was assumed, the sample size and the power it reaches, and the caution
 * that the anticipated values drive everything. Sensitivity results get the smallest detectable
 * effect instead. Plain text; the wording is Tallywise's own.
 *
 * @param result - a plan from `planStudy` or a sensitivity from `smallestDetectableEffect` / `smallestDetectableDifference`
 * @returns one paragraph (sentences on one line)
 */
export function writePlan(result: PlanResult | SensitivityResult): string {
  const level = `a significance level of ${trim(result.alpha)}`;
  const test = `chi-square test with ${result.df} degree${result.df === 1 ? '' : 's'} of freedom`;
  const caution = 'These figures rest on the anticipated values: if the true effect is smaller, more observations are needed, and a plan built on an optimistic guess will miss real effects. ' +
    'For decisions about health or safety, follow a validated procedure and have the plan checked by a qualified statistician.';
  if (result.design === 'sensitivity') {
    const parts = [
      `With ${result.n} observations, a ${test} at ${level} has ${formatPercent(result.power)} power to detect an effect of w = ${formatFixed(result.w, 3)} or larger.`,
    ];
    const pair = result.twoProportions;
    if (pair) {
      const sides = [pair.lower, pair.higher].filter((value): value is number => value !== undefined).map((value) => formatFixed(value, 3));
      parts.push(`For groups of ${pair.n1} and ${pair.n2} with a proportion of ${trim(pair.baseline)} in the first, that means a second proportion of ${sides.length > 0 ? sides.join(' or ') : 'no value between 0 and 1'}${sides.length > 0 ? ' or further away' : ''}.`);
    }
    parts.push('This describes what the study could detect; it is not a statement about the effect in its data.', caution);
    return parts.join(' ');
  }
  const assumed = result.assumptions.join(' ');
  const groups = result.perGroup.length > 1 ? ` (${result.perGroup.join(' and ').replace(/ and (?=.* and )/g, ', ')} per group)` : '';
  const parts = [
    result.design === 'effect-size' ? `Assumptions: ${assumed}` : `Assumptions: ${assumed} This corresponds to an effect size of w = ${formatFixed(result.w, 3)}.`,
    `To detect it with ${formatPercent(result.power)} power by a ${test} at ${level}, the study needs ${result.n} observations${groups}; with these whole numbers the power is ${formatPercent(result.achievedPower, 1)}.`,
  ];
  const fleiss = result.twoProportions?.normalApproximation;
  if (fleiss) {
    parts.push(`The normal-approximation formula of Fleiss, Levin and Paik gives ${fleiss.perGroup.join(' and ')} per group, or ${fleiss.correctedPerGroup.join(' and ')} with the continuity correction.`);
  }
  parts.push(caution);
  return parts.join(' ');
}

function trim(value: number): string {
  return Number(value.toPrecision(4)).toString();
}
