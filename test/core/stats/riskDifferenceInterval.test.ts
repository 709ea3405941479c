import { riskDifferenceInterval } from '../../../src/core/stats/riskDifferenceInterval';
import { assertClose } from '../../helpers/assertClose';

describe('riskDifferenceInterval', () => {
  // Newcombe (1998), "Interval estimation for the difference between independent proportions:
  // comparison of eleven methods", Statistics in Medicine 17, 873–890, Table II, method 10
  // (hybrid score, no continuity correction), 95% — values from memory, printed to 4 decimals.
  const newcombeTableII: [string, [number, number, number, number], number, number, number][] = [
    ['(a) 56/70 − 48/80', [56, 70, 48, 80], 0.2, 0.0524, 0.3339],
    ['(b) 9/10 − 3/10', [9, 10, 3, 10], 0.6, 0.1705, 0.809],
    ['(e) 0/10 − 0/20', [0, 10, 0, 20], 0, -0.1611, 0.2775],
    ['(f) 10/10 − 0/20', [10, 10, 0, 20], 1, 0.6791, 1],
    ['(g) 10/10 − 0/10', [10, 10, 0, 10], 1, 0.6075, 1],
  ];
  for (const [label, [a, n1, c, n2], estimate, lower, upper] of newcombeTableII) {
    it(`gives Newcombe's Table II example ${label}: ${estimate}, ${lower} to ${upper}`, () => {
      const interval = riskDifferenceInterval(a, n1, c, n2, 0.95);
      assertClose(interval.estimate, estimate, { absolute: 1e-12 }, label);
      assertClose(interval.lower, lower, { absolute: 5e-5 }, label);
      assertClose(interval.upper, upper, { absolute: 5e-5 }, label);
    });
  }
});
