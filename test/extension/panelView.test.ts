import assert from 'node:assert/strict';
import { formatFixed, formatPercent, formatSigned } from '../../src/core/report/formatNumber';
import { statisticsLines } from '../../src/core/report/resultsReport';
import { goodnessOfFitHeadline } from '../../src/core/report/writeGoodnessOfFit';
import { independenceHeadline } from '../../src/core/report/writeIndependence';
import { buildPanelView } from '../../src/extension/panelView';
import { withMarkup } from '../../src/extension/withMarkup';
import { isHostToPanel } from '../../src/protocol/messages';
import {
  analyzed, BAKERY_RETURNS, BUS_DEPOT_SPARSE, GREENHOUSE, HOSTILE_COLUMN, HOSTILE_ROW, SKI_SCHOOL, withHostileLabels,
} from './panelFixtures';

const plain = (analysis: ReturnType<typeof analyzed>) => ({ ...analysis.options, markup: 'plain' as const });

describe('buildPanelView', () => {
  it('shows the engine\'s headline, statistics lines, write-up and a view the panel guard accepts', () => {
    const analysis = analyzed(GREENHOUSE);
    const view = buildPanelView(analysis, 'file:///notes.md#1');
    assert.equal(view.key, 'file:///notes.md#1');
    assert.ok(analysis.result.test === 'independence');
    if (analysis.result.test !== 'independence') return;
    assert.ok(view.summary.endsWith(independenceHeadline(analysis.result, plain(analysis), analysis.exact)), view.summary);
    assert.deepEqual(view.details, statisticsLines(analysis));
    assert.equal(view.writeUp, withMarkup(analysis, 'plain').writeUp, 'the panel shows the write-up without Markdown emphasis');
    assert.equal(view.validityOk, true);
    assert.ok(isHostToPanel({ type: 'show', view }));
    assert.ok(isHostToPanel(JSON.parse(JSON.stringify({ type: 'show', view }))), 'the view survives a JSON round trip');
  });

  it('gives the observed table both margins, with the grand total equal to N', () => {
    const analysis = analyzed(GREENHOUSE);
    const { observed } = buildPanelView(analysis, 'k').tables;
    assert.deepEqual(observed.header, ['Observed', ...analysis.table.columnLabels, 'Total']);
    analysis.table.observed.forEach((row, r) => {
      assert.deepEqual(observed.rows[r], [analysis.table.rowLabels[r], ...row.map(String), String(row.reduce((a, b) => a + b, 0))]);
    });
    const totals = observed.rows[observed.rows.length - 1];
    assert.equal(totals[0], 'Total');
    assert.equal(totals[totals.length - 1], String(analysis.result.n));
  });

  it('formats every expected count, contribution and adjusted residual from the engine\'s own numbers', () => {
    const analysis = analyzed(GREENHOUSE);
    const result = analysis.result;
    assert.ok(result.test === 'independence');
    if (result.test !== 'independence') return;
    const { expected, contributions, residuals } = buildPanelView(analysis, 'k').tables;
    result.expected.forEach((row, r) => row.forEach((e, c) => {
      assert.equal(expected.rows[r][c + 1], formatFixed(e, 1));
      assert.equal(contributions.rows[r][c + 1], `${formatFixed(result.contributions[r][c], 2)} (${formatPercent(result.contributionShares[r][c])})`);
      assert.equal(residuals.rows[r][c + 1], formatSigned(result.adjustedResiduals[r][c], 2));
    }));
    assert.deepEqual(residuals.values, result.adjustedResiduals);
    assert.ok(contributions.caption.includes(formatFixed(result.pearson.statistic, 2)));
  });

  it('marks exactly the residual cells beyond the Bonferroni value', () => {
    const analysis = analyzed(GREENHOUSE);
    const result = analysis.result;
    if (result.test !== 'independence') return assert.fail('expected an independence test');
    const { residuals } = buildPanelView(analysis, 'k').tables;
    const marked = new Set((residuals.marked ?? []).map(([r, c]) => `${r},${c}`));
    assert.ok(marked.size > 0, 'the greenhouse table has cells beyond the critical value');
    result.adjustedResiduals.forEach((row, r) => row.forEach((x, c) => {
      assert.equal(marked.has(`${r},${c}`), Math.abs(x) > result.residualCriticalValue, `cell ${r},${c} residual ${x}`);
    }));
  });

  it('draws one bar per cell from the Wilson intervals, shares within a row summing to one', () => {
    const analysis = analyzed(GREENHOUSE);
    const result = analysis.result;
    if (result.test !== 'independence') return assert.fail('expected an independence test');
    const chart = buildPanelView(analysis, 'k').chart;
    assert.ok(chart);
    assert.equal(chart.rowProportions.length, result.rows * result.columns);
    assert.equal(chart.columnProportions.length, result.rows * result.columns);
    for (const bar of [...chart.rowProportions, ...chart.columnProportions]) {
      assert.ok(bar.lower <= bar.share && bar.share <= bar.upper, JSON.stringify(bar));
      assert.match(bar.label, /^\d+\.\d% \(\d+\.\d–\d+\.\d%\)$/);
    }
    assert.equal(chart.rowProportions[1].share, result.rowProportions[0][1].estimate);
    assert.equal(chart.columnProportions[1].share, result.columnProportions[1][0].estimate);
    for (const label of analysis.table.rowLabels) {
      const sum = chart.rowProportions.filter((b) => b.group === label).reduce((a, b) => a + b.share, 0);
      assert.ok(Math.abs(sum - 1) < 1e-12, `${label}: ${sum}`);
    }
    const widths = chart.mosaic.reduce((a, strip) => a + strip.width, 0);
    assert.ok(Math.abs(widths - 1) < 1e-12, `mosaic widths sum to ${widths}`);
    assert.equal(chart.mosaic[2].segments[0].residual, result.adjustedResiduals[2][0]);
  });

  it('has no merge and offers no exact test when Cochran\'s rule holds', () => {
    for (const text of [GREENHOUSE, SKI_SCHOOL]) {
      const view = buildPanelView(analyzed(text), 'k');
      assert.equal(view.merge, undefined);
      assert.equal(view.canRunExact, false);
      assert.deepEqual(view.tables.expected.marked, []);
    }
  });

  it('shows the proposed merge of a sparse table with its merged counts and result', () => {
    const analysis = analyzed(BUS_DEPOT_SPARSE);
    const merge = analysis.result.mergeProposal;
    assert.ok(merge, 'the engine proposes a merge for the sparse bus depot table');
    const view = buildPanelView(analysis, 'k');
    assert.ok(view.merge);
    assert.equal(view.validityOk, false);
    const mergedColumns = merge.dimension === 'columns' ? merge.labels : analysis.table.columnLabels;
    assert.deepEqual(view.merge.table.header, ['Merged', ...mergedColumns]);
    assert.deepEqual(view.merge.table.rows.map((row) => row.slice(1).map(Number)), merge.observed);
    assert.ok(view.merge.result.includes(`χ²(${merge.df}) = ${formatFixed(merge.statistic, 2)}`), view.merge.result);
    assert.ok(view.merge.description.includes(merge.reason));
    assert.deepEqual(view.tables.expected.marked, analysis.result.validity.sparseCells.map((cell) => [cell.row, cell.column]));
  });

  it('offers an exact test only when the rule fails and no exact p leads yet', () => {
    const withExact = analyzed(BUS_DEPOT_SPARSE);
    assert.ok(withExact.exact, 'auto p chooses the exact test for the sparse table');
    assert.equal(buildPanelView(withExact, 'k').canRunExact, false);
    const asymptotic = analyzed(BUS_DEPOT_SPARSE, { options: { pValueMethod: 'asymptotic' } });
    assert.equal(asymptotic.exact, undefined);
    assert.equal(buildPanelView(asymptotic, 'k').canRunExact, true);
  });

  it('lays a goodness-of-fit vector out in the table\'s row with standardized residuals and one set of bars', () => {
    const analysis = analyzed(BAKERY_RETURNS);
    const result = analysis.result;
    if (result.test !== 'goodness-of-fit') return assert.fail('expected a goodness-of-fit test');
    const view = buildPanelView(analysis, 'k');
    assert.ok(view.summary.endsWith(goodnessOfFitHeadline(result, plain(analysis), analysis.exact)));
    assert.deepEqual(view.tables.expected.rows, [[analysis.table.rowLabels[0], ...result.expected.map((e) => formatFixed(e, 1))]]);
    assert.deepEqual(view.tables.residuals.values, [result.standardizedResiduals]);
    assert.deepEqual(view.tables.residuals.marked, result.flaggedCells.map((cell) => [0, cell.index]));
    assert.ok(view.chart);
    assert.deepEqual(view.chart.rowProportions.map((b) => b.share), result.proportions.map((i) => i.estimate));
    assert.deepEqual(view.chart.columnProportions, []);
    assert.deepEqual(view.chart.mosaic, []);
    assert.deepEqual(view.tables.observed.header, ['Observed', ...analysis.table.columnLabels, 'Total']);
  });

  it('passes the engine\'s warnings through as messages', () => {
    const withTotals = `${SKI_SCHOOL}\n| Total | 74 | 27 |`;
    const analysis = analyzed(withTotals);
    assert.ok(analysis.warnings.length > 0, 'a totals row that does not add up gives a warning');
    assert.deepEqual(buildPanelView(analysis, 'k').warnings, analysis.warnings.map((w) => w.message));
  });

  it('keeps hostile labels as the same literal text in every table and chart', () => {
    const view = buildPanelView(withHostileLabels(analyzed(SKI_SCHOOL)), 'k');
    for (const table of Object.values(view.tables)) {
      assert.equal(table.header[1], HOSTILE_COLUMN);
      assert.equal(table.rows[0][0], HOSTILE_ROW);
    }
    assert.ok(view.chart);
    assert.equal(view.chart.rowProportions[0].group, HOSTILE_ROW);
    assert.equal(view.chart.columnProportions[0].group, HOSTILE_COLUMN);
    assert.equal(view.chart.mosaic[0].group, HOSTILE_ROW);
  });
});
