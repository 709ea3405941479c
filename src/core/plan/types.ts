/** Shapes of the study planner (src/core/plan). The CLI's `plan --json` names come from here. */

export type PlanDesign = 'independence' | 'goodness-of-fit' | 'two-proportions' | 'effect-size';

/** One point of a power curve: the total sample size and the power there. */
export interface PowerPoint {
  n: number;
  power: number;
}

/** The classical normal-approximation sizes for two proportions (Fleiss, Levin & Paik 2003, ch. 4). */
export interface NormalApproximationSizes {
  /** Group sizes without continuity correction (eq. 4.14 and its unequal-allocation form), rounded up. */
  perGroup: [number, number];
  n: number;
  /** Group sizes with the continuity correction (eq. 4.15/4.16), rounded up. */
  correctedPerGroup: [number, number];
  correctedN: number;
}

/** The two proportions a two-group plan compares. */
export interface TwoProportions {
  p1: number;
  p2: number;
  /** Group 2 size per observation in group 1 (n2/n1). */
  allocationRatio: number;
  normalApproximation: NormalApproximationSizes;
}

/** A planned sample size: what was assumed, the sizes, and the power they reach. */
export interface PlanResult {
  design: PlanDesign;
  /** Cohen's effect size w the plan is built on. */
  w: number;
  df: number;
  alpha: number;
  /** The target power. */
  power: number;
  /** Power at the rounded whole group sizes (at least the target). */
  achievedPower: number;
  /** Total sample size (the sum of `perGroup`). */
  n: number;
  /** Whole sizes per group (one entry for goodness of fit or a plan from w alone). */
  perGroup: number[];
  /** Allocation shares per group the sizes follow (sum 1). */
  allocation: number[];
  /** The chi-square value a result must exceed to be significant at alpha. */
  criticalValue: number;
  /** Noncentrality N·w² at the rounded sizes. */
  lambda: number;
  /** Power over total sample sizes (100 points, increasing N). */
  curve: PowerPoint[];
  /** For 2×2 designs: the proportions and the normal-approximation sizes beside the chi-square ones. */
  twoProportions?: TwoProportions;
  /** What the plan takes for granted, in plain sentences. */
  assumptions: string[];
}

/** The smallest effect a study of a given size detects with the target power (sensitivity). */
export interface SensitivityResult {
  design: 'sensitivity';
  n: number;
  df: number;
  alpha: number;
  power: number;
  /** Smallest detectable w. */
  w: number;
  criticalValue: number;
  /** Noncentrality needed for the target power. */
  lambda: number;
  /** For two groups with a baseline proportion: the nearest detectable second proportions. */
  twoProportions?: {
    n1: number;
    n2: number;
    baseline: number;
    /** Smallest detectable p2 above the baseline, if one below 1 reaches the power. */
    higher?: number;
    /** Largest detectable p2 below the baseline, if one above 0 reaches the power. */
    lower?: number;
  };
  assumptions: string[];
}
