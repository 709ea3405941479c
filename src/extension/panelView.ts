import type { Analysis, ReportOptions } from '../core/analysis';
import { validitySentences } from '../core/report/cautions';
import { formatExactP, formatFixed, formatPercent, formatSigned } from '../core/report/formatNumber';
import { describeSource, STRATA_SUMMED, statisticsLines } from '../core/report/resultsReport';
import { goodnessOfFitHeadline } from '../core/report/writeGoodnessOfFit';
import { independenceHeadline } from '../core/report/writeIndependence';
import { pairedHeadline } from '../core/report/writePaired';
import { mantelFleissSentence, stratifiedHeadline } from '../core/report/writeStratified';
import { designSections } from '../core/report/designSections';
import { withMarkup } from './withMarkup';
import type { GoodnessOfFitResult, IndependenceResult } from '../core/stats/types';
import type { Interval, MergeProposal } from '../core/types';
import type { ChartData, DisplayTable, PanelView, ProportionBar } from '../protocol/messages';

/** Expected counts show one decimal, as in the inserted tables (src/core/report/markdownTables.ts). */
const EXPECTED_DECIMALS = 1;
/** Residuals show two decimals, as in the contributions table and the statistics lines. */
const RESIDUAL_DECIMALS = 2;

/**
 * The finished view model for the results panel: every string the panel shows, formatted here
 * from the engine's Analysis with the core report helpers. No statistics are computed here;
 * the panel only lays the view out.
 * @param analysis the engine's result for one table
 * @param key identifies the analysed table (document URI and table start line)
 * @returns the panel's view model
 */
export function buildPanelView(analysis: Analysis, key: string): PanelView {
  const report: ReportOptions = { ...analysis.options, markup: 'plain' };
  const { result, table } = analysis;
  const isIndependence = result.test === 'independence';
  const base = {
    key,
    kind: analysis.kind,
    details: statisticsLines(analysis),
    tables: {
      observed: observedTable(analysis),
      expected: expectedTable(analysis),
      contributions: contributionsTable(analysis),
      residuals: isIndependence ? independenceResiduals(analysis, result) : fitResiduals(analysis, result as GoodnessOfFitResult),
    },
    designSections: designSections(analysis, report),
    // Shown as plain text (no literal asterisks); Insert and Copy use the document's own markup.
    writeUp: withMarkup(analysis, 'plain').writeUp,
    warnings: analysis.warnings.map((warning) => warning.message),
  };
  const crossTabulation = analysis.origin.crossTabulation;
  const where = describeSource(analysis);
  if (analysis.kind === 'paired' && analysis.paired) {
    return {
      ...base,
      title: `Paired 2×2 (McNemar), ${where}`,
      summary: `Paired 2×2: ${pairedHeadline(analysis.paired, report)}`,
      validity: 'Only the pairs whose answer changed carry information; the mid-p and exact conditional versions are valid for any number of them.',
      validityOk: true,
      details: [],
      canRunExact: false,
    };
  }
  if (analysis.kind === 'stratified' && analysis.stratified) {
    const strata = analysis.stratified.strata.length;
    return {
      ...base,
      title: `Stratified 2×2 (${strata} strata, Cochran–Mantel–Haenszel), ${crossTabulation ? where : `lines ${table.startLine}–${table.endLine}`}`,
      summary: `Stratified 2×2: ${stratifiedHeadline(analysis.stratified, result.n, report)}`,
      validity: [mantelFleissSentence(analysis.stratified), analysis.stratified.exactReason].filter(Boolean).join(' '),
      validityOk: analysis.stratified.mantelFleiss.ok,
      details: [STRATA_SUMMED, ...statisticsLines(analysis)],
      tables: { ...base.tables, observed: { ...base.tables.observed, caption: `Strata summed (N = ${result.n}); each stratum is listed under Strata` } },
      canRunExact: false,
    };
  }
  const testName = isIndependence
    ? `Test of independence (${result.rows}×${result.columns})`
    : `Goodness of fit (${result.categories} categories)`;
  const summary = isIndependence
    ? independenceHeadline(result, report, analysis.exact)
    : goodnessOfFitHeadline(result, report, analysis.exact);
  return {
    ...base,
    title: `${testName}, ${where}`,
    summary: `${testName}: ${summary}`,
    validity: validitySentences(result.validity, result.mergeProposal, result.n, report, analysis.exact, analysis.exactNote),
    validityOk: result.validity.ok,
    chart: isIndependence ? independenceChart(analysis, result) : fitChart(analysis, result),
    ...(result.mergeProposal ? { merge: mergeSection(analysis, result.mergeProposal) } : {}),
    canRunExact: !result.validity.ok && !analysis.exact && !analysis.exactNote,
  };
}

