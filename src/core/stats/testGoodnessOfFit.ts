import { chiSquareUpperTail } from '../special/chiSquareUpperTail';
import { fail, ok, type Result } from '../types';
import { bonferroniCriticalValue } from './bonferroniCriticalValue';
import { checkCochranRule } from './checkCochranRule';
import type { FitRequest, GoodnessOfFitOptions } from './fitRequest';
import { gTest } from './gTest';
import { hypothesisProportions } from './hypothesisProportions';
import { proposeFitMerge } from './proposeFitMerge';
import { DEFAULT_TEST_OPTIONS, type GoodnessOfFitResult } from './types';
import { wilsonInterval } from './wilsonInterval';

/**
 * Pearson's chi-square goodness-of-fit test of one row or column of counts against a hypothesis:
 * equal shares, a ratio, proportions, given expected counts, or a Poisson or binomial distribution
 * fitted to the counts (Pearson 1900; Fisher 1924 for the degrees of freedom; Agresti 2013,
 * Categorical Data Analysis 3rd ed., §1.5).
 *
 * Intuition: the hypothesis says what share of N each category should get; X² adds up how far each
 * count is from its share, measured against the share's own size.
 *
 * ## Method
 * - E = Nπ; X² = Σ(O − E)²/E with df = k − 1 − (parameters estimated).
 * - G² = 2 Σ O ln(O/E), also divided by Williams' q = 1 + (k² − 1)/(6Nν), ν = df (Williams 1976,
 *   Biometrika 63, 33–37, in the form given by Sokal & Rohlf, Biometry — from memory); with no
 *   estimated parameter it is q = 1 + (k + 1)/(6N).
 * - Standardized residuals (O − E)/√(E(1 − π)) (Agresti 2013, §1.5.5 — from memory), flagged beyond
 *   the Bonferroni value z₁₋α/(2k). For fitted distributions they ignore the estimation, so they are
 *   slightly conservative.
 * - Cohen's (1988) w = √(X²/N); observed shares with Wilson intervals; Cochran's rule on the expected
 *   counts; when it fails and labels are given, a merge proposal (`proposeFitMerge`).
 *
 * Categories are taken to run down a column unless `options.categoriesAlong` is 'columns'; that sets
 * the cell positions in `validity` and the shape of a merged table.
 *
 * @param observed - counts, one per category (whole, non-negative; the caller has checked them)
 * @param hypothesis - what to compare with
 * @param options - levels, and labels/ordering for a merge proposal
 * @returns the result, or an issue: fewer than 2 categories, no counts, a hypothesis that does not
 *   match the counts, or too few categories left after estimating a parameter (df < 1)
 * @example testGoodnessOfFit([20, 30, 50], { kind: 'equal' }) // ok, X² = 14, df = 2
 */
export function testGoodnessOfFit(
  observed: number[],
  hypothesis: FitRequest,
  options: Partial<GoodnessOfFitOptions> = {},
): Result<GoodnessOfFitResult> {
  const settings = { ...DEFAULT_TEST_OPTIONS, ...options };
  const k = observed.length;
  if (observed.some((count) => !(Number.isFinite(count) && count >= 0))) {
    throw new RangeError(`testGoodnessOfFit: counts must be finite and non-negative (got ${observed.join(', ')})`);
  }
  if (k < 2) {
    return fail({ code: 'too-few-categories', message: `A goodness-of-fit test needs at least 2 categories; there ${k === 1 ? 'is 1' : 'are none'}.` });
  }
  const n = observed.reduce((sum, count) => sum + count, 0);
  if (n === 0) return fail({ code: 'all-zero-table', message: 'Every count is 0, so there is nothing to test.' });
  const implied = hypothesisProportions(observed, hypothesis);
  if (!implied.ok) return implied;
  const { proportions, estimatedParameters } = implied.value;
  const df = k - 1 - estimatedParameters;
  if (df < 1) {
    return fail({
      code: 'too-few-categories',
      message: `Fitting the distribution estimates ${estimatedParameters} parameter${estimatedParameters === 1 ? '' : 's'} from the counts, which leaves ${df} degrees of freedom with ${k} categories; the test needs at least ${estimatedParameters + 2} categories.`,
    });
  }
  const expected = proportions.map((share) => share * n);
  const emptyCategory = expected.findIndex((value) => !(value > 0));
  const contributions = observed.map((count, i) => (count - expected[i]) ** 2 / expected[i]);
  const statistic = contributions.reduce((sum, value) => sum + value, 0);
  if (emptyCategory >= 0 || !Number.isFinite(statistic)) {
    const where = emptyCategory >= 0 ? emptyCategory : contributions.findIndex((value) => !Number.isFinite(value));
    return fail({
      code: 'sparse-fit',
      message: `Under the hypothesis category ${where + 1} would expect essentially no counts (${expected[where].toPrecision(3)}), so the chi-square test cannot be used; merge it with its neighbour or use an exact test.`,
    });
  }
  const residualCriticalValue = bonferroniCriticalValue(settings.alpha, k);
  const standardizedResiduals = observed.map((count, i) => (count - expected[i]) / Math.sqrt(expected[i] * (1 - proportions[i])));
  const flaggedCells = standardizedResiduals
    .map((residual, index) => ({ index, residual }))
    .filter((cell) => Math.abs(cell.residual) > residualCriticalValue)
    .sort((x, y) => Math.abs(y.residual) - Math.abs(x.residual));
  const along = settings.categoriesAlong ?? 'rows';
  const validity = checkCochranRule(along === 'rows' ? expected.map((value) => [value]) : [expected]);
  const result: GoodnessOfFitResult = {
    test: 'goodness-of-fit',
    n,
    df,
    categories: k,
    estimatedParameters,
    hypothesis: implied.value.hypothesis,
    statistic,
    ...chiSquareUpperTail(statistic, df),
    expectedProportions: proportions,
    expected,
    contributions,
    contributionShares: contributions.map((value) => (statistic > 0 ? value / statistic : 0)),
    pearsonResiduals: observed.map((count, i) => (count - expected[i]) / Math.sqrt(expected[i])),
    standardizedResiduals,
    residualCriticalValue,
    flaggedCells,
    g: gTest(observed, expected, df, 1 + (k * k - 1) / (6 * n * df)),
    cohensW: Math.sqrt(statistic / n),
    proportions: observed.map((count) => wilsonInterval(count, n, settings.confidenceLevel)),
    validity,
  };
  if (!validity.ok && settings.labels && settings.labels.length === k) {
    const ordered = hypothesis.kind === 'poisson' || hypothesis.kind === 'binomial' || settings.ordered === true;
    const merge = proposeFitMerge(observed, expected, estimatedParameters, settings.labels, { ordered, categoriesAlong: along });
    if (merge) result.mergeProposal = merge;
  }
  return ok(result);
}
