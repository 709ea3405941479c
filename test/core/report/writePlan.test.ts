import assert from 'node:assert/strict';
import { planStudy } from '../../../src/core/plan/planStudy';
import { smallestDetectableDifference } from '../../../src/core/plan/smallestDetectableDifference';
import { writePlan } from '../../../src/core/report/writePlan';

describe('writePlan', () => {
  it('states the assumptions, the sample size per group, the achieved power and the caution', () => {
    // Invented scenario: share of bus-depot inspections finding a brake fault, 4% at one depot, 8% at the other.
    const plan = planStudy({ design: 'two-proportions', p1: 0.04, p2: 0.08 });
    assert.ok(plan.ok);
    const text = writePlan(plan.value);
    assert.match(text, /Group 1 has outcome proportions 0\.04, 0\.96\./);
    assert.ok(text.includes(`the study needs ${plan.value.n} observations (${plan.value.perGroup[0]} and ${plan.value.perGroup[1]} per group)`), text);
    assert.match(text, /80% power/);
    assert.match(text, /Fleiss, Levin and Paik/);
    assert.match(text, /if the true effect is smaller, more observations are needed/);
    assert.match(text, /qualified statistician/);
    assert.doesNotMatch(text, /observed power|NaN|undefined/);
  });

  it('describes a sensitivity as what the study could detect, not as power of its data', () => {
    const result = smallestDetectableDifference(120, 120, 0.3);
    assert.ok(result.ok);
    const text = writePlan(result.value);
    assert.match(text, /With 240 observations, a chi-square test with 1 degree of freedom/);
    assert.match(text, /w = 0\.\d{3} or larger/);
    assert.match(text, /not a statement about the effect in its data/);
    assert.doesNotMatch(text, /observed power|NaN|undefined/);
  });
});
