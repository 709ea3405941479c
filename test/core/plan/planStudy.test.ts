import assert from 'node:assert/strict';
import * as path from 'node:path';
import { effectSizeForFit } from '../../../src/core/plan/effectSizeForFit';
import { effectSizeFromGroups } from '../../../src/core/plan/effectSizeFromGroups';
import { fleissTwoProportionSizes } from '../../../src/core/plan/fleissTwoProportionSizes';
import { chiSquarePower } from '../../../src/core/plan/chiSquarePower';
import { planStudy } from '../../../src/core/plan/planStudy';
import { requiredNoncentrality } from '../../../src/core/plan/requiredNoncentrality';
import { smallestDetectableDifference } from '../../../src/core/plan/smallestDetectableDifference';
import { smallestDetectableEffect } from '../../../src/core/plan/smallestDetectableEffect';
import fc from 'fast-check';
import { assertClose } from '../../helpers/assertClose';

interface Case { name: string; kind: string; input: Record<string, unknown>; expected: unknown; tolerance: number }
interface CohenEntry { w: number; df: number; alpha: number; power: number; cohenN: number; exactN: number; difference: number; reason?: string }
// eslint-disable-next-line @typescript-eslint/no-require-imports -- fixture JSON read at test time.
const fixture = require(path.resolve(__dirname, '../../../../test/fixtures/scipy/plan.json')) as {
  referenceVersion: string;
  cases: Case[];
  cohenFromMemory: CohenEntry[];
  fleissFromMemory: { p1: number; p2: number; alpha: number; power: number; perGroup: number; correctedPerGroup: number; formulaPerGroup: number; formulaCorrectedPerGroup: number };
};
const casesOf = (kind: string) => fixture.cases.filter((entry) => entry.kind === kind);

function planned(request: Parameters<typeof planStudy>[0]) {
  const result = planStudy(request);
  assert.ok(result.ok, result.ok ? '' : result.issue.message);
  return result.value;
}

