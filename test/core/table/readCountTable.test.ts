import assert from 'node:assert/strict';
import fc from 'fast-check';
import { findMarkdownTables } from '../../../src/core/table/findMarkdownTables';
import { parseAligned } from '../../../src/core/table/parseAligned';
import { parseDelimited } from '../../../src/core/table/parseDelimited';
import { readCountTable } from '../../../src/core/table/readCountTable';
import type { CountTable, IssueCode, RawGrid, Result } from '../../../src/core/types';
import { anyText, assertPointsAt, countScenarioArbitrary, tableishText } from './tableTestKit';
import type { CountScenario } from './tableTestKit';

function markdownGrid(document: string): RawGrid {
  const tables = findMarkdownTables(document);
  assert.equal(tables.length, 1, 'expected one Markdown table');
  return tables[0];
}

function delimitedGrid(document: string): RawGrid {
  const result = parseDelimited(document);
  assert.ok(result.ok, result.ok ? '' : result.issue.message);
  return result.value;
}

function alignedGrid(document: string): RawGrid {
  const result = parseAligned(document);
  assert.ok(result.ok, result.ok ? '' : result.issue.message);
  return result.value;
}

function table(result: Result<CountTable>): CountTable {
  assert.ok(result.ok, result.ok ? '' : result.issue.message);
  return result.value;
}

/** Asserts a failure with the code, a message opening with the location, and the location on `offending` in the document. */
function expectFailure(document: string, result: Result<CountTable>, code: IssueCode, offending: string, mentions?: RegExp): void {
  assert.equal(result.ok, false, 'expected the table to be rejected');
  if (result.ok) return;
  assert.equal(result.issue.code, code, result.issue.message);
  const location = result.issue.location;
  assert.ok(location);
  assert.ok(result.issue.message.startsWith(`line ${location.line}, column ${location.column}: `), result.issue.message);
  assertPointsAt(document, location, offending);
  if (mentions) assert.match(result.issue.message, mentions);
}

