import { chiSquareUpperTail } from '../special/chiSquareUpperTail';
import { bergsmaCorrectedV } from './bergsmaCorrectedV';
import { bonferroniCriticalValue } from './bonferroniCriticalValue';
import { checkCochranRule } from './checkCochranRule';
import { cramersVInterval } from './cramersVInterval';
import { gTest } from './gTest';
import { tableMargins } from './tableMargins';
import { twoByTwoMeasures } from './twoByTwoMeasures';
import { DEFAULT_TEST_OPTIONS, type AdjustedResidualFlag, type IndependenceResult, type TestOptions } from './types';
import { wilsonInterval } from './wilsonInterval';
import { yatesStatistic } from './yatesStatistic';

/**
 * Pearson's chi-square test of independence (or homogeneity) for an r×c table of counts, with the
 * G-test, residuals, effect sizes and, for a 2×2 table, risk and odds comparisons
 * (Pearson 1900; Agresti 2013, Categorical Data Analysis 3rd ed., §3.2 and §2.4).
 *
 * Intuition: if rows and columns are unrelated every row splits across the columns in the same
 * shares; X² measures how far the counts stray from that, and the residuals show where.
 *
 * ## Method
 * - Expected E = (row total)(column total)/N; X² = Σ(O − E)²/E with df = (r − 1)(c − 1).
 * - G² = 2 Σ O ln(O/E), also divided by Williams' (1976, Biometrika 63, 33–37)
 *   q = 1 + (N Σ 1/rᵢ − 1)(N Σ 1/cⱼ − 1) / (6N(r − 1)(c − 1)).
 * - 2×2: Yates' X² is always reported; it becomes `statistic` and `p` only when
 *   `options.continuity === 'yates'`. Effect sizes and residuals always use the uncorrected X².
 * - Adjusted residuals (Haberman 1973, Biometrics 29, 205–220):
 *   (O − E)/√(E(1 − rᵢ/N)(1 − cⱼ/N)), flagged beyond the Bonferroni value z₁₋α/(2rc).
 * - Cramér's V = √(X²/(N(k − 1))), k = min(r, c), with Bergsma's (2013) correction and an interval
 *   from inverting the noncentral chi-square (see `cramersVInterval`); Cohen's (1988) w = √(X²/N);
 *   for 2×2 the signed φ = (ad − bc)/√(r₁r₂c₁c₂).
 * - Row proportions (share of each row in each column) and column proportions (share of each column
 *   in each row), both indexed [row][column], with Wilson score intervals.
 *
 * The caller has dropped all-zero rows and columns and checked the counts; a ragged matrix, a
 * negative or non-finite count, a zero margin or fewer than 2 rows or columns are programmer errors
 * and throw. `mergeProposal` is left for the caller (see `proposeMerge`), which knows the labels.
 *
 * @param observed - counts, observed[row][column], at least 2×2
 * @param options - significance and confidence levels, continuity policy (defaults: DEFAULT_TEST_OPTIONS)
 * @returns the full result
 * @example testIndependence([[12, 5], [7, 14]]).pearson.statistic // ≈ 5.216
 */
export function testIndependence(observed: number[][], options: Partial<TestOptions> = {}): IndependenceResult {
  const settings = { ...DEFAULT_TEST_OPTIONS, ...options };
  const { n, rowTotals, columnTotals, expected } = tableMargins(observed);
  const rows = observed.length;
  const columns = observed[0].length;
  if (rows < 2 || columns < 2) throw new RangeError(`testIndependence: needs at least 2 rows and 2 columns (got ${rows}×${columns})`);
  const df = (rows - 1) * (columns - 1);
  const isTwoByTwo = df === 1;

  const contributions = mapCells(observed, (count, i, j) => (count - expected[i][j]) ** 2 / expected[i][j]);
  const pearsonStatistic = contributions.flat().reduce((sum, value) => sum + value, 0);
  const pearson = { statistic: pearsonStatistic, ...chiSquareUpperTail(pearsonStatistic, df) };
  const yates = isTwoByTwo ? withTail(yatesStatistic(observed), df) : undefined;
  const continuityCorrected = yates !== undefined && settings.continuity === 'yates';
  const reported = continuityCorrected ? yates : pearson;

  const pearsonResiduals = mapCells(observed, (count, i, j) => (count - expected[i][j]) / Math.sqrt(expected[i][j]));
  const adjustedResiduals = mapCells(observed, (count, i, j) => {
    const variance = expected[i][j] * (1 - rowTotals[i] / n) * (1 - columnTotals[j] / n);
    return (count - expected[i][j]) / Math.sqrt(variance);
  });
  const residualCriticalValue = bonferroniCriticalValue(settings.alpha, rows * columns);
  const flaggedCells: AdjustedResidualFlag[] = [];
  adjustedResiduals.forEach((values, row) => values.forEach((residual, column) => {
    if (Math.abs(residual) > residualCriticalValue) flaggedCells.push({ row, column, residual });
  }));
  flaggedCells.sort((x, y) => Math.abs(y.residual) - Math.abs(x.residual));

  const reciprocalSum = (totals: number[]) => totals.reduce((sum, total) => sum + 1 / total, 0);
  const williamsQ = 1 + ((n * reciprocalSum(rowTotals) - 1) * (n * reciprocalSum(columnTotals) - 1)) / (6 * n * df);
  const smallerDimension = Math.min(rows, columns);
  const [[a, b], [c, d]] = observed;

  return {
    test: 'independence',
    n,
    df,
    rows,
    columns,
    statistic: reported.statistic,
    p: reported.p,
    log10p: reported.log10p,
    pearson,
    ...(yates ? { yates } : {}),
    continuityCorrected,
    expected,
    contributions,
    contributionShares: contributions.map((values) => values.map((value) => (pearsonStatistic > 0 ? value / pearsonStatistic : 0))),
    pearsonResiduals,
    adjustedResiduals,
    residualCriticalValue,
    flaggedCells,
    g: gTest(observed.flat(), expected.flat(), df, williamsQ),
    effect: {
      cramersV: Math.min(1, Math.sqrt(pearsonStatistic / (n * (smallerDimension - 1)))),
      cramersVCorrected: bergsmaCorrectedV(pearsonStatistic, n, rows, columns),
      cohensW: Math.sqrt(pearsonStatistic / n),
      ...(isTwoByTwo ? { phi: (a * d - b * c) / Math.sqrt(rowTotals[0] * rowTotals[1] * columnTotals[0] * columnTotals[1]) } : {}),
      cramersVInterval: cramersVInterval(pearsonStatistic, df, n, smallerDimension, settings.confidenceLevel),
    },
    ...(isTwoByTwo ? { twoByTwo: twoByTwoMeasures(observed, settings.confidenceLevel) } : {}),
    rowProportions: mapCells(observed, (count, i) => wilsonInterval(count, rowTotals[i], settings.confidenceLevel)),
    columnProportions: mapCells(observed, (count, _i, j) => wilsonInterval(count, columnTotals[j], settings.confidenceLevel)),
    rowTotals,
    columnTotals,
    validity: checkCochranRule(expected),
  };
}

function mapCells<T>(observed: number[][], f: (count: number, row: number, column: number) => T): T[][] {
  return observed.map((values, i) => values.map((count, j) => f(count, i, j)));
}

function withTail(statistic: number, df: number) {
  return { statistic, ...chiSquareUpperTail(statistic, df) };
}
