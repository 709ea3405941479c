import assert from 'node:assert/strict';
import { analyze } from '../../src/core/analyze';
import { panelKey, tableLines } from '../../src/extension/analysisRecord';
import { chartFilePath, chartReference, isSafeSvg } from '../../src/extension/chartFiles';
import { composeInsertion } from '../../src/extension/composeInsertion';
import { editorRequest } from '../../src/extension/editorRequest';
import { savedView } from '../../src/extension/savedView';
import type { PanelView } from '../../src/protocol/messages';

// Invented: ski-school lesson outcomes.
const LESSONS = '# Week 2\n\n| Lesson | Passed | Not yet |\n|---|---|---|\n| Group | 41 | 19 |\n| Private | 33 | 7 |\n';

function lessonAnalysis(markup: 'markdown' | 'plain') {
  const result = analyze({ text: LESSONS, format: 'markdown', line: 4, options: { markup } });
  assert.ok(result.ok);
  if (!result.ok) throw new Error('unreachable');
  return result.value;
}

describe('composeInsertion', () => {
  it('is the write-up alone by default', () => {
    const analysis = lessonAnalysis('markdown');
    assert.deepEqual(composeInsertion(analysis, {}, { withExpectedTable: false, withChartLink: false }), { text: analysis.writeUp.trim(), missingChart: false });
  });

  it('adds the expected-count table and a Markdown image link, separated by blank lines', () => {
    const analysis = lessonAnalysis('markdown');
    const { text } = composeInsertion(analysis, { mosaic: 'week2-3-mosaic.svg' }, { withExpectedTable: true, withChartLink: true });
    assert.equal(text, [analysis.writeUp.trim(), analysis.expectedTable.trim(), '![Mosaic chart of the table](week2-3-mosaic.svg)'].join('\n\n'));
  });

  it('names the chart file in plain text for a plain-text note, and reports a missing chart', () => {
    const analysis = lessonAnalysis('plain');
    assert.match(composeInsertion(analysis, { proportions: 'n-3-proportions.svg' }, { withExpectedTable: false, withChartLink: true }).text, /\n\nProportions chart of the table: n-3-proportions\.svg$/);
    assert.equal(composeInsertion(analysis, {}, { withExpectedTable: false, withChartLink: true }).missingChart, true);
  });
});

describe('chartFiles', () => {
  it('names a chart after the document, the table line and the chart, beside the document', () => {
    assert.deepEqual(chartFilePath('/notes/ski school.md', 12, 'mosaic'), { path: '/notes/ski school-12-mosaic.svg', relative: 'ski school-12-mosaic.svg' });
  });

  it('wraps destinations with spaces in angle brackets', () => {
    assert.equal(chartReference('ski school-12-mosaic.svg', 'mosaic', true), '![Mosaic chart of the table](<ski school-12-mosaic.svg>)');
  });

  it('writes only plain SVG documents', () => {
    assert.equal(isSafeSvg('<svg xmlns="http://www.w3.org/2000/svg"><rect width="4" height="4"/></svg>'), true);
    assert.equal(isSafeSvg('<svg><script>alert(1)</script></svg>'), false);
    assert.equal(isSafeSvg('<svg><rect onload="x()"/></svg>'), false);
    assert.equal(isSafeSvg('<html><svg></svg></html>'), false);
  });
});

describe('analysisRecord', () => {
  it('keys a panel by document and table start line, so re-running the same table reuses it', () => {
    const analysis = lessonAnalysis('markdown');
    assert.equal(panelKey('file:///notes/week2.md', analysis), 'file:///notes/week2.md#3');
    assert.equal(tableLines(LESSONS, 3, 6), LESSONS.split('\n').slice(2, 6).join('\n'));
  });
});

describe('editorRequest', () => {
  const at = (line: number, character = 0) => ({ line, character });
  it('uses the cursor line when nothing is selected', () => {
    assert.deepEqual(editorRequest('x', 'markdown', { start: at(4), end: at(4), active: at(4), isEmpty: true }), { text: 'x', format: 'markdown', line: 5 });
  });

  it('leaves out the line a whole-line selection ends on', () => {
    const request = editorRequest('x', 'text', { start: at(2), end: at(6, 0), active: at(6, 0), isEmpty: false });
    assert.deepEqual(request.selection, { startLine: 3, endLine: 6 });
  });

  it('uses the CodeLens line when there is no selection', () => {
    assert.equal(editorRequest('x', 'markdown', undefined, 9).line, 10);
  });
});

describe('savedView', () => {
  const view = { key: 'file:///a.md#3', title: 't', summary: 's', writeUp: 'w', details: [], tables: {} } as unknown as PanelView;
  it('accepts the view itself or { view }', () => {
    assert.equal(savedView(view), view);
    assert.equal(savedView({ view }), view);
  });

  it('rejects anything else', () => {
    assert.equal(savedView(undefined), undefined);
    assert.equal(savedView({ view: { key: 1 } }), undefined);
    assert.equal(savedView('text'), undefined);
  });
});