/** Goodness-of-fit vectors in the table's own 1×k or k×1 shape. */
function asGrid<T>(analysis: Analysis, values: T[]): T[][] {
  return analysis.table.rowLabels.length === 1 ? [values] : values.map((v) => [v]);
}

function gridOf(analysis: Analysis, independence: number[][] | undefined, fit: number[] | undefined): number[][] {
  return independence ?? asGrid(analysis, fit ?? []);
}

function labelled(analysis: Analysis, caption: string, corner: string, cells: string[][]): DisplayTable {
  const { rowLabels, columnLabels } = analysis.table;
  return { caption, header: [corner, ...columnLabels], rows: cells.map((row, r) => [rowLabels[r], ...row]) };
}

function observedTable(analysis: Analysis): DisplayTable {
  const { table, result } = analysis;
  const rowTotals = table.observed.map((row) => row.reduce((a, b) => a + b, 0));
  const columnTotals = table.columnLabels.map((_, c) => table.observed.reduce((a, row) => a + row[c], 0));
  const withTotalColumn = table.columnLabels.length > 1;
  const withTotalRow = table.rowLabels.length > 1;
  const rows = table.observed.map((row, r) => [
    table.rowLabels[r],
    ...row.map(String),
    ...(withTotalColumn ? [String(rowTotals[r])] : []),
  ]);
  if (withTotalRow) rows.push(['Total', ...columnTotals.map(String), ...(withTotalColumn ? [String(result.n)] : [])]);
  return {
    caption: `Observed counts (N = ${result.n})`,
    header: ['Observed', ...table.columnLabels, ...(withTotalColumn ? ['Total'] : [])],
    rows,
    values: table.observed,
  };
}

function expectedTable(analysis: Analysis): DisplayTable {
  const { result } = analysis;
  const expected = gridOf(analysis, result.test === 'independence' ? result.expected : undefined, result.test === 'goodness-of-fit' ? result.expected : undefined);
  const marked = result.validity.sparseCells.map((cell): [number, number] => [cell.row, cell.column]);
  const caption = result.validity.ok
    ? 'Expected counts'
    : `Expected counts (cells below 5 marked: ${result.validity.cellsBelow5} of ${result.validity.cellCount})`;
  return {
    ...labelled(analysis, caption, 'Expected', expected.map((row) => row.map((e) => formatFixed(e, EXPECTED_DECIMALS)))),
    values: expected,
    marked,
  };
}

function contributionsTable(analysis: Analysis): DisplayTable {
  const { result } = analysis;
  const d = analysis.options.decimals;
  const contributions = result.test === 'independence' ? result.contributions : asGrid(analysis, result.contributions);
  const shares = result.test === 'independence' ? result.contributionShares : asGrid(analysis, result.contributionShares);
  const cells = contributions.map((row, r) => row.map((x, c) => `${formatFixed(x, d)} (${formatPercent(shares[r][c])})`));
  return {
    ...labelled(analysis, `Contribution of each cell to χ² = ${formatFixed(pearsonOf(result), d)} (share of the total)`, 'Contribution', cells),
    values: shares,
  };
}

function pearsonOf(result: IndependenceResult | GoodnessOfFitResult): number {
  return result.test === 'independence' ? result.pearson.statistic : result.statistic;
}

function independenceResiduals(analysis: Analysis, result: IndependenceResult): DisplayTable {
  const critical = formatFixed(result.residualCriticalValue, RESIDUAL_DECIMALS);
  const cells = result.adjustedResiduals.map((row) => row.map((x) => formatSigned(x, RESIDUAL_DECIMALS)));
  return {
    ...labelled(analysis, `Adjusted residuals (cells beyond ±${critical}, the Bonferroni value over ${result.rows * result.columns} cells, are marked)`, 'Residual', cells),
    values: result.adjustedResiduals,
    marked: result.flaggedCells.map((cell): [number, number] => [cell.row, cell.column]),
  };
}

