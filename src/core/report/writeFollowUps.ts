import type { AnalyzeOptions, ReportOptions } from '../analysis';
import type { FollowUps, PairwiseFollowUp, TrendFollowUp, LinearByLinearFollowUp } from '../designs/followUps';
import { joinPhrases, listLabels, symbol } from './describe';
import { formatFixed, formatNoLeadingZero } from './formatNumber';
import { pValuePhrase } from './statisticPhrase';

/** Non-differing pairs named one by one before the rest are counted instead. */
const MAX_NAMED_SIMILAR_PAIRS = 3;

/** How the adjustment methods are named in prose and in the panel. */
export const ADJUSTMENT_NAMES = { holm: 'Holm', bonferroni: 'Bonferroni' } as const;

/**
 * "Line C differs from Line A and Line B; Line A and Line B do not differ." Each group with
 * differences is named once, the one with most differences first, so the sentence stays short.
 */
export function pairwiseSentence(pairwise: PairwiseFollowUp, report: Pick<ReportOptions, 'markup'>): string {
  const count = pairwise.comparisons.length;
  const noun = pairwise.groupsAlong === 'rows' ? 'rows' : 'columns';
  const exactPairs = pairwise.comparisons.filter((pair) => pair.pMethod === 'exact').length;
  const exactNote = exactPairs > 0 ? `; ${exactPairs} sparse ${exactPairs === 1 ? 'pair' : 'pairs'} tested exactly` : '';
  const intro = `Compared two at a time (${count} pairs of ${noun}, ${ADJUSTMENT_NAMES[pairwise.method]}-adjusted p-values keeping the overall error rate at ${formatNoLeadingZero(pairwise.alpha, 2)}${exactNote})`;
  if (pairwise.differing.length === 0) {
    return `${intro}, no single pair differs clearly: the overall difference is spread over several groups or too small to pin down pair by pair.`;
  }
  const partners = new Map<string, Set<string>>();
  for (const pair of pairwise.differing) {
    if (!partners.has(pair.firstLabel)) partners.set(pair.firstLabel, new Set());
    if (!partners.has(pair.secondLabel)) partners.set(pair.secondLabel, new Set());
    partners.get(pair.firstLabel)!.add(pair.secondLabel);
    partners.get(pair.secondLabel)!.add(pair.firstLabel);
  }
  const phrases: string[] = [];
  const said = new Set<string>();
  const byMostDifferences = [...partners.keys()].sort((x, y) => partners.get(y)!.size - partners.get(x)!.size);
  for (const group of byMostDifferences) {
    const others = [...partners.get(group)!].filter((other) => !said.has(pairKey(group, other)));
    if (others.length === 0) continue;
    for (const other of others) said.add(pairKey(group, other));
    phrases.push(`${group} differs from ${listLabels(others, noun)}`);
  }
  const similar = pairwise.comparisons.filter((pair) => !pair.differs);
  // One pair reads "A and B"; several read as "the pairs A–B, A–C and B–C", which stays unambiguous.
  const similarText = similar.length === 0
    ? ''
    : similar.length === 1
      ? `; ${similar[0].firstLabel} and ${similar[0].secondLabel} do not differ clearly`
      : similar.length <= MAX_NAMED_SIMILAR_PAIRS
        ? `; the pairs ${joinPhrases(similar.map((pair) => `${pair.firstLabel}–${pair.secondLabel}`))} do not differ clearly`
        : `; the other ${similar.length} pairs do not differ clearly`;
  const strongest = pairwise.comparisons.filter((pair) => pair.differs).sort((x, y) => x.adjustedP - y.adjustedP)[0];
  const strongestText = ` (strongest: ${strongest.firstLabel} vs ${strongest.secondLabel}, adjusted ${pValuePhrase(strongest.adjustedP, report)})`;
  return `${intro}, ${phrases.join('; ')}${similarText}${strongestText}.`;
}

function pairKey(a: string, b: string): string {
  return a < b ? `${a}\u0000${b}` : `${b}\u0000${a}`;
}

function scoresText(scores: number[], given: boolean): string {
  const list = scores.map((score) => formatFixed(score, Number.isInteger(score) ? 0 : 2)).join(', ');
  return given ? `scores ${list}` : `equally spaced scores ${list}`;
}

/** "Because the columns are ordered (…), a Cochran–Armitage test for trend …" */
export function trendSentence(trend: TrendFollowUp, report: Pick<AnalyzeOptions, 'decimals' | 'markup' | 'alpha'>): string {
  const Z = symbol('Z', report.markup);
  const dimension = trend.orderedAlong === 'columns' ? 'columns' : 'rows';
  const direction = trend.z > 0 ? 'rises' : 'falls';
  const reading = trend.p.p < report.alpha
    ? `the share of "${trend.outcomeLabel}" ${direction} along the order`
    : `no steady rise or fall in the share of "${trend.outcomeLabel}" is clear`;
  return `Because the ${dimension} are ordered (${listLabels(trend.orderedLabels, dimension)}), a Cochran–Armitage test for trend with ${scoresText(trend.scores, trend.scoresGiven)} ` +
    `gives ${Z} = ${formatFixed(trend.z, report.decimals)}, ${pValuePhrase(trend.p.p, report)}: ${reading}. ` +
    'The trend test asks a narrower question than the overall test and is more sensitive to a steady change; it says nothing about a rise followed by a fall.';
}

/** "Because both rows and columns are ordered, the linear-by-linear association test …" */
export function linearByLinearSentence(association: LinearByLinearFollowUp, report: Pick<AnalyzeOptions, 'decimals' | 'markup' | 'alpha'>): string {
  const N = symbol('N', report.markup);
  const r = symbol('r', report.markup);
  const reading = association.p.p < report.alpha
    ? association.correlation > 0 ? 'later rows go with later columns' : 'later rows go with earlier columns'
    : 'no steady linear relation between the two orders is clear';
  const given = association.scoresGiven ? 'the given scores' : 'equally spaced scores';
  return `Because both rows and columns are ordered, the linear-by-linear association test with ${given} gives ` +
    `M²(1, ${N} = ${association.n.toLocaleString('en-US')}) = ${formatFixed(association.statistic, report.decimals)}, ${pValuePhrase(association.p.p, report)}, ` +
    `${r} = ${formatNoLeadingZero(association.correlation, report.decimals)}: ${reading}.`;
}

/** The follow-up sentences that belong in an independence write-up. Pairwise results are told only after a significant overall test. */
export function followUpSentences(followUps: FollowUps | undefined, overallSignificant: boolean, report: Pick<AnalyzeOptions, 'decimals' | 'markup' | 'alpha'>): string[] {
  if (!followUps) return [];
  const sentences: string[] = [];
  if (followUps.pairwise && overallSignificant) sentences.push(pairwiseSentence(followUps.pairwise, report));
  if (followUps.trend) sentences.push(trendSentence(followUps.trend, report));
  if (followUps.linearByLinear) sentences.push(linearByLinearSentence(followUps.linearByLinear, report));
  return sentences;
}
