import { fail, ok } from '../types';
import type { Result } from '../types';
import { effectSizeFromGroups } from './effectSizeFromGroups';
import { DEFAULT_PLAN_ALPHA, DEFAULT_PLAN_POWER } from './planStudy';
import { smallestDetectableEffect } from './smallestDetectableEffect';
import { findRootBracketed } from '../stats/findRootBracketed';
import type { SensitivityResult } from './types';
import { checkSampleSize } from './validatePlanInputs';

/** Proportions are solved to 1e-12 absolute, far below any reported digit. */
const PROPORTION_TOLERANCE = 1e-12;
/** Search ends just inside (0, 1), where the 2×2 w is still defined. */
const EDGE = 1e-12;

/**
 * For two groups of n1 and n2 observations and a baseline proportion p1 in group 1, the second
 * proportions p2 nearest p1 (above and below) that a 2×2 chi-square test detects with the target
 * power (Cohen 1988, Statistical Power Analysis for the Behavioral Sciences, 2nd ed., ch. 7: w of
 * the 2×2 table of anticipated proportions, λ = N·w²).
 *
 * The smallest change in the proportion that a study of this size would reliably notice.
 *
 * ## Method
 * λ* from `smallestDetectableEffect`; w²(p2) = q1 q2 (p2 − p1)² / (p̄ (1 − p̄)) rises strictly as p2
 * moves away from p1 on either side, so each side is one bracketed root of N·w²(p2) − λ* (Brent),
 * when the side's end (p2 → 1 or → 0) already reaches λ*.
 *
 * @param n1 - size of group 1 (whole, ≥ 1)
 * @param n2 - size of group 2 (whole, ≥ 1)
 * @param baseline - p1, in (0, 1)
 * @param alpha - significance level (default 0.05)
 * @param power - target power (default 0.8)
 * @returns the sensitivity with `twoProportions.higher` / `.lower` where reachable, or the input problem
 */
export function smallestDetectableDifference(n1: number, n2: number, baseline: number, alpha = DEFAULT_PLAN_ALPHA, power = DEFAULT_PLAN_POWER): Result<SensitivityResult> {
  for (const [size, name] of [[n1, 'group 1'], [n2, 'group 2']] as const) {
    const issue = checkSampleSize(size, 0);
    if (issue) return fail({ ...issue, message: `The size of ${name} must be a whole number of at least 1 (got ${size}).` });
  }
  if (!(baseline > 0 && baseline < 1)) return fail({ code: 'bad-expected', message: `The baseline proportion must be between 0 and 1, exclusive (got ${baseline}).` });
  const n = n1 + n2;
  const effect = smallestDetectableEffect(n, 1, alpha, power);
  if (!effect.ok) return effect;
  const shares = [n1 / n, n2 / n];
  const excess = (p2: number) => {
    const w = effectSizeFromGroups([[baseline, 1 - baseline], [p2, 1 - p2]], shares);
    return n * w * w - effect.value.lambda;
  };
  const solveBetween = (near: number, far: number): number | undefined =>
    excess(far) > 0 ? findRootBracketed(excess, near, far, PROPORTION_TOLERANCE) : undefined;
  const higher = solveBetween(baseline, 1 - EDGE);
  const lower = solveBetween(baseline, EDGE);
  return ok({
    ...effect.value,
    twoProportions: { n1, n2, baseline, higher, lower },
    assumptions: [
      `Two groups of ${n1} and ${n2} observations, with a proportion of ${baseline} in group 1.`,
      'Observations are independent; the 2×2 table is tested by Pearson\'s chi-square without continuity correction.',
    ],
  });
}