function fitResiduals(analysis: Analysis, result: GoodnessOfFitResult): DisplayTable {
  const critical = formatFixed(result.residualCriticalValue, RESIDUAL_DECIMALS);
  const oneRow = analysis.table.rowLabels.length === 1;
  const values = asGrid(analysis, result.standardizedResiduals);
  return {
    ...labelled(analysis, `Standardized residuals (categories beyond ±${critical}, the Bonferroni value over ${result.categories} categories, are marked)`, 'Residual', values.map((row) => row.map((x) => formatSigned(x, RESIDUAL_DECIMALS)))),
    values,
    marked: result.flaggedCells.map((cell): [number, number] => (oneRow ? [0, cell.index] : [cell.index, 0])),
  };
}

function proportionLabel(interval: Interval): string {
  const percent = (x: number) => formatFixed(x * 100, 1);
  return `${percent(interval.estimate)}% (${percent(interval.lower)}–${percent(interval.upper)}%)`;
}

function bar(group: string, category: string, interval: Interval): ProportionBar {
  return { group, category, share: interval.estimate, lower: interval.lower, upper: interval.upper, label: proportionLabel(interval) };
}

function dimensionTitles(analysis: Analysis): { rowTitle: string; columnTitle: string } {
  const columns = analysis.origin.crossTabulation?.columns;
  return { rowTitle: columns?.[0] ?? 'Rows', columnTitle: columns?.[1] ?? 'Columns' };
}

function independenceChart(analysis: Analysis, result: IndependenceResult): ChartData {
  const { rowLabels, columnLabels } = analysis.table;
  const rowProportions = result.rowProportions.flatMap((row, r) => row.map((interval, c) => bar(rowLabels[r], columnLabels[c], interval)));
  const columnProportions = columnLabels.flatMap((column, c) => rowLabels.map((rowLabel, r) => bar(column, rowLabel, result.columnProportions[r][c])));
  const mosaic = rowLabels.map((group, r) => ({
    group,
    width: result.n > 0 ? result.rowTotals[r] / result.n : 0,
    segments: columnLabels.map((category, c) => ({
      category,
      height: result.rowProportions[r][c].estimate,
      residual: result.adjustedResiduals[r][c],
      label: `${group} × ${category}: ${analysis.table.observed[r][c]} of ${result.rowTotals[r]}, ${proportionLabel(result.rowProportions[r][c])}; adjusted residual ${formatSigned(result.adjustedResiduals[r][c], RESIDUAL_DECIMALS)}`,
    })),
  }));
  return { rowProportions, columnProportions, mosaic, ...dimensionTitles(analysis) };
}

function fitChart(analysis: Analysis, result: GoodnessOfFitResult): ChartData {
  const categories = analysis.table.rowLabels.length === 1 ? analysis.table.columnLabels : analysis.table.rowLabels;
  const group = analysis.table.rowLabels.length === 1 ? analysis.table.rowLabels[0] : analysis.table.columnLabels[0];
  return {
    rowProportions: result.proportions.map((interval, i) => bar(group, categories[i], interval)),
    columnProportions: [],
    mosaic: [],
    rowTitle: 'Observed',
    columnTitle: 'Categories',
  };
}

function mergeSection(analysis: Analysis, merge: MergeProposal): { description: string; table: DisplayTable; result: string } {
  const d = analysis.options.decimals;
  const { rowLabels, columnLabels } = analysis.table;
  const mergedRows = merge.dimension === 'rows' ? merge.labels : rowLabels;
  const mergedColumns = merge.dimension === 'columns' ? merge.labels : columnLabels;
  const joined = merge.groups.filter((g) => g.length > 1).map((g) => g.join(' + ')).join('; ');
  return {
    description: `Merge ${merge.dimension}: ${joined}. ${merge.reason}`,
    table: {
      caption: `Observed counts after merging ${merge.dimension}`,
      header: ['Merged', ...mergedColumns],
      rows: merge.observed.map((row, r) => [mergedRows[r], ...row.map(String)]),
      values: merge.observed,
    },
    result: `After the merge: χ²(${merge.df}) = ${formatFixed(merge.statistic, d)}, p = ${formatExactP(merge.p, merge.log10p)}; ${merge.passes ? 'the merged table meets Cochran\'s rule' : 'the merged table still fails Cochran\'s rule'}.`,
  };
}