describe('planStudy', () => {
  it('solves the noncentrality for the target power as scipy does (ncx2.sf, brentq)', () => {
    const cases = casesOf('noncentrality');
    assert.ok(cases.length >= 20);
    for (const { input, expected, tolerance } of cases) {
      const { df, alpha, power } = input as { df: number; alpha: number; power: number };
      assertClose(requiredNoncentrality(df, alpha, power), expected as number, tolerance, input);
    }
  });

  it('computes power as scipy.stats.ncx2.sf at the chi-square critical value', () => {
    for (const { input, expected, tolerance } of casesOf('power')) {
      const { n, w, df, alpha } = input as { n: number; w: number; df: number; alpha: number };
      assertClose(chiSquarePower(n * w * w, df, alpha), expected as number, tolerance, input);
    }
  });

  it('finds the smallest whole N reaching the power, equal to an integer scan with scipy', () => {
    const cases = casesOf('effect-size-n');
    assert.ok(cases.length >= 20);
    for (const { input, expected } of cases) {
      const { w, df, alpha, power } = input as { w: number; df: number; alpha: number; power: number };
      const plan = planned({ design: 'effect-size', w, df, alpha, power });
      assert.equal(plan.n, expected, JSON.stringify(input));
      assert.ok(plan.achievedPower >= power && chiSquarePower((plan.n - 1) * w * w, df, alpha) < power, JSON.stringify(input));
    }
  });

  it('matches Cohen (1988) Table 7.4.6 (values from memory) up to the recorded known differences, and scipy exactly', () => {
    // Cohen (1988), Statistical Power Analysis for the Behavioral Sciences, 2nd ed., ch. 7: N for alpha .05, power .80.
    assert.equal(fixture.cohenFromMemory.length, 4);
    for (const entry of fixture.cohenFromMemory) {
      const plan = planned({ design: 'effect-size', w: entry.w, df: entry.df, alpha: entry.alpha, power: entry.power });
      assert.equal(plan.n, entry.exactN, JSON.stringify(entry));
      assert.equal(plan.n - entry.cohenN, entry.difference, JSON.stringify(entry));
      if (entry.difference !== 0) {
        assert.ok(entry.reason && entry.difference === 1, 'a known difference needs its reason, and is one observation at most');
        assert.ok(chiSquarePower(entry.cohenN * entry.w * entry.w, entry.df, entry.alpha) < entry.power);
      }
    }
  });

  it("computes Cohen's w from group proportions and allocation as numpy does", () => {
    for (const { input, expected, tolerance } of casesOf('groups-w')) {
      const { groups, allocation } = input as { groups: number[][]; allocation: number[] };
      const sum = allocation.reduce((a, b) => a + b, 0);
      assertClose(effectSizeFromGroups(groups, allocation.map((weight) => weight / sum)), expected as number, tolerance, input);
      assertClose(planned({ design: 'independence', groups, allocation }).w, expected as number, tolerance, input);
    }
  });

  it('plans goodness of fit from anticipated against null proportions (w and N from scipy)', () => {
    for (const { input, expected, tolerance } of casesOf('fit-w')) {
      const { anticipated, nullProportions } = input as { anticipated: number[]; nullProportions: number[] };
      assertClose(effectSizeForFit(anticipated, nullProportions), expected as number, tolerance, input);
    }
    for (const { input, expected } of casesOf('fit-n')) {
      const { anticipated, nullProportions } = input as { anticipated: number[]; nullProportions: number[] };
      const plan = planned({ design: 'goodness-of-fit', anticipated, nullProportions });
      assert.equal(plan.n, expected, JSON.stringify(input));
      assert.equal(plan.df, anticipated.length - 1);
    }
  });

  it('rounds every group up and reaches the power at the whole group sizes', () => {
    const plan = planned({ design: 'independence', groups: [[0.2, 0.3, 0.5], [0.3, 0.3, 0.4]], allocation: [1, 2] });
    assert.equal(plan.perGroup.reduce((a, b) => a + b, 0), plan.n);
    assert.ok(plan.perGroup.every(Number.isInteger));
    assert.ok(plan.perGroup[1] >= 2 * plan.perGroup[0] - 2 && plan.perGroup[1] <= 2 * plan.perGroup[0] + 2, plan.perGroup.join());
    assert.ok(plan.achievedPower >= 0.8);
    const shares = plan.perGroup.map((size) => size / plan.n);
    const w = effectSizeFromGroups([[0.2, 0.3, 0.5], [0.3, 0.3, 0.4]], shares);
    assertClose(plan.lambda, plan.n * w * w, 1e-12);
    assert.equal(plan.df, 2);
  });

  it('gives a 100-point power curve rising from df + 1 past the planned N', () => {
    const plan = planned({ design: 'effect-size', w: 0.3, df: 2 });
    assert.equal(plan.curve.length, 100);
    assert.equal(plan.curve[0].n, 3);
    assert.ok(plan.curve[99].n >= 2 * plan.n);
    for (let k = 1; k < plan.curve.length; k++) assert.ok(plan.curve[k].power > plan.curve[k - 1].power && plan.curve[k].n > plan.curve[k - 1].n);
    assert.ok(plan.curve[0].power > 0.05 && plan.curve[99].power > 0.95);
  });

  it('computes the Fleiss, Levin & Paik normal-approximation sizes as the formula in scipy, and the remembered example', () => {
    for (const { input, expected } of casesOf('fleiss')) {
      const { p1, p2, alpha, power, ratio } = input as { p1: number; p2: number; alpha: number; power: number; ratio: number };
      const sizes = fleissTwoProportionSizes(p1, p2, alpha, power, ratio);
      const reference = expected as { perGroup: number[]; correctedPerGroup: number[] };
      assert.deepEqual(sizes.perGroup, reference.perGroup, JSON.stringify(input));
      assert.deepEqual(sizes.correctedPerGroup, reference.correctedPerGroup, JSON.stringify(input));
    }
    // Fleiss, Levin & Paik (2003), 3rd ed., ch. 4 — p1 .05 vs p2 .10, alpha .05, power .80: 435 per group,
    // 474 with the continuity correction (from memory; the fixture also computes them from the formula in scipy).
    const memory = fixture.fleissFromMemory;
    assert.equal(memory.formulaPerGroup, memory.perGroup);
    assert.equal(memory.formulaCorrectedPerGroup, memory.correctedPerGroup);
    const plan = planned({ design: 'two-proportions', p1: memory.p1, p2: memory.p2, alpha: memory.alpha, power: memory.power });
    assert.deepEqual(plan.twoProportions?.normalApproximation.perGroup, [435, 435]);
    assert.deepEqual(plan.twoProportions?.normalApproximation.correctedPerGroup, [474, 474]);
    assert.equal(plan.df, 1);
    // The noncentral chi-square plan is within a few observations of the uncorrected normal approximation.
    assert.ok(Math.abs(plan.perGroup[0] - 435) <= 3, String(plan.perGroup));
  });

  it('leaves out an outcome no group is expected to show, with its degrees of freedom', () => {
    const plan = planned({ design: 'independence', groups: [[0.5, 0.5, 0], [0.3, 0.7, 0]] });
    assert.equal(plan.df, 1);
    assert.equal(plan.n, planned({ design: 'independence', groups: [[0.5, 0.5], [0.3, 0.7]] }).n);
    assert.ok(plan.assumptions.some((line) => /1 outcome category expected in no group is left out/.test(line)));
  });

  it('takes the second proportion as a difference, a ratio or an odds ratio', () => {
    const direct = planned({ design: 'two-proportions', p1: 0.04, p2: 0.08 });
    assert.equal(planned({ design: 'two-proportions', p1: 0.04, difference: 0.04 }).n, direct.n);
    assert.equal(planned({ design: 'two-proportions', p1: 0.04, ratio: 2 }).n, direct.n);
    const oddsRatio = (0.08 / 0.92) / (0.04 / 0.96);
    assert.equal(planned({ design: 'two-proportions', p1: 0.04, oddsRatio }).n, direct.n);
    const unequal = planned({ design: 'two-proportions', p1: 0.04, p2: 0.08, allocationRatio: 2 });
    assert.ok(unequal.perGroup[1] >= 2 * unequal.perGroup[0] - 1);
  });

  it('refuses bad input with a clear message and never throws', () => {
    const issue = (request: Parameters<typeof planStudy>[0]) => {
      const result = planStudy(request);
      assert.ok(!result.ok);
      return result.issue;
    };
    const sum = issue({ design: 'independence', groups: [[0.2, 0.3, 0.4], [0.3, 0.3, 0.4]] });
    assert.equal(sum.code, 'bad-expected');
    assert.match(sum.message, /Group 1: the proportions sum to 0\.9, not 1/);
    assert.equal(issue({ design: 'effect-size', w: 0.3, df: 1, power: 1 }).code, 'bad-option');
    assert.match(issue({ design: 'effect-size', w: 0.3, df: 1, power: 0 }).message, /power must be between 0 and 1/);
    assert.match(issue({ design: 'effect-size', w: 0.3, df: 1, alpha: 0.6 }).message, /significance level must be above 0 and at most 0\.5/);
    assert.match(issue({ design: 'effect-size', w: 0.3, df: 1, alpha: 0 }).message, /significance level/);
    assert.match(issue({ design: 'effect-size', w: 0, df: 1 }).message, /effect size w must be a positive number/);
    assert.match(issue({ design: 'effect-size', w: -1, df: 1 }).message, /effect size w/);
    assert.match(issue({ design: 'independence', groups: [[0.5, 0.5], [0.4, 0.6]], allocation: [1, 0] }).message, /weights must be positive/);
    assert.match(issue({ design: 'independence', groups: [[0.5, 0.5], [0.5, 0.5]] }).message, /w = 0/);
    assert.match(issue({ design: 'goodness-of-fit', anticipated: [0.5, 0.5], nullProportions: [0.2, 0.3, 0.5] }).message, /2 categories but the null proportions 3/);
    assert.match(issue({ design: 'two-proportions', p1: 0.9, difference: 0.2 }).message, /is 1\.1; it must be between 0 and 1/);
    assert.match(issue({ design: 'two-proportions', p1: 0.2 }).message, /exactly one of/);
    assert.equal(issue({ design: 'effect-size', w: Number.NaN, df: 1 }).code, 'bad-option');
  });
});

