import { normalQuantile } from '../special/normalQuantile';
import type { Interval } from '../types';
import { riskDifferenceInterval } from './riskDifferenceInterval';
import type { TwoByTwoMeasures } from './types';

/** Haldane (1956) and Anscombe (1956): half a count added to every cell when one is empty. */
const ZERO_CELL_ADDEND = 0.5;

/**
 * Risk difference, relative risk and odds ratio of a 2×2 table, rows as the groups and the first
 * column as the outcome, each with a confidence interval.
 *
 * Intuition: three ways of saying how much more often the outcome occurs in the first row: as a
 * difference of shares, as their ratio, and as a ratio of odds.
 *
 * ## Method
 * Risk difference p₁ − p₂: Newcombe (1998, Statistics in Medicine 17, 873–890) method 10, which
 * handles empty cells itself. Relative risk p₁/p₂: log interval with
 * SE = √(1/a − 1/(a + b) + 1/c − 1/(c + d)) (Katz, Baptista, Azen & Pike 1978, Biometrics 34,
 * 469–474). Odds ratio ad/(bc): log interval with SE = √(1/a + 1/b + 1/c + 1/d) (Woolf 1955, Annals
 * of Human Genetics 19, 251–253). When any cell is 0 both ratios and their intervals use every cell
 * plus 0.5 (Haldane 1956; Anscombe 1956), so they stay finite.
 *
 * @param observed - [[a, b], [c, d]] with no zero row
 * @param level - confidence level in (0, 1)
 * @returns the three measures and whether 0.5 was added
 * @example twoByTwoMeasures([[56, 14], [48, 32]], 0.95).relativeRisk.estimate // ≈ 1.333
 */
export function twoByTwoMeasures(observed: number[][], level: number): TwoByTwoMeasures {
  const [[a, b], [c, d]] = observed;
  const z = -normalQuantile((1 - level) / 2);
  const zeroCellCorrection = a === 0 || b === 0 || c === 0 || d === 0;
  const add = zeroCellCorrection ? ZERO_CELL_ADDEND : 0;
  const [a1, b1, c1, d1] = [a + add, b + add, c + add, d + add];
  const relativeRisk = logInterval(
    a1 / (a1 + b1) / (c1 / (c1 + d1)),
    Math.sqrt(1 / a1 - 1 / (a1 + b1) + 1 / c1 - 1 / (c1 + d1)),
    z,
    level,
    'log (Katz)',
  );
  const oddsRatio = logInterval((a1 * d1) / (b1 * c1), Math.sqrt(1 / a1 + 1 / b1 + 1 / c1 + 1 / d1), z, level, 'log (Woolf)');
  return {
    riskDifference: riskDifferenceInterval(a, a + b, c, c + d, level),
    relativeRisk,
    oddsRatio,
    zeroCellCorrection,
  };
}

function logInterval(estimate: number, standardError: number, z: number, level: number, method: string): Interval {
  const log = Math.log(estimate);
  return {
    estimate,
    lower: Math.exp(log - z * standardError),
    upper: Math.exp(log + z * standardError),
    level,
    method,
  };
}
