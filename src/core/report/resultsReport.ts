import type { Analysis } from '../analysis';
import { describePValueMethod } from '../exact/choosePValue';
import { describeHypothesis } from './writeGoodnessOfFit';
import { formatExactP, formatFixed, formatNoLeadingZero } from './formatNumber';
import { designSections } from './designSections';
import { renderTable } from './markdownTables';

/** Observed counts with row and column totals (a single row or column gets no redundant total). */
export function observedTable(analysis: Analysis): string {
  const { table } = analysis;
  const rowTotals = table.observed.map((row) => row.reduce((a, b) => a + b, 0));
  const columnTotals = table.columnLabels.map((_, c) => table.observed.reduce((a, row) => a + row[c], 0));
  const n = rowTotals.reduce((a, b) => a + b, 0);
  const withTotalColumn = table.columnLabels.length > 1;
  const header = ['Observed', ...table.columnLabels, ...(withTotalColumn ? ['Total'] : [])];
  const body = table.observed.map((row, r) => [table.rowLabels[r], ...row.map(String), ...(withTotalColumn ? [String(rowTotals[r])] : [])]);
  if (table.rowLabels.length > 1) body.push(['Total', ...columnTotals.map(String), ...(withTotalColumn ? [String(n)] : [])]);
  return renderTable(header, body, analysis.options.markup);
}

/** The statistics block: every test statistic with its exact p, for a results view or a copy. */
export function statisticsLines(analysis: Analysis): string[] {
  const { result } = analysis;
  const d = analysis.options.decimals;
  const p = (x: { p: number; log10p: number }) => formatExactP(x.p, x.log10p);
  const lines: string[] = [];
  if (result.test === 'independence') {
    lines.push(`Test: independence of rows and columns (${result.rows}×${result.columns}), N = ${result.n}, df = ${result.df}`);
    lines.push(`Pearson χ² = ${formatFixed(result.pearson.statistic, d)}, p = ${p(result.pearson)}`);
    if (result.yates) lines.push(`Yates-corrected χ² = ${formatFixed(result.yates.statistic, d)}, p = ${p(result.yates)}${result.continuityCorrected ? ' (applied)' : ' (not applied)'}`);
    lines.push(`Likelihood ratio G² = ${formatFixed(result.g.statistic, d)}, p = ${p(result.g)}; with Williams' correction (q = ${formatFixed(result.g.williamsQ, 4)}) G² = ${formatFixed(result.g.corrected.statistic, d)}, p = ${p(result.g.corrected)}`);
    const v = result.effect.cramersVInterval;
    lines.push(`Cramér's V = ${formatNoLeadingZero(result.effect.cramersV, d)} (${Math.round(v.level * 100)}% CI ${formatNoLeadingZero(v.lower, d)} to ${formatNoLeadingZero(v.upper, d)}), bias-corrected V = ${formatNoLeadingZero(result.effect.cramersVCorrected, d)}, w = ${formatNoLeadingZero(result.effect.cohensW, d)}${result.effect.phi !== undefined ? `, φ = ${formatNoLeadingZero(result.effect.phi, d)}` : ''}`);
    if (result.twoByTwo) {
      const m = result.twoByTwo;
      const show = (name: string, i: typeof m.riskDifference) => `${name} ${formatFixed(i.estimate, d + 1)} (${Math.round(i.level * 100)}% CI ${formatFixed(i.lower, d + 1)} to ${formatFixed(i.upper, d + 1)}; ${i.method})`;
      lines.push(`${show('Risk difference', m.riskDifference)}; ${show('relative risk', m.relativeRisk)}; ${show('odds ratio', m.oddsRatio)}`);
    }
    lines.push(`Adjusted residuals beyond ±${formatFixed(result.residualCriticalValue, 2)} (Bonferroni over ${result.rows * result.columns} cells): ${result.flaggedCells.length === 0 ? 'none' : result.flaggedCells.map((c) => `${analysis.table.rowLabels[c.row]} × ${analysis.table.columnLabels[c.column]} ${formatFixed(c.residual, 2)}`).join('; ')}`);
  } else {
    lines.push(`Test: goodness of fit to ${describeHypothesis(result.hypothesis, d)}, ${result.categories} categories, N = ${result.n}, df = ${result.df}`);
    lines.push(`Pearson χ² = ${formatFixed(result.statistic, d)}, p = ${p(result)}`);
    lines.push(`Likelihood ratio G² = ${formatFixed(result.g.statistic, d)}, p = ${p(result.g)}; with Williams' correction G² = ${formatFixed(result.g.corrected.statistic, d)}, p = ${p(result.g.corrected)}`);
    lines.push(`Cohen's w = ${formatNoLeadingZero(result.cohensW, d)}`);
  }
  const exact = analysis.exact;
  if (exact) {
    const interval = exact.interval ? ` (${Math.round(exact.interval.level * 100)}% simulation interval ${formatNoLeadingZero(exact.interval.lower, 4)} to ${formatNoLeadingZero(exact.interval.upper, 4)})` : '';
    const sides = exact.pLess !== undefined && exact.pGreater !== undefined ? `; one-sided p ${formatExactP(exact.pLess, Math.log10(exact.pLess))} (lower), ${formatExactP(exact.pGreater, Math.log10(exact.pGreater))} (upper)` : '';
    lines.push(`p used for the result = ${p(exact)}${interval}${sides}, ${describePValueMethod(exact.method)}, ${exact.elapsedMs.toFixed(exact.elapsedMs < 10 ? 2 : 0)} ms. ${exact.reason}`);
  } else if (analysis.exactNote) {
    lines.push(analysis.exactNote);
  }
  const validity = result.validity;
  lines.push(`Validity (Cochran 1954): ${validity.ok ? 'met' : 'NOT met'}; smallest expected ${formatFixed(validity.minExpected, 2)}, ${validity.cellsBelow5} of ${validity.cellCount} below 5, ${validity.cellsBelow1} below 1`);
  if (result.mergeProposal) {
    const m = result.mergeProposal;
    lines.push(`Proposed merge (${m.dimension}): ${m.groups.filter((g) => g.length > 1).map((g) => g.join(' + ')).join('; ')} → χ²(${m.df}) = ${formatFixed(m.statistic, d)}, p = ${formatExactP(m.p, m.log10p)}${m.passes ? ', meets the rule' : ', still fails the rule'}. ${m.reason}`);
  }
  return lines;
}

