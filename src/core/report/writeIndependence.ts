import type { AnalyzeOptions, ReportOptions } from '../analysis';
import type { ChosenPValue } from '../exact/choosePValue';
import type { IndependenceResult } from '../stats/types';
import type { CountTable } from '../types';
import { cautionSentences, validitySentences } from './cautions';
import { describeEffectSize, joinPhrases, listLabels, symbol } from './describe';
import { formatFixed, formatNoLeadingZero, formatSigned } from './formatNumber';
import { chiSquarePhrase, intervalPhrase, leadingChiSquarePhrase } from './statisticPhrase';

/** The most cells a write-up names as driving the result; the panel lists them all. */
const MAX_DRIVING_CELLS = 3;

/** "χ²(6, N = 412) = 18.40, p = .005, Cramér's V = .15, 95% CI [.06, .20]" */
export function independenceHeadline(result: IndependenceResult, report: ReportOptions, exact?: ChosenPValue): string {
  const v = result.effect.cramersVInterval;
  const name = result.continuityCorrected ? 'χ²ᵧ' : 'χ²';
  return `${leadingChiSquarePhrase(result.statistic, result.df, result.n, result.p, exact, report, name)}, ` +
    intervalPhrase(`Cramér's ${symbol('V', report.markup)}`, result.effect.cramersV, v.lower, v.upper, v.level, report.decimals, true);
}

function drivingCells(result: IndependenceResult, table: CountTable, report: ReportOptions): string {
  const critical = formatFixed(result.residualCriticalValue, 2);
  if (result.flaggedCells.length === 0) {
    return `No single cell stands out after a Bonferroni adjustment over the ${result.rows * result.columns} cells (adjusted residuals within ±${critical}).`;
  }
  const phrases = result.flaggedCells.slice(0, MAX_DRIVING_CELLS).map((cell) => {
    const direction = cell.residual > 0 ? 'more' : 'fewer';
    return `${table.rowLabels[cell.row]} × ${table.columnLabels[cell.column]} (${direction} than expected, adjusted residual ${formatSigned(cell.residual, report.decimals)})`;
  });
  const more = result.flaggedCells.length > MAX_DRIVING_CELLS ? `, among ${result.flaggedCells.length} cells` : '';
  return `The cells that drive the result are ${joinPhrases(phrases)}${more}, beyond the Bonferroni-adjusted critical value of ±${critical}.`;
}

function twoByTwoSentence(result: IndependenceResult, table: CountTable, report: ReportOptions): string {
  const m = result.twoByTwo;
  if (!m) return '';
  const d = report.decimals;
  const [first, second] = table.rowLabels;
  const outcome = table.columnLabels[0];
  const p1 = result.rowProportions[0][0].estimate;
  const p2 = result.rowProportions[1][0].estimate;
  const correction = m.zeroCellCorrection ? ' (ratios computed with 0.5 added to each cell, because a cell is zero)' : '';
  const level = `${Math.round(m.riskDifference.level * 100)}% CI`;
  const ci = (i: { lower: number; upper: number }, format: (x: number, d: number) => string) => `${level} ${format(i.lower, d)} to ${format(i.upper, d)}`;
  return `The share in "${outcome}" was ${formatFixed(p1 * 100, 1)}% for ${first} and ${formatFixed(p2 * 100, 1)}% for ${second}: ` +
    `a difference of ${formatNoLeadingZero(m.riskDifference.estimate, d)} (${ci(m.riskDifference, formatNoLeadingZero)}), ` +
    `a relative risk of ${formatFixed(m.relativeRisk.estimate, d)} (${ci(m.relativeRisk, formatFixed)}) ` +
    `and an odds ratio of ${formatFixed(m.oddsRatio.estimate, d)} (${ci(m.oddsRatio, formatFixed)})${correction}.`;
}

function continuitySentence(result: IndependenceResult, report: ReportOptions): string {
  if (!result.yates) return '';
  const phrase = chiSquarePhrase(result.yates.statistic, result.df, result.n, result.yates.p, report);
  return result.continuityCorrected
    ? `This uses Yates' continuity correction; without it, ${chiSquarePhrase(result.pearson.statistic, result.df, result.n, result.pearson.p, report)}.`
    : `With Yates' continuity correction, which is conservative, ${phrase}.`;
}

/** The plain-language paragraph for an r×c test of independence or homogeneity. */
export function writeIndependence(
  result: IndependenceResult,
  table: CountTable,
  report: AnalyzeOptions,
  exact?: ChosenPValue,
  exactNote?: string,
  followUps: (significant: boolean) => string[] = () => [],
): string {
  const headline = independenceHeadline(result, report, exact);
  const significant = (exact?.p ?? result.p) < report.alpha;
  if (report.style === 'line') {
    const validity = result.validity.ok ? 'Cochran\'s rule met' : 'Cochran\'s rule not met';
    return `${headline}; ${validity}.`;
  }
  const rows = listLabels(table.rowLabels, 'rows');
  const columns = listLabels(table.columnLabels, 'columns');
  const w = symbol('w', report.markup);
  const parts: string[] = [];
  parts.push(`We tested whether the split across ${columns} differs between ${rows} (${symbol('N', report.markup)} = ${result.n.toLocaleString('en-US')} observations).`);
  parts.push(significant
    ? `It does: ${headline}.`
    : `The counts show no clear difference: ${headline}. This does not show that the groups are the same, only that these counts cannot tell them apart.`);
  if (significant) parts.push(drivingCells(result, table, report));
  parts.push(`The association is ${describeEffectSize(result.effect.cohensW)} (${w} = ${formatNoLeadingZero(result.effect.cohensW, report.decimals)}).`);
  const twoByTwo = twoByTwoSentence(result, table, report);
  if (twoByTwo) parts.push(twoByTwo);
  const continuity = continuitySentence(result, report);
  if (continuity) parts.push(continuity);
  parts.push(validitySentences(result.validity, result.mergeProposal, result.n, report, exact, exactNote));
  parts.push(...followUps(significant));
  parts.push(cautionSentences('independence'));
  return parts.join(' ');
}
