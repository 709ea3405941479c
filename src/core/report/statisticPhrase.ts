import type { ReportOptions } from '../analysis';
import type { ChosenPValue } from '../exact/choosePValue';
import { formatFixed, formatNoLeadingZero, formatPValue } from './formatNumber';
import { symbol } from './describe';

/**
 * "p = .010" with p in the report's markup (italic in Markdown); `name` names the p, e.g. "mid-p"
 * or "exact conditional p" (its final "p" is set the same way).
 */
export function pValuePhrase(p: number, report: Pick<ReportOptions, 'markup'>, name = 'p'): string {
  return formatPValue(p).replace(/^p/, name.replace(/p$/, symbol('p', report.markup)));
}

/** The statistic without its p: "χ²(3, N = 412) = 11.27". */
export function chiSquareValuePhrase(statistic: number, df: number, n: number, report: Pick<ReportOptions, 'decimals' | 'markup'>, name = 'χ²'): string {
  return `${name}(${df}, ${symbol('N', report.markup)} = ${n.toLocaleString('en-US')}) = ${formatFixed(statistic, report.decimals)}`;
}

/**
 * The result in standard reporting form: "χ²(3, N = 412) = 11.27, p = .010".
 * Standard notation for the chi-square family (common practice).
 */
export function chiSquarePhrase(
  statistic: number,
  df: number,
  n: number,
  p: number,
  report: Pick<ReportOptions, 'decimals' | 'markup'>,
  name = 'χ²',
): string {
  return `${chiSquareValuePhrase(statistic, df, n, report, name)}, ${pValuePhrase(p, report)}`;
}

/** "Cramér's V = .15, 95% CI [.06, .20]" */
export function intervalPhrase(
  name: string,
  estimate: number,
  lower: number,
  upper: number,
  level: number,
  decimals: number,
  bounded: boolean,
): string {
  const format = bounded ? formatNoLeadingZero : formatFixed;
  return `${name} = ${format(estimate, decimals)}, ${Math.round(level * 100)}% CI [${format(lower, decimals)}, ${format(upper, decimals)}]`;
}

/**
 * The headline statistic with the p that leads: the asymptotic one, or the exact / Monte Carlo one
 * named as such ("χ²(6, N = 50) = 16.17, exact p = .012").
 */
export function leadingChiSquarePhrase(
  statistic: number,
  df: number,
  n: number,
  asymptoticP: number,
  exact: ChosenPValue | undefined,
  report: Pick<ReportOptions, 'decimals' | 'markup'>,
  name = 'χ²',
): string {
  if (!exact) return chiSquarePhrase(statistic, df, n, asymptoticP, report, name);
  const simulated = exact.replicates !== undefined;
  const pText = pValuePhrase(exact.p, report);
  const interval = simulated && exact.interval
    ? ` (${Math.round(exact.interval.level * 100)}% simulation interval ${formatNoLeadingZero(exact.interval.lower, 3)} to ${formatNoLeadingZero(exact.interval.upper, 3)})`
    : '';
  return `${chiSquareValuePhrase(statistic, df, n, report, name)}, ${simulated ? 'Monte Carlo' : 'exact'} ${pText}${interval}`;
}
