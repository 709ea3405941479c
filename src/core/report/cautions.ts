import type { ReportOptions } from '../analysis';
import type { ChosenPValue } from '../exact/choosePValue';
import type { MergeProposal, ValidityCheck } from '../types';
import { formatFixed, formatPercent } from './formatNumber';
import { joinPhrases } from './describe';
import { chiSquarePhrase } from './statisticPhrase';

/**
 * What every chi-square write-up must say about what the test does not show (house rule):
 * association is not cause, observations must be independent, counts not percentages, and
 * health or safety decisions go through validated procedures.
 */
export function cautionSentences(kind: 'independence' | 'goodness-of-fit' | 'paired' | 'stratified'): string {
  const first = {
    'independence': 'An association in counts is not evidence of cause.',
    'goodness-of-fit': 'A good fit does not prove the expected pattern holds; it only fails to contradict it.',
    'paired': 'A change between the two measurements is not by itself evidence of what caused it: learning, the season or the order of measurement can produce one.',
    'stratified': 'Stratifying adjusts only for the variable that defines the strata; other differences between the groups remain, and an association is not evidence of cause.',
  }[kind];
  const unit = kind === 'paired'
    ? 'The test assumes each unit was measured twice and counted once, independently of the other units, and it applies to counts, not percentages. '
    : 'The test assumes each observation was counted once, in one cell, independently of the others, and it applies to counts, not percentages. ';
  return `${first} ${unit}` +
    'For decisions about health or safety, follow your organisation\'s validated procedures and consult a qualified statistician.';
}

/** Cochran's rule in words, with what was done about a failure. */
export function validitySentences(
  validity: ValidityCheck,
  merge: MergeProposal | undefined,
  n: number,
  report: Pick<ReportOptions, 'decimals' | 'markup'>,
  exact?: ChosenPValue,
  exactNote?: string,
): string {
  const smallest = formatFixed(validity.minExpected, validity.minExpected < 10 ? 1 : 0);
  const exactSentence = exact ? ` ${exact.reason}` : '';
  if (validity.ok) {
    if (validity.cellsBelow5 === 0) {
      return `All expected counts were at least 5 (smallest ${smallest}), so the chi-square approximation is adequate by Cochran's rule.${exactSentence}`;
    }
    return `${validity.cellsBelow5} of ${validity.cellCount} expected counts ${validity.cellsBelow5 === 1 ? 'was' : 'were'} below 5 (smallest ${smallest}), within Cochran's rule (none below 1, at most 20% below 5), so the chi-square approximation is adequate.${exactSentence}`;
  }
  let text: string;
  if (exact) {
    text = `${exact.reason} Cochran's rule (no expected count below 1, at most 20% below 5) is not met here (smallest ${smallest}), so the chi-square p-value is not the one to report.`;
  } else {
    const parts = [`${validity.cellsBelow5} of ${validity.cellCount} cells (${formatPercent(validity.shareBelow5)}) had expected counts below 5`];
    if (validity.cellsBelow1 > 0) parts.push(`${validity.cellsBelow1} below 1`);
    text = `${joinPhrases(parts)} (smallest ${smallest}), so Cochran's rule is not met and the chi-square p-value may be inaccurate.`;
  }
  if (merge) {
    const merged = merge.groups.filter((g) => g.length > 1).map((g) => g.join(' + '));
    const what = `merging ${joinPhrases(merged)} (${merge.dimension})`;
    text += merge.passes
      ? ` After ${what}, the table meets the rule: ${chiSquarePhrase(merge.statistic, merge.df, n, merge.p, report)}.`
      : ` Even after ${what} the rule is not met (${chiSquarePhrase(merge.statistic, merge.df, n, merge.p, report)}).`;
  }
  if (!exact) text += exactNote ? ` ${exactNote}` : ' An exact test is the other remedy.';
  return text;
}