/** Heads the summed table's statistics in a stratified analysis, which are for comparison only. */
export const STRATA_SUMMED = 'The strata summed, without adjustment (for comparison only):';

/** Where the counts came from: "table 2 of 3, lines 14–17", or the cross-tabulation of a raw file. */
export function describeSource(analysis: Pick<Analysis, 'table' | 'origin'>): string {
  const { table, origin } = analysis;
  const tabulation = origin.crossTabulation;
  if (table.format !== 'crosstab' || !tabulation) return `table ${origin.index} of ${origin.count}, lines ${table.startLine}–${table.endLine}`;
  const weight = tabulation.weightColumn ? ` weighted by ${tabulation.weightColumn}` : '';
  const strata = tabulation.stratumColumn ? `, in strata by ${tabulation.stratumColumn}` : '';
  return `cross-tabulation of ${tabulation.columns.join(' × ')}${weight}${strata} (${tabulation.rowsRead} rows)`;
}

/** The whole result as text or Markdown: statistics, tables, notes and the write-up. */
export function resultsReport(analysis: Analysis): string {
  const where = describeSource(analysis);
  const designs = designSections(analysis, analysis.options).map((section) => [
    `${section.title}:`,
    ...section.lines.map((line) => `- ${line}`),
    ...(section.table ? ['', renderTable(section.table.header, section.table.rows, analysis.options.markup)] : []),
  ].join('\n'));
  // Expected counts and contributions of independence do not describe paired or stratified counts.
  const independenceTables = analysis.kind === 'paired' || analysis.kind === 'stratified' ? [] : [analysis.expectedTable, analysis.contributionsTable];
  const statistics = analysis.kind === 'paired' ? [] : [[...(analysis.kind === 'stratified' ? [STRATA_SUMMED] : []), ...statisticsLines(analysis)].join('\n')];
  const sections = [
    where,
    ...designs,
    ...statistics,
    observedTable(analysis),
    ...independenceTables,
  ];
  if (analysis.warnings.length > 0) {
    sections.push(['Notes:', ...analysis.warnings.map((w) => `- ${w.message}`)].join('\n'));
  }
  sections.push(`Write-up:\n${analysis.writeUp}`);
  return sections.join('\n\n');
}
