import type { AnalyzeOptions, PairedAnalysis } from '../analysis';
import type { CountTable } from '../types';
import { cautionSentences } from './cautions';
import { symbol } from './describe';
import { formatFixed, formatNoLeadingZero } from './formatNumber';
import { chiSquarePhrase, pValuePhrase } from './statisticPhrase';

/** "+.11", "−.04", ".00": a signed share without the leading zero. */
function formatSignedShare(value: number, decimals: number): string {
  const text = formatNoLeadingZero(value, decimals);
  return value > 0 && Number(value.toFixed(decimals)) !== 0 ? `+${text}` : text;
}

/** How each version of McNemar's p is named in prose and in the panel. */
export const PAIRED_P_NAMES = { 'mid-p': 'mid-p', exact: 'exact conditional p', asymptotic: 'asymptotic p' } as const;

/** The lead result in one phrase: "McNemar's test, mid-p = .041 (b = 5, c = 15)". */
export function pairedHeadline(paired: PairedAnalysis, report: Pick<AnalyzeOptions, 'markup'>): string {
  const value = pValuePhrase(paired.leading.p, report, PAIRED_P_NAMES[paired.leading.method]);
  return `McNemar's test, ${value} (${paired.discordant.b} and ${paired.discordant.c} discordant pairs)`;
}

/**
 * The paragraph for a paired 2×2 (before/after on the same units): which pairs carry information,
 * the leading p and the other two versions beside it, and the change in the share with its interval.
 */
export function writePaired(paired: PairedAnalysis, table: CountTable, report: AnalyzeOptions): string {
  const headline = pairedHeadline(paired, report);
  const significant = paired.leading.p < report.alpha;
  if (report.style === 'line') return `${headline}; change in the share of ${table.rowLabels[0]} ${formatSignedShare(-paired.difference.newcombe.estimate, report.decimals)}.`;
  const [first, second] = table.rowLabels;
  const [firstAfter, secondAfter] = table.columnLabels;
  const { b, c } = paired.discordant;
  const n = paired.n;
  const N = symbol('N', report.markup);
  const P = symbol('p', report.markup);
  const parts: string[] = [];
  parts.push(
    `We treated the table as paired: each of the ${N} = ${n.toLocaleString('en-US')} units was classified twice, first in the rows and then in the columns, ` +
    `so only the ${(b + c).toLocaleString('en-US')} units whose answer changed carry information about a change: ` +
    `${b.toLocaleString('en-US')} went from ${first} to ${secondAfter} and ${c.toLocaleString('en-US')} from ${second} to ${firstAfter}.`,
  );
  parts.push(significant
    ? `A change this one-sided is unlikely by chance: ${headline}.`
    : `The changes are not clearly one-sided: ${headline}. This does not show that nothing changed, only that these pairs cannot tell.`);
  const others: string[] = [];
  if (paired.leading.method !== 'mid-p') others.push(pValuePhrase(paired.midP.p, report, 'mid-p'));
  if (paired.leading.method !== 'exact') others.push(pValuePhrase(paired.exact.p, report, 'exact conditional p'));
  if (paired.leading.method !== 'asymptotic') {
    others.push(`asymptotic ${chiSquarePhrase(paired.chiSquare.statistic, 1, b + c, paired.chiSquare.p, report)} (over discordant pairs)`);
  }
  parts.push(`The other versions of the test give ${others.join('; ')}.`);
  const difference = paired.difference.newcombe;
  const level = `${Math.round(difference.level * 100)}% CI`;
  const firstShare = (table.observed[0][0] + table.observed[0][1]) / n;
  const secondShare = (table.observed[0][0] + table.observed[1][0]) / n;
  parts.push(
    `The share answering ${first} was ${formatFixed(firstShare * 100, 1)}% at the first measurement and ${formatFixed(secondShare * 100, 1)}%${firstAfter.trim().toLowerCase() === first.trim().toLowerCase() ? '' : ` (${firstAfter})`} at the second: ` +
    // Said as second minus first, the direction people read a before/after change in.
    `a change of ${formatSignedShare(-difference.estimate, report.decimals)} (${level} ${formatSignedShare(-difference.upper, report.decimals)} to ${formatSignedShare(-difference.lower, report.decimals)}, Newcombe's interval for paired proportions).`,
  );
  if (b + c < 10) {
    parts.push(`With only ${b + c} discordant pairs the test has little power; the exact and mid-${P} versions remain valid, the asymptotic one does not.`);
  }
  parts.push(cautionSentences('paired'));
  return parts.join(' ');
}
