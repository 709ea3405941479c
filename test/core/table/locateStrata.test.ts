import assert from 'node:assert/strict';
import fc from 'fast-check';
import { locateStrata } from '../../../src/core/table/locateStrata';
import type { StrataTables } from '../../../src/core/table/strataTables';
import type { Result } from '../../../src/core/types';
import { assertPointsAt } from './tableTestKit';

// The counts checked here are the ones written in each invented document, so the document is the outside
// reference: a stratum must come back with exactly the counts under its own labels.

/** An invented bakery note: late deliveries by van, one table per shift, written in three different styles. */
const bakery = [
  '# Bakery deliveries, March', //                       1
  '', //                                                 2
  'Late deliveries by van, counted per shift.', //       3
  '', //                                                 4
  '## Early shift', //                                   5
  '| Van | late | on time |', //                        6
  '|---|---|---|', //                                    7
  '| Blue van | 4 | 36 |', //                           8
  '| Red van | 9 | 31 |', //                            9
  '', //                                                 10
  '**Late shift:**', //                                  11
  '', //                                                 12
  '| Van | on time | late |', //                        13
  '|---|---|---|', //                                    14
  '| red van | 20 | 12 |', //                           15
  '| Blue van | 28 | 5 |', //                           16
  '| Total | 48 | 17 |', //                             17
  '', //                                                 18
  '| | Blue van | Red van |', //                        19
  '|---|---|---|', //                                    20
  '| late | 1 | 2 |', //                                21
  '| on time | 10 | 11 |', //                           22
  '', //                                                 23
  'The flour order, for comparison:', //                 24
  '', //                                                 25
  '| Flour | Rye | Spelt | Wheat |', //                  26
  '|---|---|---|---|', //                                27
  '| Sacks | 3 | 2 | 9 |', //                            28
].join('\n');

function strataOf(result: Result<StrataTables>): StrataTables {
  if (!result.ok) assert.fail(`expected strata, got ${result.issue.code}: ${result.issue.message}`);
  return result.value;
}

function issueOf(result: Result<StrataTables>, code: string): { message: string; line?: number } {
  if (result.ok) assert.fail(`expected ${code}, got ${result.value.strata.length} strata`);
  assert.equal(result.issue.code, code, result.issue.message);
  return { message: result.issue.message, line: result.issue.location?.line };
}

