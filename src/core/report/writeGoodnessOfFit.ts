import type { AnalyzeOptions, ReportOptions } from '../analysis';
import type { ChosenPValue } from '../exact/choosePValue';
import type { FitHypothesis, GoodnessOfFitResult } from '../stats/types';
import type { CountTable } from '../types';
import { cautionSentences, validitySentences } from './cautions';
import { describeEffectSize, joinPhrases, listLabels, symbol } from './describe';
import { formatFixed, formatNoLeadingZero, formatSigned } from './formatNumber';
import { leadingChiSquarePhrase } from './statisticPhrase';

const MAX_DRIVING_CATEGORIES = 3;

/** What the counts were compared with, as a noun phrase. */
export function describeHypothesis(hypothesis: FitHypothesis, decimals: number): string {
  switch (hypothesis.kind) {
    case 'equal':
      return 'equal proportions';
    case 'ratio':
      return `the ratio ${hypothesis.text}`;
    case 'proportions':
      return `the proportions ${hypothesis.text}`;
    case 'expected-counts':
      return hypothesis.rescaled
        ? 'the expected counts given in the table (rescaled to the observed total)'
        : 'the expected counts given in the table';
    case 'poisson':
      return `a Poisson distribution with its mean estimated from the data (${formatFixed(hypothesis.mean, decimals)}${hypothesis.openEnded ? ', allowing for the open-ended last category' : ''})`;
    case 'binomial':
      return `a binomial distribution with ${hypothesis.trials} trials and its probability estimated from the data (${formatNoLeadingZero(hypothesis.probability, Math.max(decimals, 3))})`;
  }
}

function labelsOf(table: CountTable): string[] {
  return table.rowLabels.length === 1 ? table.columnLabels : table.rowLabels;
}

/** "χ²(3, N = 556) = 0.47, p = .93, w = .03" */
export function goodnessOfFitHeadline(result: GoodnessOfFitResult, report: ReportOptions, exact?: ChosenPValue): string {
  return `${leadingChiSquarePhrase(result.statistic, result.df, result.n, result.p, exact, report)}, ${symbol('w', report.markup)} = ${formatNoLeadingZero(result.cohensW, report.decimals)}`;
}

function drivingCategories(result: GoodnessOfFitResult, labels: string[], observed: number[], report: ReportOptions): string {
  const critical = formatFixed(result.residualCriticalValue, 2);
  if (result.flaggedCells.length === 0) {
    return `No single category stands out after a Bonferroni adjustment (standardized residuals within ±${critical}).`;
  }
  const phrases = result.flaggedCells.slice(0, MAX_DRIVING_CATEGORIES).map((cell) => {
    const i = cell.index;
    return `${labels[i]} (${observed[i].toLocaleString('en-US')} observed, ${formatFixed(result.expected[i], 1)} expected; standardized residual ${formatSigned(cell.residual, report.decimals)})`;
  });
  return `The departure comes from ${joinPhrases(phrases)}, beyond the Bonferroni-adjusted critical value of ±${critical}.`;
}

/** The plain-language paragraph for a goodness-of-fit test. */
export function writeGoodnessOfFit(
  result: GoodnessOfFitResult,
  table: CountTable,
  report: AnalyzeOptions,
  exact?: ChosenPValue,
  exactNote?: string,
): string {
  const headline = goodnessOfFitHeadline(result, report, exact);
  if (report.style === 'line') {
    return `${headline}; Cochran's rule ${result.validity.ok ? 'met' : 'not met'}.`;
  }
  const labels = labelsOf(table);
  const hypothesis = describeHypothesis(result.hypothesis, report.decimals);
  const significant = (exact?.p ?? result.p) < report.alpha;
  const parts: string[] = [];
  parts.push(`We tested whether the counts in ${listLabels(labels, 'categories')} (${symbol('N', report.markup)} = ${result.n.toLocaleString('en-US')} observations) fit ${hypothesis}.`);
  if (result.estimatedParameters > 0) {
    parts.push(`Because ${result.estimatedParameters === 1 ? 'one parameter was' : `${result.estimatedParameters} parameters were`} estimated from the same counts, the degrees of freedom are ${result.df} rather than ${result.categories - 1}.`);
  }
  parts.push(significant
    ? `They do not: ${headline}.`
    : `The counts are consistent with it: ${headline}.`);
  if (significant) parts.push(drivingCategories(result, labels, table.observed.flat(), report));
  parts.push(`The departure from the expected pattern is ${describeEffectSize(result.cohensW)}.`);
  parts.push(validitySentences(result.validity, result.mergeProposal, result.n, report, exact, exactNote));
  parts.push(cautionSentences('goodness-of-fit'));
  return parts.join(' ');
}
