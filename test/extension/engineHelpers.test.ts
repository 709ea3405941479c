import assert from 'node:assert/strict';
import { analyze, analyzeCountTable } from '../../src/core/analyze';
import { fitCategories } from '../../src/extension/fitCategories';
import { mergedCountTable } from '../../src/extension/mergedCountTable';
import { rawDataColumns } from '../../src/extension/rawDataColumns';
import { withMarkup } from '../../src/extension/withMarkup';
import { assertClose } from '../helpers/assertClose';

// Invented: bus depot breakdowns by route; the "Doors" column is sparse, so Cochran's rule fails.
const SPARSE_DEPOT = [
  '| Route | Engine | Doors | Tyres |',
  '|---|---|---|---|',
  '| Green | 10 | 1 | 12 |',
  '| Blue | 9 | 0 | 14 |',
  '| Black | 11 | 2 | 8 |',
].join('\n');

// Invented: greenhouse seed packets by colour, tested against a 6:6:1:1 ratio (two thin classes).
const PACKETS = [
  '| Colour | Red | White | Striped | Speckled |',
  '|---|---|---|---|---|',
  '| Seedlings | 31 | 27 | 3 | 1 |',
].join('\n');

function analysed(text: string, fit?: string) {
  const result = analyze({ text, format: 'markdown', fit, options: { pValueMethod: 'asymptotic' } });
  assert.ok(result.ok, result.ok ? '' : result.issue.message);
  if (!result.ok) throw new Error('unreachable');
  return result.value;
}

describe('mergedCountTable', () => {
  it('re-analyses the merged independence table to the proposal\'s own statistic and df', () => {
    const analysis = analysed(SPARSE_DEPOT);
    const proposal = analysis.result.mergeProposal;
    assert.ok(proposal, 'the sparse table should come with a merge proposal');
    const merged = mergedCountTable(analysis);
    assert.ok(merged.ok);
    if (!merged.ok || !proposal) return;
    assert.deepEqual(merged.value.observed, proposal.observed);
    const again = analyzeCountTable(merged.value, analysis.origin, undefined, analysis.options);
    assert.ok(again.ok);
    if (!again.ok) return;
    assertClose(again.value.result.statistic, proposal.statistic, 1e-12, 'merged X²');
    assert.equal(again.value.result.df, proposal.df);
    assert.equal(again.value.table.startLine, analysis.table.startLine, 'the merged result belongs to the same table (same panel)');
  });

  it('re-tests pooled goodness-of-fit counts against their pooled expected counts', () => {
    const analysis = analysed(PACKETS, '6:6:1:1');
    const proposal = analysis.result.mergeProposal;
    assert.ok(proposal, 'the thin classes should come with a merge proposal');
    const merged = mergedCountTable(analysis);
    assert.ok(merged.ok, merged.ok ? '' : merged.issue.message);
    if (!merged.ok || !proposal) return;
    const again = analyzeCountTable(merged.value, analysis.origin, undefined, analysis.options);
    assert.ok(again.ok, again.ok ? '' : again.issue.message);
    if (!again.ok || again.value.result.test !== 'goodness-of-fit') return assert.fail('expected a goodness-of-fit result');
    assertClose(again.value.result.statistic, proposal.statistic, 1e-12, 'pooled X²');
    assert.equal(again.value.result.df, proposal.df);
    assertClose(again.value.result.expected.reduce((a, b) => a + b, 0), 62, 1e-12, 'pooled expected counts sum to N');
  });

  it('says so when there is nothing to merge', () => {
    const merged = mergedCountTable(analysed('| Lift | Up | Down |\n|---|---|---|\n| A | 40 | 38 |\n| B | 35 | 41 |'));
    assert.equal(merged.ok, false);
  });
});

describe('withMarkup', () => {
  it('re-renders the write-up exactly as an analysis in that markup would', () => {
    const plain = analyze({ text: SPARSE_DEPOT, format: 'markdown', options: { markup: 'plain', pValueMethod: 'asymptotic' } });
    const markdown = analyze({ text: SPARSE_DEPOT, format: 'markdown', options: { markup: 'markdown', pValueMethod: 'asymptotic' } });
    assert.ok(plain.ok && markdown.ok);
    if (!plain.ok || !markdown.ok) return;
    const converted = withMarkup(plain.value, 'markdown');
    assert.equal(converted.writeUp, markdown.value.writeUp);
    assert.equal(converted.expectedTable, markdown.value.expectedTable);
    assert.equal(converted.contributionsTable, markdown.value.contributionsTable);
    assert.equal(withMarkup(markdown.value, 'markdown'), markdown.value);
  });
});

describe('fitCategories', () => {
  it('gives the labels of a single row of counts', () => {
    const categories = fitCategories({ text: PACKETS, format: 'markdown', line: 3 });
    assert.deepEqual(categories.ok && categories.value, ['Red', 'White', 'Striped', 'Speckled']);
  });

  it('refuses a two-way table with what to do instead', () => {
    const categories = fitCategories({ text: SPARSE_DEPOT, format: 'markdown', line: 3 });
    assert.equal(categories.ok, false);
    assert.match(categories.ok ? '' : categories.issue.message, /single row or a single column.*3×3/);
  });

  it('passes on the engine\'s message when the cursor is not in a table', () => {
    const categories = fitCategories({ text: `Notes\n\n${PACKETS}`, format: 'markdown', line: 1 });
    assert.equal(categories.ok, false);
  });
});

describe('rawDataColumns', () => {
  it('lists the categorical columns of a one-row-per-observation log', () => {
    const lines = ['date,instructor,level,completed'];
    const instructors = ['Ines', 'Tomas', 'Mara'];
    const levels = ['novice', 'expert'];
    for (let day = 0; day < 30; day++) lines.push(`2026-01-${String((day % 28) + 1).padStart(2, '0')},${instructors[day % 3]},${levels[day % 2]},${day % 4 === 0 ? 'no' : 'yes'}`);
    assert.deepEqual(rawDataColumns(lines.join('\n')), ['instructor', 'level', 'completed']);
  });

  it('gives nothing for a table of counts', () => {
    assert.equal(rawDataColumns('level,passed,retake\nnovice,18,7\nexpert,22,3\n'), undefined);
  });
});
