import type { Interval } from '../types';
import { wilsonInterval } from './wilsonInterval';

/**
 * Newcombe's (1998) hybrid score interval for a difference of two independent proportions, method 10
 * (Newcombe, "Interval estimation for the difference between independent proportions: comparison of
 * eleven methods", Statistics in Medicine 17, 873–890).
 *
 * Intuition: each proportion's Wilson limits say how far it could plausibly move in each direction;
 * the difference moves down as far as p₁ can fall and p₂ rise together, added in quadrature.
 *
 * ## Method
 * With Wilson limits (l₁, u₁) for p₁ and (l₂, u₂) for p₂ and D = p₁ − p₂:
 * lower = D − √((p₁ − l₁)² + (u₂ − p₂)²), upper = D + √((u₁ − p₁)² + (p₂ − l₂)²).
 *
 * @param successes1 - outcome count in group 1
 * @param n1 - size of group 1 (> 0)
 * @param successes2 - outcome count in group 2
 * @param n2 - size of group 2 (> 0)
 * @param level - confidence level in (0, 1)
 * @returns p₁ − p₂ with its interval
 * @example riskDifferenceInterval(56, 70, 48, 80, 0.95) // 0.2000, [0.0524, 0.3339]
 */
export function riskDifferenceInterval(successes1: number, n1: number, successes2: number, n2: number, level: number): Interval {
  const first = wilsonInterval(successes1, n1, level);
  const second = wilsonInterval(successes2, n2, level);
  const estimate = first.estimate - second.estimate;
  return {
    estimate,
    lower: Math.max(-1, estimate - Math.hypot(first.estimate - first.lower, second.upper - second.estimate)),
    upper: Math.min(1, estimate + Math.hypot(first.upper - first.estimate, second.estimate - second.lower)),
    level,
    method: 'Newcombe hybrid score (method 10)',
  };
}
