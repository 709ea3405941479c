import assert from 'node:assert/strict';
import fc from 'fast-check';
import { findMarkdownTables } from '../../../src/core/table/findMarkdownTables';
import type { RawGrid } from '../../../src/core/types';
import { anyText, assertPointsAt } from './tableTestKit';

function texts(grid: RawGrid): string[][] {
  return grid.rows.map((row) => row.map((cell) => cell.text));
}

describe('findMarkdownTables', () => {
  describe('GitHub Flavored Markdown Spec 0.29-gfm, section 4.10 Tables (examples from memory)', () => {
    it('example 198: reads a header row, a delimiter row and a body row', () => {
      const tables = findMarkdownTables('| foo | bar |\n| --- | --- |\n| baz | bim |\n');
      assert.equal(tables.length, 1);
      assert.deepEqual(texts(tables[0]), [['foo', 'bar'], ['baz', 'bim']]);
      assert.equal(tables[0].startLine, 1);
      assert.equal(tables[0].endLine, 3);
    });

    it('example 199: accepts alignment colons and rows without leading or trailing pipes', () => {
      const tables = findMarkdownTables('| abc | defghi |\n:-: | -----------:\nbar | baz\n');
      assert.deepEqual(texts(tables[0]), [['abc', 'defghi'], ['bar', 'baz']]);
    });

    it('example 200: an escaped pipe does not split a cell, inside code spans and emphasis too', () => {
      const tables = findMarkdownTables('| f\\|oo  |\n| ------ |\n| b `\\|` az |\n| b **\\|** im |\n');
      assert.deepEqual(texts(tables[0]), [['f\\|oo'], ['b `\\|` az'], ['b **\\|** im']]);
    });

    it('example 201: a block quote ends the table', () => {
      const tables = findMarkdownTables('| abc | def |\n| --- | --- |\n| bar | baz |\n> bar\n');
      assert.deepEqual(texts(tables[0]), [['abc', 'def'], ['bar', 'baz']]);
      assert.equal(tables[0].endLine, 3);
    });

    it('example 202: a line without pipes continues the table until a blank line', () => {
      const tables = findMarkdownTables('| abc | def |\n| --- | --- |\n| bar | baz |\nbar\n\nbar\n');
      assert.deepEqual(texts(tables[0]), [['abc', 'def'], ['bar', 'baz'], ['bar']]);
      assert.equal(tables[0].endLine, 4);
    });

    it('example 203: a delimiter row with a different number of cells makes no table', () => {
      assert.deepEqual(findMarkdownTables('| abc | def |\n| --- |\n| bar |\n'), []);
    });

    it('example 204: body rows keep their own number of cells so a later check can name them', () => {
      const tables = findMarkdownTables('| abc | def |\n| --- | --- |\n| bar |\n| bar | baz | boo |\n');
      assert.deepEqual(texts(tables[0]), [['abc', 'def'], ['bar'], ['bar', 'baz', 'boo']]);
    });

    it('example 205: a header and delimiter row alone are a table without body rows', () => {
      const tables = findMarkdownTables('| abc | def |\n| --- | --- |\n');
      assert.deepEqual(texts(tables[0]), [['abc', 'def']]);
      assert.equal(tables[0].endLine, 2);
    });
  });

  it('gives each cell the 1-based column where its trimmed text starts', () => {
    const document = 'Greenhouse log\n\n|  Bed   | Tomato | Basil |\n|--------|-------:|:-----:|\n| East   |     14 |   **9** |\n';
    const [table] = findMarkdownTables(document);
    assert.deepEqual(table.rows[0].map((cell) => [cell.line, cell.column]), [[3, 4], [3, 12], [3, 21]]);
    for (const row of table.rows) for (const cell of row) assertPointsAt(document, cell, cell.text);
    assert.equal(table.rows[1][2].text, '**9**');
  });

  it('splits cells at pipes inside code spans, as the spec says, unless the pipe is escaped', () => {
    const [table] = findMarkdownTables('| Oven | Note |\n|---|---|\n| Rye | `a|b` |\n| Spelt | `a\\|b` |\n');
    assert.deepEqual(texts(table).slice(1), [['Rye', '`a', 'b`'], ['Spelt', '`a\\|b`']]);
  });

  it('finds several tables in one file, in order, with their own line ranges', () => {
    const document = [
      '# Bakery week', '', '| Loaf | Sold |', '| --- | --- |', '| Rye | 31 |', '', 'Some words.', '',
      'Route | Late', '--- | ---', 'R1 | 4', 'R2 | 6', '', '|Kiln|Cracked|', '|:-|-:|', '|A|2|',
    ].join('\n');
    const tables = findMarkdownTables(document);
    assert.deepEqual(tables.map((table) => [table.startLine, table.endLine]), [[3, 5], [9, 12], [14, 16]]);
    assert.deepEqual(texts(tables[2]), [['Kiln', 'Cracked'], ['A', '2']]);
  });

  it('ignores tables inside backtick and tilde fences, and resumes after the fence closes', () => {
    const document = [
      '```markdown', '| a | b |', '|---|---|', '| 1 | 2 |', '```', '',
      '~~~~', '| c | d |', '|---|---|', '~~~', 'still code', '~~~~', '',
      '| Slope | Falls |', '|---|---|', '| Blue | 3 |',
    ].join('\n');
    const tables = findMarkdownTables(document);
    assert.equal(tables.length, 1);
    assert.equal(tables[0].startLine, 14);
  });

  it('treats a header row indented four or more spaces as indented code', () => {
    assert.deepEqual(findMarkdownTables('    | a | b |\n    |---|---|\n    | 1 | 2 |\n'), []);
    assert.deepEqual(findMarkdownTables('\t| a | b |\n\t|---|---|\n'), []);
    assert.equal(findMarkdownTables('   | a | b |\n   |---|---|\n').length, 1);
  });

  it('ignores tables in HTML comments and raw-text HTML blocks', () => {
    const document = '<!--\n| a | b |\n|---|---|\n-->\n<pre>\n| c | d |\n|---|---|\n</pre>\n\n| e | f |\n|---|---|\n';
    const tables = findMarkdownTables(document);
    assert.equal(tables.length, 1);
    assert.equal(tables[0].startLine, 10);
  });

  it('ends a table at a heading, a list item or a fence as well as at a blank line', () => {
    const document = '| a | b |\n|---|---|\n| 1 | 2 |\n## Next\n| c | d |\n|---|---|\n- item\n';
    const tables = findMarkdownTables(document);
    assert.deepEqual(tables.map((table) => [table.startLine, table.endLine]), [[1, 3], [5, 6]]);
  });

  it('does not take a setext heading or a thematic break for a delimiter row', () => {
    assert.deepEqual(findMarkdownTables('Bus depot\n---\n\ntext\n***\n'), []);
    assert.deepEqual(findMarkdownTables('a | b\n-- -- \n'), []);
  });

  it('counts lines across CRLF and lone CR endings and does not let a byte order mark shift columns', () => {
    const document = '\ufeff| Tram | Late |\r\n|---|---|\r\n| T4 | 7 |\r| T5 | 2 |\n';
    const [table] = findMarkdownTables(document);
    assert.equal(table.endLine, 4);
    assert.deepEqual([table.rows[0][0].line, table.rows[0][0].column], [1, 3]);
    assert.deepEqual([table.rows[2][1].line, table.rows[2][1].column], [4, 8]);
  });

  it('keeps markup in cell text and gives an empty cell a position after its pipe', () => {
    const [table] = findMarkdownTables('| **Total** | |\n|---|---|\n');
    assert.deepEqual(table.rows[0].map((cell) => [cell.text, cell.column]), [['**Total**', 3], ['', 14]]);
  });

  it('never throws on arbitrary text and every cell points at its own text', () => {
    fc.assert(fc.property(anyText, (document) => {
      for (const table of findMarkdownTables(document)) {
        assert.ok(table.startLine >= 1 && table.endLine >= table.startLine + 1);
        for (const row of table.rows) for (const cell of row) if (cell.text !== '') assertPointsAt(document, cell, cell.text);
      }
    }), { numRuns: 2000 });
  });
});
