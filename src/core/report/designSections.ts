import type { Analysis, PairedAnalysis, ReportOptions, StratifiedAnalysis } from '../analysis';
import type { FollowUps } from '../designs/followUps';
import type { Interval } from '../types';
import { formatExactP, formatFixed, formatNoLeadingZero } from './formatNumber';
import { ADJUSTMENT_NAMES } from './writeFollowUps';
import { PAIRED_P_NAMES } from './writePaired';

/**
 * What a design adds to the results (paired, strata, pairwise, ordered): a titled block of finished
 * lines and an optional table. The CLI prints it; the panel shows it as it is (same shape as the
 * protocol's DesignSection).
 */
export interface DesignSection {
  /** Stable id: 'paired', 'strata', 'pairwise', 'ordered'. */
  id: string;
  title: string;
  lines: string[];
  /** Header cells, then rows whose first cell is the row label; `marked` as [row, column] without the label column. */
  table?: { caption: string; header: string[]; rows: string[][]; marked?: [number, number][] };
}


function interval(i: Interval, decimals: number, bounded: boolean): string {
  const format = bounded ? formatNoLeadingZero : formatFixed;
  return `${format(i.estimate, decimals)}, ${Math.round(i.level * 100)}% CI [${format(i.lower, decimals)}, ${format(i.upper, decimals)}] (${i.method})`;
}

function pairedSection(paired: PairedAnalysis, analysis: Analysis, d: number): DesignSection {
  const [first, second] = analysis.table.rowLabels;
  const [firstAfter, secondAfter] = analysis.table.columnLabels;
  const { b, c } = paired.discordant;
  return {
    id: 'paired',
    title: 'Paired answers (McNemar)',
    lines: [
      `Leading: ${PAIRED_P_NAMES[paired.leading.method]} = ${formatExactP(paired.leading.p, paired.leading.log10p)}`,
      `Discordant pairs: ${b} ${first} → ${secondAfter}, ${c} ${second} → ${firstAfter}; ${paired.n - b - c} of ${paired.n} pairs unchanged`,
      `Mid-p = ${formatExactP(paired.midP.p, paired.midP.log10p)}; exact conditional p = ${formatExactP(paired.exact.p, paired.exact.log10p)}`,
      `Asymptotic χ²(1) = ${formatFixed(paired.chiSquare.statistic, d)}, p = ${formatExactP(paired.chiSquare.p, paired.chiSquare.log10p)}; with continuity correction χ²(1) = ${formatFixed(paired.chiSquareCorrected.statistic, d)}, p = ${formatExactP(paired.chiSquareCorrected.p, paired.chiSquareCorrected.log10p)}`,
      `Difference in paired proportions of ${first} (first minus second): ${interval(paired.difference.newcombe, d, true)}`,
      `Wald interval for comparison: [${formatNoLeadingZero(paired.difference.wald.lower, d)}, ${formatNoLeadingZero(paired.difference.wald.upper, d)}]`,
    ],
  };
}

function strataSection(stratified: StratifiedAnalysis, d: number): DesignSection {
  const { cmh, mantelFleiss } = stratified;
  const exact = stratified.exact;
  const lines = [
    ...(exact ? [`Exact conditional p = ${formatExactP(exact.p, exact.log10p)} (one-sided: ${formatExactP(exact.pLess, Math.log10(exact.pLess))} lower, ${formatExactP(exact.pGreater, Math.log10(exact.pGreater))} upper); summed top-left count ${exact.observedSum} of a possible ${exact.lowest}–${exact.highest}`] : []),
    `CMH χ²(1) = ${formatFixed(cmh.statistic.value, d)}, p = ${formatExactP(cmh.statistic.p, cmh.statistic.log10p)}; with continuity correction χ²(1) = ${formatFixed(cmh.corrected.value, d)}, p = ${formatExactP(cmh.corrected.p, cmh.corrected.log10p)}`,
    cmh.pooledOddsRatio ? `Mantel–Haenszel common odds ratio: ${interval(cmh.pooledOddsRatio, d, false)}` : 'No common odds ratio: the strata have zeros on a whole diagonal.',
    cmh.breslowDay
      ? `Same odds ratio in every stratum? Breslow–Day with Tarone's correction χ²(${cmh.breslowDay.df}) = ${formatFixed(cmh.breslowDay.taroneStatistic, d)}, p = ${formatExactP(cmh.breslowDay.tarone.p, cmh.breslowDay.tarone.log10p)} (uncorrected ${formatFixed(cmh.breslowDay.statistic, d)})`
      : 'Same odds ratio in every stratum? Not testable: fewer than two strata carry information.',
    `Mantel–Fleiss check: summed expected count ${formatFixed(mantelFleiss.expected, 1)} within [${formatFixed(mantelFleiss.lowerBound, 0)}, ${formatFixed(mantelFleiss.upperBound, 0)}], ${formatFixed(mantelFleiss.distance, 1)} from the nearer bound (5 needed): ${mantelFleiss.ok ? 'met' : 'not met'}`,
  ];
  if (cmh.strataSkipped > 0) lines.push(`${cmh.strataSkipped} stratum with fewer than two observations left out`);
  const header = ['Stratum', 'N', ...cellHeaders(stratified), 'Odds ratio'];
  return {
    id: 'strata',
    title: `Strata (${stratified.strata.length}, Cochran–Mantel–Haenszel)`,
    lines,
    table: {
      caption: 'Each stratum\'s 2×2 counts and odds ratio',
      header,
      rows: stratified.strata.map((stratum, index) => [
        stratum.label,
        String(cmh.strata[index].n),
        ...stratum.table.observed.flat().map(String),
        cmh.strata[index].oddsRatio === undefined ? 'not defined' : formatFixed(cmh.strata[index].oddsRatio!, d),
      ]),
    },
  };
}

