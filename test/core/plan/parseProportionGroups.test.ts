import assert from 'node:assert/strict';
import fc from 'fast-check';
import { parseProportionGroups } from '../../../src/core/plan/parseProportionGroups';
import { planStudy } from '../../../src/core/plan/planStudy';

describe('parseProportionGroups', () => {
  it('reads groups separated by ";" with decimals or percentages', () => {
    assert.deepEqual(parseProportionGroups('0.04,0.96; 0.08, 0.92'), { ok: true, value: [[0.04, 0.96], [0.08, 0.92]] });
    assert.deepEqual(parseProportionGroups('25% 75%'), { ok: true, value: [[0.25, 0.75]] });
  });

  it('names the entry that is not a proportion, and an empty group', () => {
    const text = parseProportionGroups('0.5,half');
    assert.ok(!text.ok && text.issue.code === 'bad-expected' && /"half" \(group 1\)/.test(text.issue.message));
    const empty = parseProportionGroups('0.5,0.5;;0.2,0.8');
    assert.ok(!empty.ok && /Group 2 is empty/.test(empty.issue.message));
  });

  it('never throws, and the planner never throws or yields NaN, on any typed text', () => {
    fc.assert(fc.property(fc.string({ maxLength: 40 }), fc.array(fc.double(), { maxLength: 3 }), (text, weights) => {
      const parsed = parseProportionGroups(text);
      if (!parsed.ok) return;
      const plan = planStudy({ design: 'independence', groups: parsed.value, allocation: weights.length > 0 ? weights : undefined });
      if (plan.ok) assert.ok(Number.isInteger(plan.value.n) && Number.isFinite(plan.value.achievedPower));
      else assert.ok(plan.issue.message.length > 10);
    }), { numRuns: 300, seed: 20261202 });
  });
});
