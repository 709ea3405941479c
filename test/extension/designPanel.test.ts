import assert from 'node:assert/strict';
import { analyze } from '../../src/core/analyze';
import type { Analysis, AnalyzeOptions } from '../../src/core/analysis';
import { pairedHeadline } from '../../src/core/report/writePaired';
import { formatFixed } from '../../src/core/report/formatNumber';
import { buildPanelView } from '../../src/extension/panelView';
import { readSettings } from '../../src/extension/settings';
import { parseScores } from '../../src/extension/tableShape';
import { isHostToPanel } from '../../src/protocol/messages';

// Invented tables (scenarios of our own): a sailing school's knot test before and after a lesson,
// a laundry's torn sheets by machine in three shifts, and a bakery's complaints by oven.
const KNOTS = '| Before \\ After | Tied | Not tied |\n|---|---|---|\n| Tied | 40 | 3 |\n| Not tied | 14 | 9 |\n';
const SHIFTS = ['## Early', '', '| Machine | Torn | Fine |', '|---|---|---|', '| Old | 9 | 91 |', '| New | 4 | 96 |', '',
  '## Late', '', '| Machine | Torn | Fine |', '|---|---|---|', '| Old | 12 | 70 |', '| New | 6 | 80 |', '',
  '## Night', '', '| Machine | Torn | Fine |', '|---|---|---|', '| Old | 5 | 40 |', '| New | 3 | 45 |', ''].join('\n');
const OVENS = '| Oven | Burnt | Pale | Fine |\n|---|---|---|---|\n| Deck | 12 | 3 | 85 |\n| Rack | 4 | 2 | 94 |\n| Tunnel | 25 | 9 | 66 |\n';

function analysed(text: string, options: Partial<AnalyzeOptions> = {}, line = 1): Analysis {
  const result = analyze({ text, format: 'markdown', line, options });
  if (!result.ok) assert.fail(result.issue.message);
  return result.value;
}

describe('results panel for study designs', () => {
  it('leads a paired view with McNemar and leaves out the independence tables and exact buttons', () => {
    const analysis = analysed(KNOTS, { design: 'paired' });
    const view = buildPanelView(analysis, 'k');
    assert.equal(view.kind, 'paired');
    assert.ok(view.summary.endsWith(pairedHeadline(analysis.paired!, { markup: 'plain' })), view.summary);
    assert.equal(view.canRunExact, false);
    const paired = (view.designSections ?? []).find((section) => section.id === 'paired');
    assert.ok(paired);
    assert.ok(paired.lines.some((line) => line.includes('3 Tied → Not tied, 14 Not tied → Tied')), paired.lines.join('\n'));
    assert.ok(isHostToPanel(JSON.parse(JSON.stringify({ type: 'show', view }))));
  });

  it('lists every stratum with its own counts and odds ratio, as the engine computed them', () => {
    const analysis = analysed(SHIFTS, { design: 'stratified' }, 3);
    const view = buildPanelView(analysis, 'k');
    assert.equal(view.kind, 'stratified');
    const strata = (view.designSections ?? []).find((section) => section.id === 'strata');
    assert.ok(strata?.table);
    assert.deepEqual(strata.table.rows.map((row) => row[0]), ['Early', 'Late', 'Night']);
    analysis.stratified!.strata.forEach((stratum, index) => {
      assert.deepEqual(strata.table!.rows[index].slice(2, 6), stratum.table.observed.flat().map(String));
      assert.equal(strata.table!.rows[index][6], formatFixed(analysis.stratified!.cmh.strata[index].oddsRatio!, 2));
    });
    assert.equal(view.validityOk, analysis.stratified!.mantelFleiss.ok);
    assert.match(view.tables.observed.caption, /^Strata summed/);
  });

  it('shows which groups differ after an r×c test and marks the adjusted p of differing pairs', () => {
    const analysis = analysed(OVENS);
    const view = buildPanelView(analysis, 'k');
    const pairwise = (view.designSections ?? []).find((section) => section.id === 'pairwise');
    assert.ok(pairwise?.table);
    const comparisons = analysis.followUps!.pairwise!.comparisons;
    assert.equal(pairwise.table.rows.length, comparisons.length);
    assert.deepEqual(pairwise.table.marked, comparisons.flatMap((pair, index) => (pair.differs ? [[index, 4]] : [])));
    assert.deepEqual(pairwise.table.rows.map((row) => row[5]), comparisons.map((pair) => (pair.differs ? 'yes' : 'no')));
  });

  it('reads the pairwise setting and reports a bad value once', () => {
    assert.equal(readSettings((key) => (key === 'pairwiseComparisons' ? 'bonferroni' : undefined)).options.pairwise, 'bonferroni');
    const bad = readSettings((key) => (key === 'pairwiseComparisons' ? 'tukey' : undefined));
    assert.equal(bad.options.pairwise, undefined);
    assert.match(bad.problems[0], /tallywise\.pairwiseComparisons is "tukey"; it must be "holm", "bonferroni" or "off"/);
  });

  it('checks typed scores: one number per category, not all equal; empty keeps equal spacing', () => {
    assert.deepEqual(parseScores('0, 1.5, 4', 3), { ok: true, value: [0, 1.5, 4] });
    assert.deepEqual(parseScores('  ', 3), { ok: true, value: undefined });
    const short = parseScores('1, 2', 3);
    assert.ok(!short.ok && /Give 3 scores/.test(short.issue.message));
    const text = parseScores('low, high, top', 3);
    assert.ok(!text.ok && /numbers separated by commas/.test(text.issue.message));
    assert.equal(parseScores('2,2,2', 3).ok, false);
  });
});