function cellHeaders(stratified: StratifiedAnalysis): string[] {
  const { rowLabels, columnLabels } = stratified.strata[0].table;
  return rowLabels.flatMap((row) => columnLabels.map((column) => `${row} × ${column}`));
}

function pairwiseSection(followUps: FollowUps, d: number): DesignSection | undefined {
  const pairwise = followUps.pairwise;
  if (!pairwise) return undefined;
  const differing = pairwise.differing.length;
  return {
    id: 'pairwise',
    title: 'Which groups differ',
    lines: [
      `${pairwise.comparisons.length} pairs of ${pairwise.groupsAlong}, ${ADJUSTMENT_NAMES[pairwise.method]}-adjusted at ${formatNoLeadingZero(pairwise.alpha, 2)}: ${differing === 0 ? 'no pair differs clearly' : `${differing} ${differing === 1 ? 'pair differs' : 'pairs differ'}`}.`,
      'Read these only after a clear overall result; each pair is tested on its own 2×k sub-table (exactly when that sub-table is sparse).',
    ],
    table: {
      caption: 'Pairwise comparisons',
      header: ['Pair', 'χ²', 'df', 'p', 'Adjusted p', 'Differs'],
      rows: pairwise.comparisons.map((pair) => [
        `${pair.firstLabel} vs ${pair.secondLabel}`,
        formatFixed(pair.statistic, d),
        String(pair.df),
        `${formatExactP(pair.p.p, pair.p.log10p)}${pair.pMethod === 'exact' ? ' (exact)' : ''}`,
        formatExactP(pair.adjustedP, Math.log10(pair.adjustedP)),
        pair.differs ? 'yes' : 'no',
      ]),
      marked: pairwise.comparisons.flatMap((pair, index): [number, number][] => (pair.differs ? [[index, 4]] : [])),
    },
  };
}

function orderedSection(followUps: FollowUps, d: number): DesignSection | undefined {
  const { trend, linearByLinear } = followUps;
  const lines: string[] = [];
  if (trend) {
    lines.push(
      `Cochran–Armitage trend in the share of "${trend.outcomeLabel}" across ${trend.orderedAlong} ${trend.orderedLabels.join(', ')}`,
      `Scores ${trend.scores.join(', ')}${trend.scoresGiven ? '' : ' (equally spaced)'}: Z = ${formatFixed(trend.z, d)}, p = ${formatExactP(trend.p.p, trend.p.log10p)}; conditional Z = ${formatFixed(trend.zConditional, d)}, p = ${formatExactP(trend.pConditional.p, trend.pConditional.log10p)}`,
    );
  }
  if (linearByLinear) {
    lines.push(
      `Linear-by-linear association: M²(1) = ${formatFixed(linearByLinear.statistic, d)}, p = ${formatExactP(linearByLinear.p.p, linearByLinear.p.log10p)}, r = ${formatNoLeadingZero(linearByLinear.correlation, d)}`,
      `Row scores ${linearByLinear.rowScores.join(', ')}; column scores ${linearByLinear.columnScores.join(', ')}${linearByLinear.scoresGiven ? '' : ' (equally spaced)'}`,
    );
  }
  lines.push(...followUps.notes);
  if (lines.length === 0) return undefined;
  return { id: 'ordered', title: 'Ordered categories', lines };
}

/** The design's own blocks, in reading order. */
export function designSections(analysis: Analysis, report: Pick<ReportOptions, 'decimals'>): DesignSection[] {
  const d = report.decimals;
  const sections: (DesignSection | undefined)[] = [];
  if (analysis.paired) sections.push(pairedSection(analysis.paired, analysis, d));
  if (analysis.stratified) sections.push(strataSection(analysis.stratified, d));
  if (analysis.followUps) sections.push(pairwiseSection(analysis.followUps, d), orderedSection(analysis.followUps, d));
  return sections.filter((section): section is DesignSection => section !== undefined);
}