describe('smallestDetectableEffect', () => {
  it('gives the smallest detectable w as scipy does', () => {
    for (const { input, expected, tolerance } of casesOf('sensitivity')) {
      const { n, df, alpha, power } = input as { n: number; df: number; alpha: number; power: number };
      const result = smallestDetectableEffect(n, df, alpha, power);
      assert.ok(result.ok);
      assertClose(result.value.w, expected as number, tolerance, input);
    }
  });

  it('refuses N at or below df', () => {
    const result = smallestDetectableEffect(2, 2);
    assert.ok(!result.ok && result.issue.code === 'bad-option' && /above the degrees of freedom/.test(result.issue.message));
  });
});

describe('smallestDetectableDifference', () => {
  it('finds the nearest detectable second proportions on both sides as scipy brentq does', () => {
    for (const { input, expected, tolerance } of casesOf('difference')) {
      const { n1, n2, baseline, alpha, power } = input as { n1: number; n2: number; baseline: number; alpha: number; power: number };
      const result = smallestDetectableDifference(n1, n2, baseline, alpha, power);
      assert.ok(result.ok);
      const reference = expected as { higher: number | null; lower: number | null };
      const pair = result.value.twoProportions;
      for (const side of ['higher', 'lower'] as const) {
        if (reference[side] === null) assert.equal(pair?.[side], undefined, side);
        else assertClose(pair?.[side] as number, reference[side], tolerance, { input, side });
      }
    }
  });
});

describe('planStudy (properties)', () => {
  it('for any valid w, df, alpha and power, returns the smallest whole N reaching the power, never NaN', () => {
    fc.assert(fc.property(
      fc.double({ min: 0.02, max: 3, noNaN: true }), fc.integer({ min: 1, max: 60 }),
      fc.double({ min: 1e-6, max: 0.5, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }),
      (w, df, alpha, share) => {
        // Targets up to .999: nearer 1, power differs from 1 by less than its own rounding (about 1e-16).
        const power = alpha + 1e-3 + (0.999 - alpha - 1e-3) * share;
        const plan = planned({ design: 'effect-size', w, df, alpha, power });
        assert.ok(Number.isInteger(plan.n) && plan.n > df);
        assert.ok(plan.achievedPower >= power, JSON.stringify({ w, df, alpha, power, n: plan.n }));
        if (plan.n - 1 > df) assert.ok(chiSquarePower((plan.n - 1) * w * w, df, alpha) < power, JSON.stringify({ w, df, alpha, power, n: plan.n }));
        assert.ok(plan.curve.every((point) => Number.isFinite(point.power)));
      },
    ), { numRuns: 200, seed: 20261202 });
  });
});
