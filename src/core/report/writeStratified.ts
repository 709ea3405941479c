import type { AnalyzeOptions, StratifiedAnalysis } from '../analysis';
import type { IndependenceResult } from '../stats/types';
import type { CountTable } from '../types';
import { cautionSentences } from './cautions';
import { listLabels, symbol } from './describe';
import { formatFixed } from './formatNumber';
import { chiSquarePhrase, chiSquareValuePhrase, pValuePhrase } from './statisticPhrase';

/** Strata whose odds ratios are listed one by one in prose; more are summarised by their range. */
const MAX_LISTED_STRATA = 6;
/** A crude odds ratio this far (relative) from the adjusted one means the strata change the picture (common practice: 10%). */
const CONFOUNDING_CHANGE = 0.1;

/** "CMH χ²(1, N = 412) = 6.12, p = .013, common odds ratio 1.85, 95% CI [1.14, 3.01]" */
export function stratifiedHeadline(stratified: StratifiedAnalysis, n: number, report: Pick<AnalyzeOptions, 'decimals' | 'markup'>): string {
  const { cmh, exact } = stratified;
  // With an exact conditional p, the statistic stays and the p is replaced and named.
  const test = exact
    ? `CMH ${chiSquareValuePhrase(cmh.statistic.value, 1, n, report)}, ${pValuePhrase(exact.p, report, 'exact conditional p')}`
    : `CMH ${chiSquarePhrase(cmh.statistic.value, 1, n, cmh.statistic.p, report)}`;
  const or = cmh.pooledOddsRatio;
  if (!or) return `${test}; no common odds ratio (a zero in every stratum's diagonal or off-diagonal)`;
  const d = report.decimals;
  return `${test}, Mantel–Haenszel common odds ratio ${formatFixed(or.estimate, d)}, ${Math.round(or.level * 100)}% CI [${formatFixed(or.lower, d)}, ${formatFixed(or.upper, d)}]`;
}

function perStratumSentence(stratified: StratifiedAnalysis, report: Pick<AnalyzeOptions, 'decimals'>): string {
  const d = report.decimals;
  const entries = stratified.cmh.strata.map((stratum) => ({
    label: stratified.strata[stratum.index].label,
    text: stratum.oddsRatio === undefined ? 'not defined (a zero cell)' : formatFixed(stratum.oddsRatio, d),
    value: stratum.oddsRatio,
  }));
  if (entries.length <= MAX_LISTED_STRATA) {
    return `Stratum by stratum the odds ratios were ${entries.map((entry) => `${entry.label}: ${entry.text}`).join('; ')}.`;
  }
  const defined = entries.filter((entry) => entry.value !== undefined).map((entry) => entry.value!);
  if (defined.length === 0) return 'No stratum has a defined odds ratio on its own (each has a zero cell).';
  return `Stratum by stratum the odds ratios ranged from ${formatFixed(Math.min(...defined), d)} to ${formatFixed(Math.max(...defined), d)} over ${entries.length} strata.`;
}

function homogeneitySentence(stratified: StratifiedAnalysis, n: number, report: Pick<AnalyzeOptions, 'decimals' | 'markup' | 'alpha'>): string {
  const bd = stratified.cmh.breslowDay;
  if (!bd) return 'Whether the odds ratio is the same in every stratum could not be tested (fewer than two strata carry information on it).';
  const phrase = chiSquarePhrase(bd.taroneStatistic, bd.df, n, bd.tarone.p, report);
  return bd.tarone.p < report.alpha
    ? `The Breslow–Day test with Tarone's correction finds that the odds ratio differs between strata (${phrase}), so one common odds ratio is a poor summary: report the strata separately.`
    : `The Breslow–Day test with Tarone's correction finds no clear evidence that the odds ratio differs between strata (${phrase}); with few or small strata this test has little power.`;
}

