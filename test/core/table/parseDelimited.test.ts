import assert from 'node:assert/strict';
import fc from 'fast-check';
import { parseDelimited } from '../../../src/core/table/parseDelimited';
import type { RawGrid, Result } from '../../../src/core/types';
import { anyText, assertPointsAt, textAt } from './tableTestKit';

function grid(result: Result<RawGrid>): RawGrid {
  assert.ok(result.ok, result.ok ? '' : result.issue.message);
  return result.value;
}

function texts(value: RawGrid): string[][] {
  return value.rows.map((row) => row.map((cell) => cell.text));
}

describe('parseDelimited', () => {
  it('detects commas, tabs, semicolons and pipes from consistent field counts', () => {
    const bakery = [['Loaf', 'Mon', 'Tue'], ['Rye', '31', '28'], ['Spelt', '12', '9']];
    for (const delimiter of [',', '\t', ';', '|']) {
      const value = grid(parseDelimited(bakery.map((row) => row.join(delimiter)).join('\n')));
      assert.equal(value.delimiter, delimiter);
      assert.deepEqual(texts(value), bakery);
    }
  });

  it('prefers the semicolon when commas inside its fields are decimal commas', () => {
    const value = grid(parseDelimited('Kiln;Fired;Cracked\nA;1,5;2\nB;3;4,5\n'));
    assert.equal(value.delimiter, ';');
    assert.deepEqual(texts(value)[1], ['A', '1,5', '2']);
  });

  it('does not split at a delimiter inside quotes when detecting or reading', () => {
    const value = grid(parseDelimited('Route,"Late, very",Early\nR1,"1,204",7\n'));
    assert.equal(value.delimiter, ',');
    assert.deepEqual(texts(value), [['Route', 'Late, very', 'Early'], ['R1', '1,204', '7']]);
  });

  it('reads doubled quotes and line breaks inside quoted fields, with the next cells on the right lines', () => {
    const document = 'Depot,Note,Buses\n"North ""old""","two\nlines",12\nSouth,x,3\n';
    const value = grid(parseDelimited(document));
    assert.deepEqual(texts(value), [['Depot', 'Note', 'Buses'], ['North "old"', 'two\nlines', '12'], ['South', 'x', '3']]);
    assert.deepEqual([value.rows[1][2].line, value.rows[1][2].column], [3, 8]);
    assert.deepEqual([value.rows[2][0].line, value.rows[2][0].column], [4, 1]);
    assert.equal(value.endLine, 4);
    assertPointsAt(document, value.rows[1][1], 'two');
  });

  it('handles CRLF, strips a byte order mark without shifting columns, and skips blank and empty rows', () => {
    const document = '\ufeffSlope,Falls\r\nBlue, 3\r\n\r\n,\r\nRed,5\r\n\r\n\r\n';
    const value = grid(parseDelimited(document));
    assert.deepEqual(texts(value), [['Slope', 'Falls'], ['Blue', '3'], ['Red', '5']]);
    assert.deepEqual(value.rows.map((row) => row[0].line), [1, 2, 5]);
    assert.deepEqual([value.rows[0][0].column, value.rows[1][1].column], [1, 7]);
    assert.equal(value.endLine, 5);
  });

  it('numbers lines from firstLine when the text is a selection', () => {
    const value = grid(parseDelimited('Tram,Late\nT4,7', { firstLine: 40 }));
    assert.deepEqual([value.startLine, value.endLine, value.rows[1][1].line, value.rows[1][1].column], [40, 41, 41, 4]);
  });

  it('uses a given delimiter and rejects one that cannot separate fields', () => {
    assert.deepEqual(texts(grid(parseDelimited('a:b\n1:2', { delimiter: ':' }))), [['a', 'b'], ['1', '2']]);
    const bad = parseDelimited('a,b', { delimiter: '"' });
    assert.equal(bad.ok, false);
    if (!bad.ok) assert.equal(bad.issue.code, 'bad-option');
  });

  it('drops edge columns that are empty in every row, as from |a|b| lines or trailing delimiters', () => {
    assert.deepEqual(texts(grid(parseDelimited('| Bed | Tomato |\n| East | 14 |'))), [['Bed', 'Tomato'], ['East', '14']]);
    assert.deepEqual(texts(grid(parseDelimited('Bed,Basil,,\nEast,9,,\n'))), [['Bed', 'Basil'], ['East', '9']]);
  });

  it('keeps ragged rows as they are so the table reader can name them', () => {
    assert.deepEqual(texts(grid(parseDelimited('a,b,c\n1,2\n3,4,5'))), [['a', 'b', 'c'], ['1', '2'], ['3', '4', '5']]);
  });

  it('reports an unclosed quote at the opening quote, saying what to add', () => {
    const document = 'Oven,Loaves\nRye,"31\nSpelt,12\n';
    const result = parseDelimited(document);
    assert.equal(result.ok, false);
    if (result.ok) return;
    assert.equal(result.issue.code, 'unreadable');
    assert.match(result.issue.message, /^line 2, column 5: this quoted field never closes; add the closing "/);
    assertPointsAt(document, result.issue.location, '"31');
  });

  it('reports text without data as no table, naming the first line', () => {
    const result = parseDelimited('\n  \n', { firstLine: 9 });
    assert.equal(result.ok, false);
    if (!result.ok) {
      assert.equal(result.issue.code, 'no-table');
      assert.match(result.issue.message, /^line 9, column 1: /);
    }
  });

  it('never throws on arbitrary text, and every cell on a line without quotes points at its own text', () => {
    fc.assert(fc.property(anyText, fc.option(fc.constantFrom(',', ';', '\t', '|'), { nil: undefined }), (document, delimiter) => {
      const result = parseDelimited(document, { delimiter });
      if (!result.ok) {
        assert.ok(result.issue.location && result.issue.location.line >= 1 && result.issue.location.column >= 1);
        return;
      }
      for (const row of result.value.rows) {
        for (const cell of row) {
          if (cell.text !== '' && !cell.text.includes('\n') && !textAt(document, { line: cell.line, column: 1 }).includes('"')) assertPointsAt(document, cell, cell.text);
        }
      }
    }), { numRuns: 2000 });
  });
});