describe('locateStrata', () => {
  describe('a run of 2×2 tables in Markdown', () => {
    it('gathers the consecutive 2×2 tables around the cursor, names them, and aligns them to the first', () => {
      const found = strataOf(locateStrata(bakery, { format: 'markdown', line: 8 }));
      assert.deepEqual(found.strata.map((stratum) => stratum.label), ['Early shift', 'Late shift', 'Stratum 3']);
      assert.deepEqual(found.rowLabels, ['Blue van', 'Red van']);
      assert.deepEqual(found.columnLabels, ['late', 'on time']);
      // Table 2 lists both rows and columns the other way round and has a totals row; table 3 is transposed.
      assert.deepEqual(found.strata.map((stratum) => stratum.table.observed), [[[4, 36], [9, 31]], [[5, 28], [12, 20]], [[1, 10], [2, 11]]]);
      assert.deepEqual([found.firstIndex, found.lastIndex, found.count, found.startLine, found.endLine], [1, 3, 4, 6, 22]);
      for (const stratum of found.strata) {
        assert.deepEqual(stratum.table.rowLabels, found.rowLabels);
        assert.deepEqual(stratum.table.columnLabels, found.columnLabels);
      }
    });

    it('keeps each rearranged cell pointing at its own count in the document', () => {
      const found = strataOf(locateStrata(bakery, { format: 'markdown', line: 8 }));
      const lateShift = found.strata[1].table;
      assertPointsAt(bakery, lateShift.cellLocations?.[0][0], '5 |');
      assertPointsAt(bakery, lateShift.cellLocations?.[1][1], '20 |');
      assertPointsAt(bakery, found.strata[2].table.cellLocations?.[0][1], '10 |');
    });

    it('notes each rearranged table and the table that ends the run', () => {
      const found = strataOf(locateStrata(bakery, { format: 'markdown', line: 8 }));
      const messages = found.notes.map((note) => `${note.location?.line}: ${note.message}`);
      assert.equal(found.notes.length, 3, messages.join('\n'));
      assert.ok(found.notes.every((note) => note.code === 'strata'));
      assert.ok(messages.some((message) => /^13: .*same labels in another order; it was rearranged/.test(message)), messages.join('\n'));
      assert.ok(messages.some((message) => /^19: .*rows and columns the other way round/.test(message)), messages.join('\n'));
      assert.ok(messages.some((message) => /^26: .*strata end before this table: the table on lines 26-28 is 1×3/.test(message)), messages.join('\n'));
    });

    it('finds the same run from any of its tables, and by table number', () => {
      const expected = strataOf(locateStrata(bakery, { format: 'markdown', line: 8 }));
      for (const request of [{ line: 15 }, { line: 21 }, { tableIndex: 2 }, { tableIndex: 3 }, {}]) {
        const found = strataOf(locateStrata(bakery, { format: 'markdown', ...request }));
        assert.deepEqual(found.strata.map((stratum) => stratum.table.observed), expected.strata.map((stratum) => stratum.table.observed), JSON.stringify(request));
        assert.deepEqual([found.firstIndex, found.lastIndex], [1, 3]);
      }
    });

    it('takes exactly the tables a selection overlaps', () => {
      const found = strataOf(locateStrata(bakery, { format: 'markdown', selection: { startLine: 9, endLine: 14 } }));
      assert.deepEqual(found.strata.map((stratum) => stratum.label), ['Early shift', 'Late shift']);
      assert.deepEqual([found.firstIndex, found.lastIndex, found.startLine, found.endLine], [1, 2, 6, 17]);
    });

    it('refuses a selection with a table that does not fit, naming that table', () => {
      const { message, line } = issueOf(locateStrata(bakery, { format: 'markdown', selection: { startLine: 19, endLine: 28 } }), 'strata');
      assert.equal(line, 26);
      assert.match(message, /the selection covers 2 tables, but the table on lines 26-28 is 1×3/);
      assert.match(message, /Put the strata as 2×2 tables one after another with the same row and column labels/);
    });

    it('says so when the cursor is in a table that is not 2×2', () => {
      const { message, line } = issueOf(locateStrata(bakery, { format: 'markdown', line: 28 }), 'strata');
      assert.equal(line, 26);
      assert.match(message, /^line 26, column 3: the table on lines 26-28 is 1×3 \(after totals are left out\); a stratified analysis needs 2×2 tables/);
    });

    it('says so when a 2×2 table has no neighbour that fits, and why', () => {
      const alone = ['## Van check', '| | late | on time |', '|---|---|---|', '| Blue van | 4 | 36 |', '| Red van | 9 | 31 |', '',
        '## Oven check', '| | burnt | fine |', '|---|---|---|', '| Rye | 2 | 30 |', '| Spelt | 1 | 28 |'].join('\n');
      const { message, line } = issueOf(locateStrata(alone, { format: 'markdown', line: 4 }), 'strata');
      assert.equal(line, 2);
      assert.match(message, /the table on lines 2-5 is the only stratum found; a stratified analysis needs two or more 2×2 tables/);
      assert.match(message, /the table on lines 8-11 has other labels \(rows "Rye" and "Spelt", columns "burnt" and "fine"\)/);
      const lonely = issueOf(locateStrata(alone.split('\n').slice(0, 5).join('\n'), { format: 'markdown' }), 'strata');
      assert.match(lonely.message, /No other 2×2 table stands right before or after it/);
    });

    it('stops at a long paragraph or a list between tables', () => {
      const table = (late: number): string[] => ['| | late | on time |', '|---|---|---|', `| Blue van | ${late} | 36 |`, '| Red van | 9 | 31 |'];
      const paragraph = ['', 'First line of a longer remark about the week.', 'Second line of it.', 'Third line.', 'Fourth line.', ''];
      const twoParagraphs = ['', 'One remark.', '', 'Another remark.', ''];
      const list = ['', '- a list item', ''];
      for (const between of [paragraph, twoParagraphs, list]) {
        const document = [...table(1), ...between, ...table(2)].join('\n');
        issueOf(locateStrata(document, { format: 'markdown', line: 1 }), 'strata');
      }
      const joined = strataOf(locateStrata([...table(1), '', '### Thursday', 'Rain all day:', '', ...table(2)].join('\n'), { format: 'markdown', line: 1 }));
      assert.deepEqual(joined.strata.map((stratum) => stratum.label), ['Stratum 1', 'Rain all day']);
    });

    it('names strata by setext headings, trailing #s and emphasis, and by distinct corner cells', () => {
      const document = ['Early', '=====', '| Shift A | late | on time |', '|---|---|---|', '| Blue | 1 | 2 |', '| Red | 3 | 4 |', '',
        '| Shift B | late | on time |', '|---|---|---|', '| Blue | 5 | 6 |', '| Red | 7 | 8 |', '',
        '### _Night_ ###', '| Shift C | late | on time |', '|---|---|---|', '| Blue | 9 | 10 |', '| Red | 11 | 12 |'].join('\n');
      const found = strataOf(locateStrata(document, { format: 'markdown' }));
      assert.deepEqual(found.strata.map((stratum) => stratum.label), ['Early', 'Shift B', 'Night']);
    });

    it('numbers repeated names, and replaces a repeated corner cell (a variable name) by "Stratum k"', () => {
      const table = (corner: string, late: number): string[] => [`| ${corner} | late | on time |`, '|---|---|---|', `| Blue | ${late} | 2 |`, '| Red | 3 | 4 |'];
      const corners = strataOf(locateStrata([...table('Van', 1), '', ...table('Van', 2)].join('\n'), { format: 'markdown' }));
      assert.deepEqual(corners.strata.map((stratum) => stratum.label), ['Stratum 1', 'Stratum 2']);
      const headings = strataOf(locateStrata(['## Route', ...table('', 1), '', '## Route', ...table('', 2)].join('\n'), { format: 'markdown' }));
      assert.deepEqual(headings.strata.map((stratum) => stratum.label), ['Route (1)', 'Route (2)']);
    });

    it('keeps a stratum whose group has no cases, so every stratum stays 2×2', () => {
      const document = ['## Mon', '| | late | on time |', '|---|---|---|', '| Blue | 0 | 0 |', '| Red | 3 | 4 |', '',
        '## Tue', '| | late | on time |', '|---|---|---|', '| Blue | 2 | 5 |', '| Red | 1 | 4 |'].join('\n');
      const found = strataOf(locateStrata(document, { format: 'markdown' }));
      assert.deepEqual(found.strata[0].table.observed, [[0, 0], [3, 4]]);
    });

    it('passes on the reader\'s issue when the cursor\'s table has a bad count', () => {
      const document = ['| | late | on time |', '|---|---|---|', '| Blue | 4 | many |', '| Red | 3 | 4 |'].join('\n');
      const result = locateStrata(document, { format: 'markdown', line: 3 });
      assert.equal(result.ok, false);
      if (!result.ok) assertPointsAt(document, result.issue.location, 'many');
    });

    it('refuses delimited files and a document without tables with a remedy', () => {
      assert.match(issueOf(locateStrata('van,late\nBlue,3\n', { format: 'delimited' }), 'bad-option').message, /stratum column/);
      issueOf(locateStrata('No tables here.\n', { format: 'markdown' }), 'no-table');
    });
  });

  describe('plain text', () => {
    it('reads aligned tables separated by blank lines, each named by the line above it', () => {
      const ferry = ['Ferry log, week 12', '', 'North route', '          sick  well', 'ginger       3    40', 'none        11    30', '',
        'South route', '          well  sick', 'none        20     9', 'ginger      22     5'].join('\n');
      const found = strataOf(locateStrata(ferry, { format: 'text', line: 5 }));
      assert.deepEqual(found.strata.map((stratum) => stratum.label), ['North route', 'South route']);
      assert.deepEqual(found.strata.map((stratum) => stratum.table.observed), [[[3, 40], [11, 30]], [[5, 22], [9, 20]]]);
      assert.deepEqual([found.startLine, found.endLine, found.count], [4, 11, 2]);
      assert.equal(strataOf(locateStrata(ferry, { format: 'text', tableIndex: 2 })).strata.length, 2);
    });
  });

  describe('properties', () => {
    interface StratumModel {
      heading: string;
      counts: number[][];
      swapRows: boolean;
      swapColumns: boolean;
      transpose: boolean;
      upperCase: boolean;
      totals: boolean;
    }

    const stratumArbitrary: fc.Arbitrary<StratumModel> = fc.record({
      heading: fc.constantFrom('## Van %', '**Shift %:**', 'Route %', '### Kiln %', ''),
      counts: fc.array(fc.array(fc.nat({ max: 400 }), { minLength: 2, maxLength: 2 }), { minLength: 2, maxLength: 2 }),
      swapRows: fc.boolean(),
      swapColumns: fc.boolean(),
      transpose: fc.boolean(),
      upperCase: fc.boolean(),
      totals: fc.boolean(),
    }).filter(({ counts }) => counts.flat().some((value) => value > 0));

    function render(stratum: StratumModel, position: number): string[] {
      let rows = ['Blue van', 'Red van'];
      let columns = ['late', 'on time'];
      let counts = stratum.counts.map((row) => [...row]);
      if (stratum.swapRows) { rows = [rows[1], rows[0]]; counts = [counts[1], counts[0]]; }
      if (stratum.swapColumns) { columns = [columns[1], columns[0]]; counts = counts.map((row) => [row[1], row[0]]); }
      if (stratum.transpose) { [rows, columns] = [columns, rows]; counts = [[counts[0][0], counts[1][0]], [counts[0][1], counts[1][1]]]; }
      if (stratum.upperCase) rows = rows.map((label) => ` ${label.toUpperCase()} `);
      const lines = stratum.heading ? [stratum.heading.replace('%', String(position + 1)), ''] : [];
      lines.push(`| | ${columns.join(' | ')} |${stratum.totals ? ' Total |' : ''}`, '|---|---|---|' + (stratum.totals ? '---|' : ''));
      counts.forEach((row, index) => lines.push(`| ${rows[index]} | ${row.join(' | ')} |${stratum.totals ? ` ${row[0] + row[1]} |` : ''}`));
      return [...lines, ''];
    }

    it('gives back every stratum\'s counts under the first stratum\'s labels, from any table of the run (fast-check, 200 runs)', () => {
      fc.assert(
        fc.property(fc.array(stratumArbitrary, { minLength: 2, maxLength: 6 }), fc.nat(), (strata, pick) => {
          const document = ['# Deliveries', '', ...strata.flatMap(render)].join('\n');
          const tableLines = document.split('\n').map((line, index) => (line.startsWith('| ') ? index + 1 : 0)).filter((line) => line > 0);
          const found = strataOf(locateStrata(document, { format: 'markdown', line: tableLines[pick % tableLines.length] }));
          assert.equal(found.strata.length, strata.length);
          const first = strata[0];
          const rowOrder = first.transpose ? (first.swapColumns ? [1, 0] : [0, 1]) : (first.swapRows ? [1, 0] : [0, 1]);
          const columnOrder = first.transpose ? (first.swapRows ? [1, 0] : [0, 1]) : (first.swapColumns ? [1, 0] : [0, 1]);
          const [groupOrder, outcomeOrder] = first.transpose ? [columnOrder, rowOrder] : [rowOrder, columnOrder];
          strata.forEach((stratum, index) => {
            // counts[g][o] in canonical order; the first stratum's layout decides which is a row.
            const canonical = (g: number, o: number): number => stratum.counts[groupOrder[g]][outcomeOrder[o]];
            const expected = first.transpose
              ? [[canonical(0, 0), canonical(1, 0)], [canonical(0, 1), canonical(1, 1)]]
              : [[canonical(0, 0), canonical(0, 1)], [canonical(1, 0), canonical(1, 1)]];
            assert.deepEqual(found.strata[index].table.observed, expected, `stratum ${index + 1}\n${document}`);
            // Without a heading of its own, the first stratum takes the document's title, the nearest heading above it.
            const unnamed = index === 0 ? 'Deliveries' : `Stratum ${index + 1}`;
            assert.equal(found.strata[index].label, stratum.heading ? stratum.heading.replace('%', String(index + 1)).replace(/[#*:]/g, '').trim() : unnamed);
          });
        }),
        { seed: 20261202, numRuns: 200 },
      );
    });

    it('never throws on arbitrary text and requests (fast-check, 500 runs)', () => {
      const unit = fc.constantFrom('|', '-', ':', ' ', '\n', '#', '*', 'a', 'B', '1', '7', '0', 'Total', '\r\n', '---', '> ', '```');
      fc.assert(
        fc.property(fc.string({ unit, maxLength: 300 }), fc.constantFrom<'markdown' | 'text'>('markdown', 'text'), fc.nat(40), fc.nat(40), (text, format, a, b) => {
          const lineCount = text.split(/\r\n|\r|\n/).length;
          const line = 1 + (a % lineCount);
          const requests = [{ line }, { tableIndex: 1 + (b % 4) }, { selection: { startLine: Math.min(line, 1 + (b % lineCount)), endLine: Math.max(line, 1 + (b % lineCount)) } }, {}];
          for (const request of requests) {
            const result = locateStrata(text, { format, ...request });
            if (result.ok) {
              assert.ok(result.value.strata.length >= 2);
              for (const stratum of result.value.strata) assert.deepEqual(stratum.table.observed.map((row) => row.length), [2, 2]);
            } else {
              assert.ok(result.issue.message.length > 20, result.issue.message);
            }
          }
        }),
        { seed: 44, numRuns: 500 },
      );
    });
  });
});
