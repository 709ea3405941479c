import { planStudy } from '../src/core/plan/planStudy';
import { powerCurve } from '../src/core/plan/powerCurve';
import { medianMs, type Figure } from './timing';

/** Timings of the study planner: one plan (including its curve) and the 100-point power curve alone. */
export function benchPlan(): Figure[] {
  // A 2×3 plan with unequal allocation: the root finder, the rounding top-ups and the curve.
  const plan = () => planStudy({ design: 'independence', groups: [[0.2, 0.35, 0.45], [0.27, 0.33, 0.4]], allocation: [1, 2], power: 0.9 });
  const curve = () => powerCurve(0.1, 4, 0.05, 5, 3000);
  return [
    { name: 'planStudy, 2×3 groups, allocation 1:2, power .9 (with its curve)', value: medianMs(plan), unit: 'ms', target: { value: 20, better: 'lower' } },
    { name: 'powerCurve, 100 points, w = 0.1, df = 4, N 5…3000', value: medianMs(curve), unit: 'ms', target: { value: 50, better: 'lower' } },
  ];
}