function crudeSentence(stratified: StratifiedAnalysis, pooled: IndependenceResult, report: Pick<AnalyzeOptions, 'decimals'>): string {
  const crude = pooled.twoByTwo?.oddsRatio.estimate;
  const adjusted = stratified.cmh.pooledOddsRatio?.estimate;
  if (crude === undefined || adjusted === undefined || !(crude > 0) || !(adjusted > 0)) return '';
  const d = report.decimals;
  const changed = Math.abs(crude / adjusted - 1) > CONFOUNDING_CHANGE;
  return changed
    ? `Adding the strata together without adjustment would give an odds ratio of ${formatFixed(crude, d)}: the strata change the picture, so the adjusted figure is the one to report.`
    : `Adding the strata together without adjustment gives a similar odds ratio (${formatFixed(crude, d)}).`;
}

/** The Mantel–Fleiss check in words, for the write-up and the panel. */
export function mantelFleissSentence(stratified: StratifiedAnalysis): string {
  const check = stratified.mantelFleiss;
  const distances = `${formatFixed(check.expected - check.lowerBound, 1)} and ${formatFixed(check.upperBound - check.expected, 1)}`;
  const where = `The summed expected count (${formatFixed(check.expected, 1)}) lies ${distances} from the smallest and largest totals the margins allow`;
  return check.ok
    ? `${where}, at least 5 from both, so the chi-square approximation is adequate by the Mantel–Fleiss criterion.`
    : `${where}; the Mantel–Fleiss criterion asks for at least 5 from both, so the CMH chi-square p-value may be inaccurate.${stratified.exact ? '' : ' Collect more observations per stratum or combine strata that are alike.'}`;
}

/**
 * The paragraph for K stratified 2×2 tables: the CMH test and the common odds ratio lead; the
 * per-stratum odds ratios, the homogeneity test, the crude comparison and the validity follow.
 */
export function writeStratified(stratified: StratifiedAnalysis, pooledTable: CountTable, pooled: IndependenceResult, report: AnalyzeOptions): string {
  const n = pooled.n;
  const headline = stratifiedHeadline(stratified, n, report);
  const significant = (stratified.exact?.p ?? stratified.cmh.statistic.p) < report.alpha;
  if (report.style === 'line') return `${headline}; ${stratified.strata.length} strata.`;
  const N = symbol('N', report.markup);
  const [first, second] = pooledTable.rowLabels;
  const outcome = pooledTable.columnLabels[0];
  const labels = listLabels(stratified.strata.map((s) => s.label), 'strata');
  const parts: string[] = [];
  parts.push(
    `We compared ${first} with ${second} on "${outcome}" within each of ${stratified.strata.length} strata (${labels}; ${N} = ${n.toLocaleString('en-US')}), ` +
    'using the Cochran–Mantel–Haenszel test, which compares the groups inside each stratum so that differences between strata are not mistaken for a difference between the groups.',
  );
  parts.push(significant
    ? `Within strata the groups differ: ${headline}.`
    : `Within strata the groups show no clear difference: ${headline}. This does not show that they are the same.`);
  if (stratified.cmh.pooledOddsRatio) {
    parts.push(`The odds ratio compares the odds of "${outcome}" in ${first} with those in ${second} (Robins–Breslow–Greenland interval).`);
  }
  parts.push(perStratumSentence(stratified, report));
  parts.push(homogeneitySentence(stratified, n, report));
  const crude = crudeSentence(stratified, pooled, report);
  if (crude) parts.push(crude);
  parts.push(mantelFleissSentence(stratified));
  if (stratified.exactReason) parts.push(stratified.exactReason);
  if (stratified.cmh.strataSkipped > 0) parts.push(`${stratified.cmh.strataSkipped} stratum with one observation or none was left out.`);
  parts.push(`With the continuity correction the test gives ${pValuePhrase(stratified.cmh.corrected.p, report)}.`);
  parts.push(cautionSentences('stratified'));
  return parts.join(' ');
}
