import assert from 'node:assert/strict';
import fc from 'fast-check';
import { locateTable } from '../../../src/core/table/locateTable';
import type { LocatedTable, TableRequest } from '../../../src/core/table/locateTable';
import type { Result } from '../../../src/core/types';
import { anyText, assertPointsAt, textAt } from './tableTestKit';

const notes = [
  '# Ski school, week 3', //            1
  '', //                                2
  '| Level | Sunny | Snowing |', //     3
  '|---|---|---|', //                   4
  '| Beginner | 14 | 6 |', //          5
  '| Expert | 9 | 11 |', //            6
  '', //                                7
  'Lift queue notes, nothing tabular.', // 8
  '', //                                9
  '| Lift | Waits |', //               10
  '|---|---|', //                       11
  '| Chair | 31 |', //                  12
  '', //                                13
  '```', //                             14
  '| not | a table |', //              15
  '|---|---|', //                       16
  '```', //                             17
  '', //                                18
  '| Hut | Meals |', //                 19
  '|---|---|', //                       20
  '| Top | 40 |', //                    21
].join('\n');

function located(result: Result<LocatedTable>): LocatedTable {
  assert.ok(result.ok, result.ok ? '' : result.issue.message);
  return result.value;
}

describe('locateTable', () => {
  describe('markdown', () => {
    it('takes the table containing the cursor line and says which of how many it is', () => {
      const found = located(locateTable(notes, { format: 'markdown', line: 11 }));
      assert.deepEqual([found.index, found.count, found.grid.startLine, found.grid.endLine], [2, 3, 10, 12]);
    });

    it('takes the first table a selection overlaps, even when it covers only part of it', () => {
      const found = located(locateTable(notes, { format: 'markdown', selection: { startLine: 8, endLine: 10 } }));
      assert.deepEqual([found.index, found.grid.startLine], [2, 10]);
    });

    it('takes table number K when asked, and says how many there are when K is too large', () => {
      assert.equal(located(locateTable(notes, { format: 'markdown', tableIndex: 3 })).grid.startLine, 19);
      const result = locateTable(notes, { format: 'markdown', tableIndex: 5 });
      assert.equal(result.ok, false);
      if (!result.ok) {
        assert.equal(result.issue.code, 'bad-option');
        assert.match(result.issue.message, /There are 3 tables in this document, so there is no table 5; choose a table from 1 to 3/);
      }
    });

    it('takes the first of several tables when nothing is chosen and reports the count', () => {
      const found = located(locateTable(notes, { format: 'markdown' }));
      assert.deepEqual([found.index, found.count, found.grid.startLine], [1, 3, 3]);
    });

    it('fails outside every table, naming the nearest table and what to do', () => {
      const result = locateTable(notes, { format: 'markdown', line: 15 });
      assert.equal(result.ok, false);
      if (result.ok) return;
      assert.equal(result.issue.code, 'no-table');
      assert.deepEqual(result.issue.location, { line: 15, column: 1 });
      assert.match(result.issue.message, /^line 15, column 1: line 15 is not inside a table; the nearest table is on lines 10-12 \(table 2 of 3\)\. Put the cursor inside it/);
      const selected = locateTable(notes, { format: 'markdown', selection: { startLine: 7, endLine: 8 } });
      assert.ok(!selected.ok && /lines 7-8 do not overlap a table; the nearest table is on lines 3-6/.test(selected.issue.message));
    });

    it('fails on a document without tables, saying what a table needs', () => {
      const result = locateTable('Just a note about the bakery.\n', { format: 'markdown', line: 1 });
      assert.ok(!result.ok && result.issue.code === 'no-table' && /delimiter row/.test(result.issue.message));
    });

    it('rejects lines and selections outside the document', () => {
      for (const request of [{ line: 99 }, { line: 0 }, { selection: { startLine: 5, endLine: 3 } }, { tableIndex: 0 }]) {
        const result = locateTable(notes, { format: 'markdown', ...request });
        assert.ok(!result.ok && result.issue.code === 'bad-option', JSON.stringify(request));
      }
    });
  });

  describe('delimited', () => {
    it('reads the whole text, or only the selected lines with document line numbers', () => {
      const document = 'Greenhouse export\nBed,Tomato,Basil\nEast,14,9\nWest,3,11\n';
      const whole = located(locateTable(document, { format: 'delimited' }));
      assert.equal(whole.grid.rows.length, 4);
      const part = located(locateTable(document, { format: 'delimited', selection: { startLine: 2, endLine: 4 } }));
      assert.deepEqual([part.grid.startLine, part.grid.endLine, part.index, part.count], [2, 4, 1, 1]);
      assertPointsAt(document, part.grid.rows[2][2], '11');
    });
  });

  describe('text', () => {
    const document = [
      'Bus depot, Monday', //                 1
      '', //                                  2
      '              Early   Late shift', //  3
      'North depot      12            7', //  4
      'South depot       3            4', //  5
      '', //                                  6
      'Route,On time,Late', //                7
      'R1,40,6', //                           8
      '', //                                  9
      '| Tram | Late |', //                  10
      '|---|---|', //                         11
      '| T4 | 7 |', //                        12
    ].join('\n');

    it('reads the aligned block around the cursor line', () => {
      const found = located(locateTable(document, { format: 'text', line: 4 }));
      assert.equal(found.grid.format, 'aligned');
      assert.deepEqual([found.grid.startLine, found.grid.endLine], [3, 5]);
      assertPointsAt(document, found.grid.rows[0][2], 'Late shift');
      assertPointsAt(document, found.grid.rows[2][1], '3');
    });

    it('reads a comma-separated block as delimited values', () => {
      const found = located(locateTable(document, { format: 'text', line: 8 }));
      assert.equal(found.grid.format, 'delimited');
      assert.deepEqual(found.grid.rows.map((row) => row.map((cell) => cell.text)), [['Route', 'On time', 'Late'], ['R1', '40', '6']]);
      assertPointsAt(document, found.grid.rows[1][1], '40');
    });

    it('prefers the Markdown table the cursor is in', () => {
      const found = located(locateTable(document, { format: 'text', line: 12 }));
      assert.equal(found.grid.format, 'markdown');
      assert.equal(found.grid.startLine, 10);
    });

    it('reads comma-and-space separated lines as delimited rather than splitting at the spaces', () => {
      const found = located(locateTable('Kiln, Fired, Cracked\nA, 12, 2\nB, 9, 4\n', { format: 'text', line: 2 }));
      assert.equal(found.grid.format, 'delimited');
      assert.deepEqual(found.grid.rows[1].map((cell) => cell.text), ['A', '12', '2']);
    });

    it('uses only the selected lines when there is a selection', () => {
      const found = located(locateTable(document, { format: 'text', selection: { startLine: 4, endLine: 6 } }));
      assert.deepEqual([found.grid.startLine, found.grid.endLine], [4, 5]);
    });

    it('fails on a blank line, saying where to put the cursor', () => {
      const result = locateTable(document, { format: 'text', line: 6 });
      assert.ok(!result.ok && result.issue.code === 'no-table');
      if (!result.ok) assert.match(result.issue.message, /^line 6, column 1: line 6 is blank; put the cursor on a line of the table/);
    });
  });

  it('never throws on arbitrary text and requests', () => {
    const request = fc.record({
      format: fc.constantFrom<TableRequest['format']>('markdown', 'delimited', 'text'),
      line: fc.option(fc.integer({ min: -2, max: 40 }), { nil: undefined }),
      selection: fc.option(fc.record({ startLine: fc.integer({ min: 0, max: 40 }), endLine: fc.integer({ min: 0, max: 40 }) }), { nil: undefined }),
      tableIndex: fc.option(fc.integer({ min: -1, max: 4 }), { nil: undefined }),
    });
    fc.assert(fc.property(anyText, request, (document, chosen) => {
      const result = locateTable(document, chosen);
      if (result.ok) {
        assert.ok(result.value.index >= 1 && result.value.index <= result.value.count);
        for (const row of result.value.grid.rows) {
          for (const cell of row) {
            if (cell.text !== '' && !cell.text.includes('\n') && !textAt(document, { line: cell.line, column: 1 }).includes('"')) assertPointsAt(document, cell, cell.text);
          }
        }
      } else {
        assert.ok(result.issue.message.length > 0);
      }
    }), { numRuns: 2000 });
  });
});