describe('readCountTable', () => {
  describe('layout', () => {
    it('reads a first column of scale points 0, 1, 2 under a named corner as ordered labels, not counts', () => {
      // Invented: a dog school's recall successes (columns) by number of lessons attended (rows).
      const document = '| Lessons | 0 | 1-2 | 3+ |\n|---|---|---|---|\n| 0 | 12 | 5 | 2 |\n| 1 | 8 | 9 | 4 |\n| 2 | 3 | 7 | 11 |\n';
      const value = table(readCountTable(markdownGrid(document)));
      assert.deepEqual(value.rowLabels, ['0', '1', '2']);
      assert.deepEqual(value.observed, [[12, 5, 2], [8, 9, 4], [3, 7, 11]]);
      assert.equal(value.rowsOrdered, true);
      assert.equal(value.columnsOrdered, true);
    });

    it('still reads a first column of counts as counts when they are not consecutive from 0 or 1', () => {
      const document = '| Lessons | 0 | 1-2 | 3+ |\n|---|---|---|---|\n| 4 | 12 | 5 | 2 |\n| 8 | 8 | 9 | 4 |\n| 3 | 3 | 7 | 11 |\n';
      const value = table(readCountTable(markdownGrid(document)));
      assert.equal(value.generatedRowLabels, true);
      assert.deepEqual(value.observed[0], [4, 12, 5, 2]);
    });

    it('reads a Markdown table with a header row, a row-label column and a corner title', () => {
      const document = '| Lesson level | Sunny | Snowing |\n|---|--:|--:|\n| Beginner | 14 | 6 |\n| Expert | 9 | 11 |\n';
      const value = table(readCountTable(markdownGrid(document)));
      assert.deepEqual(value.rowLabels, ['Beginner', 'Expert']);
      assert.deepEqual(value.columnLabels, ['Sunny', 'Snowing']);
      assert.deepEqual(value.observed, [[14, 6], [9, 11]]);
      assert.equal(value.format, 'markdown');
      assert.deepEqual([value.startLine, value.endLine], [1, 4]);
      assert.deepEqual([value.generatedRowLabels, value.generatedColumnLabels], [false, false]);
      assertPointsAt(document, value.cellLocations![1][1], '11');
      assert.deepEqual(value.warnings, []);
    });

    it('treats an empty corner above numeric labels as a header row with a label column', () => {
      const document = ',2023,2024\nNorth depot,12,7\nSouth depot,3,4\n';
      const value = table(readCountTable(delimitedGrid(document)));
      assert.deepEqual(value.columnLabels, ['2023', '2024']);
      assert.deepEqual(value.rowLabels, ['North depot', 'South depot']);
      assert.equal(value.columnsOrdered, true);
    });

    it('reads labelled rows of counts without a header row as counts, not as a header', () => {
      const value = table(readCountTable(delimitedGrid('North,12,7\nSouth,3,4\n')));
      assert.deepEqual(value.rowLabels, ['North', 'South']);
      assert.deepEqual(value.observed, [[12, 7], [3, 4]]);
      assert.deepEqual([value.generatedRowLabels, value.generatedColumnLabels], [false, true]);
      const list = table(readCountTable(delimitedGrid('Green,40\nBlue,25\nBlack,10\n')));
      assert.deepEqual(list.observed, [[40], [25], [10]]);
    });

    it('takes years in order for labels, above the counts beside a title or down the first column', () => {
      const across = table(readCountTable(delimitedGrid('Depot,2023,2024\nNorth,12,7\nSouth,3,4\n')));
      assert.deepEqual([across.columnLabels, across.rowLabels], [['2023', '2024'], ['North', 'South']]);
      const down = table(readCountTable(delimitedGrid('Year,Late,On time\n2022,12,40\n2023,9,44\n')));
      assert.deepEqual([down.rowLabels, down.columnLabels, down.observed], [['2022', '2023'], ['Late', 'On time'], [[12, 40], [9, 44]]]);
      assert.equal(down.rowsOrdered, true);
    });

    it('keeps a Markdown header of numbers as column labels, as GFM makes it a header', () => {
      const value = table(readCountTable(markdownGrid('| 0 | 1 | 2 |\n|---|---|---|\n| 31 | 12 | 4 |\n')));
      assert.deepEqual(value.columnLabels, ['0', '1', '2']);
      assert.deepEqual(value.rowLabels, ['Row 1']);
      assert.deepEqual([value.generatedRowLabels, value.generatedColumnLabels], [true, false]);
    });

    it('generates labels for a table of numbers only', () => {
      const value = table(readCountTable(delimitedGrid('12,7,3\n4,9,8\n')));
      assert.deepEqual(value.rowLabels, ['Row 1', 'Row 2']);
      assert.deepEqual(value.columnLabels, ['Column A', 'Column B', 'Column C']);
      assert.deepEqual([value.generatedRowLabels, value.generatedColumnLabels], [true, true]);
      assert.deepEqual([value.rowsOrdered, value.columnsOrdered], [false, false]);
    });

    it('generates column labels for a Markdown table whose header row is empty', () => {
      const value = table(readCountTable(markdownGrid('| | |\n|---|---|\n| Rye | 31 |\n| Spelt | 12 |\n')));
      assert.deepEqual(value.columnLabels, ['Column A']);
      assert.deepEqual(value.rowLabels, ['Rye', 'Spelt']);
      assert.equal(value.generatedColumnLabels, true);
    });

    it('reads one-row and one-column tables (goodness of fit)', () => {
      const row = table(readCountTable(markdownGrid('| Red | Blue | Black |\n|---|---|---|\n| 40 | 25 | 10 |\n')));
      assert.deepEqual(row.observed, [[40, 25, 10]]);
      const column = table(readCountTable(delimitedGrid('Run colour,Skiers\nGreen,40\nBlue,25\nBlack,10\n')));
      assert.deepEqual(column.observed, [[40], [25], [10]]);
      assert.deepEqual(column.rowLabels, ['Green', 'Blue', 'Black']);
      assert.deepEqual(column.columnLabels, ['Skiers']);
    });

    it('reads a CSV header written without a corner cell', () => {
      const value = table(readCountTable(delimitedGrid('Early,Late\nR1,4,6\nR2,8,1\n')));
      assert.deepEqual(value.columnLabels, ['Early', 'Late']);
      assert.deepEqual(value.rowLabels, ['R1', 'R2']);
    });

    it('strips markup from labels and counts', () => {
      const value = table(readCountTable(markdownGrid('| Bed | *Tomato* | `Basil` |\n|---|---|---|\n| [East](beds.md) | **14** | 9 |\n| West | 3 | 2 |\n')));
      assert.deepEqual(value.columnLabels, ['Tomato', 'Basil']);
      assert.deepEqual(value.rowLabels, ['East', 'West']);
      assert.deepEqual(value.observed[0], [14, 9]);
    });

    it('marks numeric and range labels as ordered, and words as not', () => {
      const document = '| Age | 0-4 | 5–9 | 10+ |\n|---|---|---|---|\n| <5 | 3 | 4 | 2 |\n| ≥ 65 | 6 | 1 | 9 |\n';
      const value = table(readCountTable(markdownGrid(document)));
      assert.deepEqual([value.rowsOrdered, value.columnsOrdered], [true, true]);
      const words = table(readCountTable(markdownGrid('| Loaf | Mon | Tue |\n|---|---|---|\n| Rye | 3 | 4 |\n| 2 | 6 | 1 |\n')));
      assert.deepEqual([words.rowsOrdered, words.columnsOrdered], [false, false]);
    });

    it('reads an aligned table with an empty corner', () => {
      const document = '              Day shift   Night shift\nDrivers              12             7\nMechanics             4             9\n';
      const value = table(readCountTable(alignedGrid(document)));
      assert.deepEqual(value.columnLabels, ['Day shift', 'Night shift']);
      assert.deepEqual(value.observed, [[12, 7], [4, 9]]);
      assert.equal(value.format, 'aligned');
    });

    it('uses decimal commas in a semicolon file with comma numbers, so 1.204 is one thousand two hundred and four', () => {
      const value = table(readCountTable(delimitedGrid('Depot;Riders;Late\nNorth;1.204;3,0\nSouth;87;12\n')));
      assert.deepEqual(value.observed, [[1204, 3], [87, 12]]);
    });
  });

  describe('totals', () => {
    it('recognises and excludes totals rows and columns under any common name and markup', () => {
      for (const name of ['Total', 'TOTALS', '**Sum**', 'Σ', 'Grand total', 'all', '*Total:*']) {
        const document = `| Oven | Rye | Spelt | ${name} |\n|---|---|---|---|\n| Gas | 31 | 12 | 43 |\n| Wood | 9 | 20 | 29 |\n| ${name} | 40 | 32 | 72 |\n`;
        const value = table(readCountTable(markdownGrid(document)));
        assert.deepEqual(value.observed, [[31, 12], [9, 20]], name);
        assert.deepEqual(value.columnLabels, ['Rye', 'Spelt']);
        assert.deepEqual(value.warnings.map((issue) => issue.code), ['totals-excluded', 'totals-excluded'], name);
      }
    });

    it('warns, naming the cell and both numbers, when a total does not match the sum', () => {
      const document = '| Oven | Rye | Spelt | Total |\n|---|---|---|---|\n| Gas | 31 | 12 | 44 |\n| Wood | 9 | 20 | 29 |\n| Total | 40 | 31 | 73 |\n';
      const value = table(readCountTable(markdownGrid(document)));
      const mismatches = value.warnings.filter((issue) => issue.code === 'totals-mismatch');
      assert.equal(mismatches.length, 3);
      const spelt = mismatches.find((issue) => /Spelt/.test(issue.message))!;
      assert.match(spelt.message, /^line 5, column 16: the Total row for "Spelt" says 31, but the counts add up to 32/);
      assertPointsAt(document, spelt.location, '31');
      const gas = mismatches.find((issue) => /Gas/.test(issue.message))!;
      assert.match(gas.message, /Total column for "Gas" says 44, but the counts add up to 43/);
      assertPointsAt(document, gas.location, '44');
      const grand = mismatches.find((issue) => /grand total/.test(issue.message))!;
      assert.match(grand.message, /says 73, but the counts add up to 72/);
      const excluded = value.warnings.filter((issue) => issue.code === 'totals-excluded');
      assert.ok(excluded.some((issue) => /"Total" row \(line 5\)/.test(issue.message)));
    });

    it('keeps a lone row named All, since nothing else would be left to test', () => {
      const value = table(readCountTable(markdownGrid('| Visitors | Mon | Tue |\n|---|---|---|\n| All | 31 | 12 |\n')));
      assert.deepEqual(value.rowLabels, ['All']);
    });
  });

  describe('zero rows and columns', () => {
    it('drops an all-zero row and column of a two-way table with notes naming them', () => {
      const document = '| Tram | Early | Late | Cancelled |\n|---|---|---|---|\n| T4 | 7 | 2 | 0 |\n| T5 | 0 | 0 | 0 |\n| T6 | 3 | 8 | 0 |\n';
      const value = table(readCountTable(markdownGrid(document)));
      assert.deepEqual(value.observed, [[7, 2], [3, 8]]);
      assert.deepEqual(value.rowLabels, ['T4', 'T6']);
      assert.deepEqual(value.columnLabels, ['Early', 'Late']);
      assert.deepEqual(value.cellLocations!.map((row) => row.map((cell) => cell.line)), [[3, 3], [5, 5]]);
      const row = value.warnings.find((issue) => issue.code === 'zero-row-dropped')!;
      assert.match(row.message, /^line 4, column \d+: the row "T5" was left out: all its counts are 0, so its expected counts are 0/);
      const column = value.warnings.find((issue) => issue.code === 'zero-column-dropped')!;
      assert.match(column.message, /the column "Cancelled" was left out/);
    });

    it('keeps all-zero rows and columns with keepZeroLines, as a stratum of a stratified design needs', () => {
      const document = '| Tram | Early | Late | Cancelled |\n|---|---|---|---|\n| T4 | 7 | 2 | 0 |\n| T5 | 0 | 0 | 0 |\n| T6 | 3 | 8 | 0 |\n';
      const value = table(readCountTable(markdownGrid(document), { keepZeroLines: true }));
      assert.deepEqual(value.observed, [[7, 2, 0], [0, 0, 0], [3, 8, 0]]);
      assert.deepEqual(value.rowLabels, ['T4', 'T5', 'T6']);
      assert.deepEqual(value.columnLabels, ['Early', 'Late', 'Cancelled']);
      assert.deepEqual(value.warnings, []);
      assertPointsAt(document, value.cellLocations![1][2], '0 |');
      const empty = '| Tram | Early |\n|---|---|\n| T4 | 0 |\n| T5 | 0 |\n';
      expectFailure(empty, readCountTable(markdownGrid(empty), { keepZeroLines: true }), 'all-zero-table', '0', /every count in this table is 0/);
    });

    it('keeps zero categories of a one-row table, whose expected counts come from the hypothesis', () => {
      const value = table(readCountTable(markdownGrid('| Red | Blue | Black |\n|---|---|---|\n| 40 | 0 | 10 |\n')));
      assert.deepEqual(value.observed, [[40, 0, 10]]);
      assert.deepEqual(value.warnings, []);
    });
  });

  describe('errors name the offending cell', () => {
    it('rejects a ragged row, naming its line and both cell counts', () => {
      const document = '| Slope | Falls | Runs |\n|---|---|---|\n| Blue | 3 | 40 |\n| Red | 5 |\n';
      expectFailure(document, readCountTable(markdownGrid(document)), 'ragged-row', '5',
        /line 4 has 2 cells but the header row \(line 1\) has 3; add the missing cells/);
      const extra = 'Slope,Falls\nBlue,3\nRed,5,9\n';
      expectFailure(extra, readCountTable(delimitedGrid(extra)), 'ragged-row', '9', /line 3 has 3 cells/);
    });

    it('explains that a caption typed right under a Markdown table became a row of it', () => {
      const document = '| Slope | Falls | Runs |\n|---|---|---|\n| Blue | 3 | 40 |\nCounted by the ski patrol\n';
      expectFailure(document, readCountTable(markdownGrid(document)), 'ragged-row', 'Counted',
        /line 4 has 1 cell but the header row \(line 1\) has 3; if this line is not part of the table, leave a blank line before it/);
    });

    it('rejects text, negative, fractional, empty and percentage counts at their cells', () => {
      const cases: [string, IssueCode][] = [['n/a', 'text-in-count-cell'], ['-2', 'negative-count'], ['12.5', 'non-integer-count'],
        ['45%', 'percentages-not-counts'], ['1,20', 'ambiguous-number']];
      for (const [bad, code] of cases) {
        const document = `| Bed | Tomato | Basil |\n|---|---|---|\n| East | 14 | 9 |\n| West | 3 | ${bad} |\n`;
        expectFailure(document, readCountTable(markdownGrid(document)), code, bad);
      }
      const empty = '| Bed | Tomato | Basil |\n|---|---|---|\n| East | 14 | 9 |\n| West | 3 |  |\n';
      const result = readCountTable(markdownGrid(empty));
      assert.equal(result.ok, false);
      if (!result.ok) {
        assert.equal(result.issue.code, 'empty-cell');
        assert.deepEqual(result.issue.location, { line: 4, column: 13 });
      }
    });

    it('rejects a decimal comma fraction in a semicolon file at its cell', () => {
      const document = 'Depot;Riders;Late\nNorth;12;3\nSouth;87;12,5\n';
      expectFailure(document, readCountTable(delimitedGrid(document)), 'non-integer-count', '12,5');
    });

    it('reads whole numbers that add up to exactly 100 per row but warns that they may be percentages', () => {
      const document = '| Depot | On time | Late |\n|---|---|---|\n| North | 82 | 18 |\n| South | 64 | 36 |\n';
      const result = readCountTable(markdownGrid(document));
      assert.ok(result.ok);
      if (!result.ok) return;
      assert.deepEqual(result.value.observed, [[82, 18], [64, 36]]);
      const warning = result.value.warnings.find((w) => w.code === 'percentages-not-counts');
      assert.ok(warning, 'a percentages warning');
      assert.match(warning.message, /^line 3, column 11: every row adds up to exactly 100.*enter the counts, not percentages/);
    });

    it('rejects proportions that add up to 1, and decimal percentages that add up to 100', () => {
      const proportions = '| Depot | On time | Late |\n|---|---|---|\n| North | 0.82 | 0.18 |\n| South | 0.64 | 0.36 |\n';
      expectFailure(proportions, readCountTable(markdownGrid(proportions)), 'percentages-not-counts', '0.82', /each row adds up to 1/);
      const shares = '| Run | Share |\n|---|---|\n| Green | 33.3 |\n| Blue | 33.3 |\n| Red | 33.3 |\n';
      expectFailure(shares, readCountTable(markdownGrid(shares)), 'percentages-not-counts', '33.3', /adds up to 100/);
    });

    it('rejects an all-zero table and a table with a single count', () => {
      const zeros = '| Kiln | Cracked | Whole |\n|---|---|---|\n| A | 0 | 0 |\n| B | 0 | 0 |\n';
      expectFailure(zeros, readCountTable(markdownGrid(zeros)), 'all-zero-table', '0', /every count in this table is 0/);
      const single = '| Kiln | Cracked |\n|---|---|\n| A | 4 |\n';
      expectFailure(single, readCountTable(markdownGrid(single)), 'too-few-categories', '4', /single count/);
    });

    it('rejects a table over the size limits, naming where it starts', () => {
      const tall = ['Seed,Sprouted', ...Array.from({ length: 1001 }, (_, index) => `S${index},${index % 7}`)].join('\n');
      expectFailure(tall, readCountTable(delimitedGrid(tall)), 'table-too-large', 'Seed', /at most 1000 rows/);
      const wide = Array.from({ length: 102 }, (_, row) => Array.from({ length: 101 }, (_, column) => `${(row + column) % 9 + 1}`).join(',')).join('\n');
      expectFailure(wide, readCountTable(delimitedGrid(wide)), 'table-too-large', '1', /10000 counts/);
    });

    it('sends one-row-per-observation data to cross-tabulation, naming two text columns', () => {
      const document = 'Shift,Outcome,Minutes\nDay,On time,3\nNight,Late,12\nDay,Late,9\n';
      expectFailure(document, readCountTable(delimitedGrid(document)), 'raw-data', 'Day',
        /columns "Shift" and "Outcome" hold text.*--columns Shift,Outcome/);
    });

    it('rejects a header with no counts below it and labels with no counts beside them', () => {
      const headerOnly = '| Loaf | Sold |\n|---|---|\n';
      expectFailure(headerOnly, readCountTable(markdownGrid(headerOnly)), 'not-a-count-table', 'Loaf', /no rows of counts/);
      const labelsOnly = 'Loaf\nRye\nSpelt\n';
      expectFailure(labelsOnly, readCountTable(delimitedGrid(labelsOnly)), 'not-a-count-table', 'Loaf', /no column of counts/);
    });
  });

  describe('round trips', () => {
    const grouped = new Intl.NumberFormat('en-US', { useGrouping: true });
    const narrowGrouped = new Intl.NumberFormat('fr-FR', { useGrouping: true });

    function expectScenario(document: string, value: CountTable, scenario: CountScenario, written: string[][]): void {
      assert.deepEqual(value.observed, scenario.counts);
      assert.deepEqual(value.rowLabels, scenario.rowLabels);
      assert.deepEqual(value.columnLabels, scenario.columnLabels);
      value.cellLocations!.forEach((row, rowIndex) => row.forEach((location, column) => assertPointsAt(document, location, written[rowIndex][column])));
    }

    it('reads back counts and labels rendered as a Markdown table', () => {
      const style = fc.record({ pipes: fc.boolean(), corner: fc.constantFrom('', 'Depot'), bold: fc.boolean(), group: fc.boolean(), pad: fc.constantFrom('', ' ', '   ') });
      fc.assert(fc.property(countScenarioArbitrary, style, (scenario, { pipes, corner, bold, group, pad }) => {
        const outer = pipes || corner === '';
        const line = (cells: string[]): string => (outer ? `|${pad}${cells.join(`${pad}|${pad}`)}${pad}|` : cells.join(`${pad}|${pad}`));
        const label = (text: string): string => (bold ? `**${text}**` : text);
        const written = scenario.counts.map((row) => row.map((count) => (group ? grouped.format(count) : String(count))));
        const document = ['Notes from the depot.', '', line([corner, ...scenario.columnLabels.map(label)]),
          line(['---', ...scenario.columnLabels.map(() => ':--:')]),
          ...written.map((row, index) => line([label(scenario.rowLabels[index]), ...row])), '', 'After.'].join('\n');
        expectScenario(document, table(readCountTable(markdownGrid(document))), scenario, written);
      }), { numRuns: 300 });
    });

    it('reads back counts and labels rendered as delimited text with random quoting', () => {
      const style = fc.record({
        delimiter: fc.constantFrom(',', ';', '\t', '|'), quoting: fc.array(fc.boolean(), { minLength: 64, maxLength: 64 }),
        newline: fc.constantFrom('\n', '\r\n'), bom: fc.boolean(), group: fc.boolean(), corner: fc.constantFrom('', 'Glasshouse'),
      });
      fc.assert(fc.property(countScenarioArbitrary, style, (scenario, { delimiter, quoting, newline, bom, group, corner }) => {
        let next = 0;
        const field = (text: string): string => {
          const quote = quoting[next++ % quoting.length] || text.includes(delimiter) || text.includes('"');
          return quote ? `"${text.replaceAll('"', '""')}"` : text;
        };
        const format = (count: number): string => (!group ? String(count) : delimiter === ';' ? narrowGrouped.format(count) : grouped.format(count));
        const written = scenario.counts.map((row) => row.map(format));
        const lines = [[corner, ...scenario.columnLabels], ...written.map((row, index) => [scenario.rowLabels[index], ...row])];
        const document = (bom ? '\ufeff' : '') + lines.map((cells) => cells.map(field).join(delimiter)).join(newline) + newline + newline;
        const grid = delimitedGrid(document);
        assert.equal(grid.delimiter, delimiter);
        expectScenario(document, table(readCountTable(grid)), scenario, written);
      }), { numRuns: 300 });
    });

    it('reads back counts and labels rendered as aligned text, with or without a corner title', () => {
      const style = fc.record({ corner: fc.constantFrom('', 'Bakery'), gap: fc.constantFrom(2, 3, 5), group: fc.constantFrom('none', 'comma', 'narrow'), indent: fc.constantFrom('', '  ') });
      fc.assert(fc.property(countScenarioArbitrary, style, (scenario, { corner, gap, group, indent }) => {
        const format = (count: number): string => (group === 'comma' ? grouped.format(count) : group === 'narrow' ? narrowGrouped.format(count) : String(count));
        const written = scenario.counts.map((row) => row.map(format));
        const cells = [[corner, ...scenario.columnLabels], ...written.map((row, index) => [scenario.rowLabels[index], ...row])];
        const widths = cells[0].map((_, column) => Math.max(...cells.map((row) => row[column].length)));
        const document = cells.map((row) => indent + row.map((text, column) => (column === 0 ? text.padEnd(widths[0]) : text.padStart(widths[column])))
          .join(' '.repeat(gap)).trimEnd()).join('\n');
        expectScenario(document, table(readCountTable(alignedGrid(document))), scenario, written);
      }), { numRuns: 300 });
    });

    it('reads back numbers-only tables with generated labels', () => {
      fc.assert(fc.property(countScenarioArbitrary, fc.constantFrom(',', '\t'), (scenario, delimiter) => {
        const document = scenario.counts.map((row) => row.join(delimiter)).join('\n');
        const value = table(readCountTable(delimitedGrid(document)));
        assert.deepEqual(value.observed, scenario.counts);
        assert.deepEqual([value.generatedRowLabels, value.generatedColumnLabels], [true, true]);
        assert.equal(value.rowLabels[value.rowLabels.length - 1], `Row ${scenario.counts.length}`);
      }), { numRuns: 200 });
    });
  });

  it('never throws on grids from arbitrary text, and gives whole counts or a located issue', () => {
    const grids = anyText.map((document) => [...findMarkdownTables(document),
      ...[parseDelimited(document), parseAligned(document)].flatMap((result) => (result.ok ? [result.value] : []))]);
    fc.assert(fc.property(grids, (found) => {
      for (const grid of found) {
        const result = readCountTable(grid);
        if (result.ok) {
          assert.ok(result.value.observed.flat().every((count) => Number.isSafeInteger(count) && count >= 0));
          assert.equal(result.value.observed.length, result.value.rowLabels.length);
        } else {
          assert.ok(result.issue.location, result.issue.message);
          assert.match(result.issue.message, /^line \d+, column \d+: /);
        }
      }
    }), { numRuns: 1500 });
  });

  it('never throws on grids of table-ish cell texts', () => {
    const cell = fc.oneof(fc.constantFrom('', '0', '12', '1,204', '-3', '12.5', '45%', 'Total', '**Sum**', 'n/a', '0.5', '100', 'Rye'), tableishText);
    const grid = fc.array(fc.array(cell, { maxLength: 6 }), { maxLength: 6 }).map((rows): RawGrid => ({
      format: 'delimited', delimiter: ';', startLine: 1, endLine: Math.max(rows.length, 1),
      rows: rows.map((row, line) => row.map((text, column) => ({ text, line: line + 1, column: column * 5 + 1 }))),
    }));
    fc.assert(fc.property(grid, (value) => {
      const result = readCountTable(value);
      if (!result.ok) assert.match(result.issue.message, /^line \d+, column \d+: /);
    }), { numRuns: 3000 });
  });
});
