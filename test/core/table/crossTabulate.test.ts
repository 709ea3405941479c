import assert from 'node:assert/strict';
import fc from 'fast-check';
import { parse } from 'csv-parse/sync';
import { BLANK_LABEL, createCrossTabulator, crossTabulateText, MAX_CATEGORIES, type CrossTabulateOptions, type CrossTabulation } from '../../../src/core/table/crossTabulate';
import { strataFromCrossTabulation } from '../../../src/core/table/strataFromCrossTabulation';
import type { Result } from '../../../src/core/types';
import { generateRawCsv } from '../../../bench/generateRawCsv';

// Outside reference: csv-parse 7.0.3 (package.json), run live, parses every generated document; a plain loop
// tallies its records. Our streaming state machine must give the same table.

const DELIMITERS = [',', '\t', ';', '|'];
const LINE_ENDINGS = ['\n', '\r\n', '\r'];
/** Invented greenhouse-log values, plus the characters that make CSV quoting hard. */
const VALUE_POOL = [
  'tomato', 'basil', ' fern ', 'Fern', 'orchid, white', 'orchid; pink', 'mint|lemon', 'cress\tred',
  'said "wilted"', '"', '""', 'bench\nnorth', 'bench\r\nsouth', 'shelf\rtop', '', '   ', 'ünïcode é', '3', '10', '2.5',
];

interface DocumentModel {
  delimiter: string;
  header: string[];
  rows: string[][];
  endings: string[];
  blankLinesAfter: boolean[];
  quoteAll: boolean[];
  bom: boolean;
  trailingLineBreak: boolean;
}

function needsQuotes(value: string, delimiter: string): boolean {
  return value.includes(delimiter) || /["\r\n]/.test(value);
}

function renderField(value: string, delimiter: string, forceQuotes: boolean): string {
  return forceQuotes || needsQuotes(value, delimiter) ? `"${value.replace(/"/g, '""')}"` : value;
}

function renderDocument(model: DocumentModel): string {
  const lines = [model.header, ...model.rows].map((fields, line) =>
    fields.map((field) => renderField(field, model.delimiter, model.quoteAll[line % model.quoteAll.length])).join(model.delimiter));
  let text = model.bom ? '\ufeff' : '';
  lines.forEach((line, index) => {
    const ending = model.endings[index % model.endings.length];
    text += line;
    if (index < lines.length - 1 || model.trailingLineBreak) text += ending;
    if (index > 0 && index < lines.length - 1 && model.blankLinesAfter[index % model.blankLinesAfter.length]) text += ending;
  });
  return text;
}

const documentModel: fc.Arbitrary<DocumentModel> = fc
  .record({
    delimiter: fc.constantFrom(...DELIMITERS),
    columnCount: fc.integer({ min: 2, max: 5 }),
    rowCount: fc.integer({ min: 1, max: 130 }),
    seedValues: fc.array(fc.nat(VALUE_POOL.length - 1), { minLength: 1, maxLength: 64 }),
    endings: fc.array(fc.constantFrom(...LINE_ENDINGS), { minLength: 1, maxLength: 4 }),
    blankLinesAfter: fc.array(fc.boolean(), { minLength: 1, maxLength: 7 }),
    quoteAll: fc.array(fc.boolean(), { minLength: 1, maxLength: 5 }),
    bom: fc.boolean(),
    trailingLineBreak: fc.boolean(),
  })
  .map(({ columnCount, rowCount, seedValues, ...rest }) => {
    const header = Array.from({ length: columnCount }, (_, column) => `plot ${column + 1}`);
    let next = 0;
    const rows = Array.from({ length: rowCount }, (_, row) =>
      header.map((_, column) => VALUE_POOL[(seedValues[next++ % seedValues.length] + row * column) % VALUE_POOL.length]));
    return { header, rows, ...rest };
  });

/** The reference: csv-parse's records, tallied with a plain loop. */
function referenceTally(text: string, delimiter: string, rowColumn: number, columnColumn: number, weightColumn?: number): { counts: Map<string, number>; rowLabels: Set<string>; columnLabels: Set<string>; records: number } {
  const records = parse(text, { delimiter, bom: true, skip_empty_lines: true, record_delimiter: ['\r\n', '\n', '\r'] }) as string[][];
  const counts = new Map<string, number>();
  const rowLabels = new Set<string>();
  const columnLabels = new Set<string>();
  for (const record of records.slice(1)) {
    const rowLabel = record[rowColumn].trim() || BLANK_LABEL;
    const columnLabel = record[columnColumn].trim() || BLANK_LABEL;
    rowLabels.add(rowLabel);
    columnLabels.add(columnLabel);
    const key = JSON.stringify([rowLabel, columnLabel]);
    counts.set(key, (counts.get(key) ?? 0) + (weightColumn === undefined ? 1 : Number(record[weightColumn])));
  }
  return { counts, rowLabels, columnLabels, records: records.length - 1 };
}

function assertSameTable(table: CrossTabulation, reference: ReturnType<typeof referenceTally>, text: string): void {
  const context = JSON.stringify(text.slice(0, 300));
  assert.deepEqual(new Set(table.rowLabels), reference.rowLabels, context);
  assert.deepEqual(new Set(table.columnLabels), reference.columnLabels, context);
  table.rowLabels.forEach((rowLabel, r) => table.columnLabels.forEach((columnLabel, c) => {
    assert.equal(table.observed[r][c], reference.counts.get(JSON.stringify([rowLabel, columnLabel])) ?? 0, `${rowLabel} × ${columnLabel} in ${context}`);
  }));
  assert.equal(table.rowsRead - table.rowsSkipped, reference.records, context);
}

function tabulateInPieces(text: string, cuts: number[], options: CrossTabulateOptions = {}): Result<CrossTabulation> {
  const tabulator = createCrossTabulator(options);
  let previous = 0;
  for (const cut of [...new Set(cuts.map((cut) => cut % (text.length + 1)))].sort((a, b) => a - b)) {
    tabulator.push(text.slice(previous, cut));
    previous = cut;
  }
  tabulator.push(text.slice(previous));
  return tabulator.finish();
}

function expectOk(result: Result<CrossTabulation>): CrossTabulation {
  if (!result.ok) assert.fail(`expected a table, got ${result.issue.code}: ${result.issue.message}`);
  return result.value;
}

function expectIssue(result: Result<CrossTabulation>, code: string, line: number, column: number): string {
  if (result.ok) assert.fail(`expected ${code}, got a table`);
  assert.equal(result.issue.code, code, result.issue.message);
  assert.deepEqual(result.issue.location, { line, column }, result.issue.message);
  return result.issue.message;
}

describe('crossTabulate', () => {
  describe('agreement with csv-parse', () => {
    it('counts every category pair as csv-parse plus a plain loop does, on 300 seeded random documents with nasty quoting', () => {
      fc.assert(
        fc.property(documentModel, fc.nat(), fc.boolean(), (model, pick, detect) => {
          const text = renderDocument(model);
          const rowColumn = pick % model.header.length;
          const columnColumn = (rowColumn + 1 + (pick >> 3) % (model.header.length - 1)) % model.header.length;
          const options: CrossTabulateOptions = { columns: [model.header[rowColumn], model.header[columnColumn]] };
          if (!detect) options.delimiter = model.delimiter;
          const table = expectOk(crossTabulateText(text, options));
          assertSameTable(table, referenceTally(text, model.delimiter, rowColumn, columnColumn), text);
          assert.deepEqual(table.columnsUsed, options.columns);
        }),
        { seed: 20240611, numRuns: 300 },
      );
    });

    it('adds the weight column as csv-parse plus a plain loop does, on 150 seeded random weighted documents', () => {
      fc.assert(
        fc.property(documentModel, fc.array(fc.nat(40), { minLength: 1, maxLength: 30 }), (model, weights) => {
          const weighted: DocumentModel = {
            ...model,
            header: [...model.header, 'trays'],
            rows: model.rows.map((row, index) => [...row, String(weights[index % weights.length])]),
          };
          const text = renderDocument(weighted);
          const table = expectOk(crossTabulateText(text, { columns: [model.header[1], model.header[0]], weight: 'trays' }));
          assertSameTable(table, referenceTally(text, model.delimiter, 1, 0, model.header.length), text);
          assert.equal(table.weightColumn, 'trays');
        }),
        { seed: 7, numRuns: 150 },
      );
    });

    it('agrees with csv-parse on the generated 20,000-row bus breakdown benchmark file', () => {
      const text = generateRawCsv(20_000, 99);
      const table = expectOk(tabulateInPieces(text, Array.from({ length: 40 }, (_, k) => k * 9973 + 17)));
      assert.deepEqual(table.columnsUsed, ['depot', 'engine_type']);
      assertSameTable(table, referenceTally(text, ',', 0, 1), text);
      assert.equal(table.rowsRead, 20_000);
    });
  });

  describe('chunk boundaries', () => {
    it('gives the same result whatever the chunk boundaries, for random documents (fast-check, 200 runs)', () => {
      fc.assert(
        fc.property(documentModel, fc.array(fc.nat(), { maxLength: 40 }), (model, cuts) => {
          const text = renderDocument(model);
          assert.deepEqual(tabulateInPieces(text, cuts), crossTabulateText(text));
        }),
        { seed: 11, numRuns: 200 },
      );
    });

    it('gives the same result whatever the chunk boundaries, for arbitrary text (fast-check, 500 runs)', () => {
      const nastyText = fc.string({ unit: fc.constantFrom('a', 'b', '1', ' ', ',', ';', '\t', '|', '"', '\n', '\r', '\ufeff', '-'), maxLength: 120 });
      fc.assert(
        fc.property(nastyText, fc.array(fc.nat(), { maxLength: 20 }), (text, cuts) => {
          assert.deepEqual(tabulateInPieces(text, cuts), crossTabulateText(text));
        }),
        { seed: 12, numRuns: 500 },
      );
    });

    it('gives the same table when split at every single position, or fed one character at a time', () => {
      const text = '\ufeffcrop;"bench,\r\nrow";n\r\n"tomato ""cherry""";"north\r\nend";2\r\nbasil;south;3\r\rbasil;"";1';
      const whole = crossTabulateText(text, { weight: 'n', columns: ['crop', 'bench,\r\nrow'] });
      const table = expectOk(whole);
      assert.deepEqual(table.rowLabels, ['basil', 'tomato "cherry"']);
      assert.deepEqual(table.columnLabels, ['north\r\nend', 'south', BLANK_LABEL]);
      assert.deepEqual(table.observed, [[0, 3, 1], [2, 0, 0]]);
      for (let cut = 0; cut <= text.length; cut++) {
        assert.deepEqual(tabulateInPieces(text, [cut], { weight: 'n', columns: ['crop', 'bench,\r\nrow'] }), whole, `cut at ${cut}`);
      }
      const tabulator = createCrossTabulator({ weight: 'n', columns: ['crop', 'bench,\r\nrow'] });
      for (const character of text) tabulator.push(character);
      assert.deepEqual(tabulator.finish(), whole);
    });
  });

  describe('bad input', () => {
    it('never throws and never yields NaN on arbitrary text and options (fast-check, 1,000 runs)', () => {
      const options = fc.record({
        columns: fc.option(fc.tuple(fc.constantFrom('a', 'b', 'A', ' b ', 'x', ''), fc.constantFrom('a', 'b', 'c', 'x')), { nil: undefined }),
        weight: fc.option(fc.constantFrom('n', 'b', 'c', 'zz'), { nil: undefined }),
        stratum: fc.option(fc.constantFrom('a', 'c', 'n', 'zz', ' '), { nil: undefined }),
        delimiter: fc.option(fc.constantFrom(',', ';', '\t', '"', '', ',,', '\n', 'a'), { nil: undefined }),
        firstLine: fc.option(fc.constantFrom(1, 7, 0, -3, 2.5, Number.NaN), { nil: undefined }),
      }, { requiredKeys: [] });
      const text = fc.oneof(
        fc.string({ unit: 'binary', maxLength: 200 }),
        fc.string({ unit: fc.constantFrom('a', 'b', 'c', 'n', '1', '-2', '0.5', ' ', ',', ';', '"', '\n', '\r\n', '\r'), maxLength: 200 }),
        fc.constant('a,b,n\n'),
      );
      fc.assert(
        fc.property(text, options, (input, option) => {
          const result = crossTabulateText(input, option);
          if (result.ok) {
            const table = result.value;
            assert.equal(table.observed.length, table.rowLabels.length);
            for (const row of table.observed) {
              assert.equal(row.length, table.columnLabels.length);
              for (const count of row) assert.ok(Number.isSafeInteger(count) && count >= 0, String(count));
            }
            assert.ok(table.endLine >= table.startLine);
            for (const stratum of table.strata ?? []) {
              assert.ok(stratum.label.trim() !== '');
              assert.deepEqual(stratum.observed.map((row) => row.length), table.observed.map((row) => row.length));
            }
          } else {
            const { location, message } = result.issue;
            assert.ok(location !== undefined && Number.isInteger(location.line) && location.line >= 1 && Number.isInteger(location.column) && location.column >= 1, JSON.stringify(result.issue));
            assert.ok(message.length > 20, message);
          }
        }),
        { seed: 13, numRuns: 1000 },
      );
    });

    it('names an unknown column and lists the available ones, on the header line', () => {
      const message = expectIssue(crossTabulateText('\n\ninstructor,level\nIna,novice\n', { columns: ['instructor', 'grade'], firstLine: 10 }), 'unknown-column', 12, 1);
      assert.match(message, /'grade'/);
      assert.match(message, /'instructor', 'level'/);
      expectIssue(crossTabulateText('instructor,level\nIna,novice\n', { weight: 'lessons' }), 'unknown-column', 1, 1);
    });

    it('rejects a header with fewer than two columns', () => {
      expectIssue(crossTabulateText('instructor\nIna\nOle\n'), 'too-few-categories', 1, 1);
      expectIssue(crossTabulateText('instructor;level\nIna;novice\n', { delimiter: ',' }), 'too-few-categories', 1, 1);
    });

    it('names the line of a row with too few or too many fields, before and after the 50-row sample', () => {
      const rows = Array.from({ length: 80 }, (_, k) => `Ina,${k % 2 ? 'novice' : 'expert'},yes`);
      const early = [...rows];
      early[29] = 'Ina,novice';
      assert.match(expectIssue(crossTabulateText(['instructor,level,completed', ...early].join('\n')), 'ragged-row', 31, 1), /Line 31 has 2 fields but the header has 3/);
      const late = [...rows];
      late[69] = 'Ina,novice,yes,again';
      assert.match(expectIssue(crossTabulateText(['instructor,level,completed', ...late].join('\n')), 'ragged-row', 71, 1), /Line 71 has 4 fields/);
    });

    it('points at the weight cell that is empty, text, negative or not whole', () => {
      const header = 'shift,fault,buses\nearly,brakes,2\n';
      expectIssue(crossTabulateText(`${header}late,door, \n`, { weight: 'buses' }), 'empty-cell', 3, 11);
      expectIssue(crossTabulateText(`${header}late,door,"3 buses"\n`, { weight: 'buses' }), 'text-in-count-cell', 3, 11);
      expectIssue(crossTabulateText(`${header}late,"door, rear",-1\n`, { weight: 'buses' }), 'negative-count', 3, 19);
      const message = expectIssue(crossTabulateText(`${header}night,door,1.5\n`, { weight: 'buses', firstLine: 4 }), 'non-integer-count', 6, 12);
      assert.match(message, /1\.5/);
      const counts = expectOk(crossTabulateText(`${header}late,door,4.0\nlate,door,1e1\nlate,brakes,0\n`, { weight: 'buses' }));
      assert.deepEqual(counts.observed, [[2, 0], [0, 14]]);
    });

    it('refuses a crossed column with more than 1,000 distinct values, at the first value too many', () => {
      const rows = Array.from({ length: MAX_CATEGORIES + 1 }, (_, k) => `\nbus ${k},${k % 3 ? 'late' : 'early'}`);
      const message = expectIssue(crossTabulateText(`fleet_no,shift${rows.join('')}`, { columns: ['fleet_no', 'shift'] }), 'table-too-large', MAX_CATEGORIES + 2, 1);
      assert.match(message, /'fleet_no' has more than 1000 different values/);
      expectOk(crossTabulateText(`fleet_no,shift${rows.slice(1).join('')}`, { columns: ['fleet_no', 'shift'] }));
    });

    it('reports an unclosed quote where it opens, empty text, a header without rows and bad options', () => {
      expectIssue(crossTabulateText('shift,fault\nearly,"brakes\nlate,door\n'), 'unreadable', 2, 7);
      expectIssue(crossTabulateText(''), 'no-table', 1, 1);
      expectIssue(crossTabulateText('\ufeff \n\n', { firstLine: 3 }), 'no-table', 3, 1);
      expectIssue(crossTabulateText('\n\nshift,fault\n\n'), 'no-table', 3, 1);
      expectIssue(crossTabulateText('shift,fault\nearly,door\n', { delimiter: ', ' }), 'bad-option', 1, 1);
      expectIssue(crossTabulateText('shift,fault\nearly,door\n', { columns: ['shift', 'shift'] }), 'bad-option', 1, 1);
      expectIssue(crossTabulateText('shift,fault,n\nearly,door,1\n', { columns: ['shift', 'n'], weight: 'n' }), 'bad-option', 1, 1);
      expectIssue(crossTabulateText('shift,fault\nearly,door\n', { firstLine: 0 }), 'bad-option', 1, 1);
    });

    it('throws only on the programmer error of pushing after finish', () => {
      const tabulator = createCrossTabulator();
      tabulator.push('shift,fault\nearly,door\n');
      const first = tabulator.finish();
      assert.equal(tabulator.finish(), first);
      assert.throws(() => tabulator.push('late,door\n'), /after finish/);
    });
  });

  describe('labels and order', () => {
    it('trims labels, counts empty values under (blank) last, and warns with the number of such rows', () => {
      const table = expectOk(crossTabulateText('level,completed\n novice ,yes\n,yes\nexpert,\n  ,no\nnovice,yes\n'));
      assert.deepEqual(table.rowLabels, ['expert', 'novice', BLANK_LABEL]);
      assert.deepEqual(table.columnLabels, ['no', 'yes', BLANK_LABEL]);
      assert.deepEqual(table.observed, [[0, 0, 1], [0, 2, 0], [1, 1, 0]]);
      assert.deepEqual(table.warnings.map((warning) => [warning.code, warning.location]), [['empty-cell', { line: 3, column: 1 }], ['empty-cell', { line: 4, column: 8 }]]);
      assert.match(table.warnings[0].message, /^2 rows have no value in 'level'/);
      assert.match(table.warnings[1].message, /^1 row has no value in 'completed'/);
    });

    it('sorts numeric and range labels numerically and marks them ordered; sorts text alphabetically', () => {
      const lines = ['age_band,lessons,slope', '15+,10,blue', '5-9,2,red', '10-14,1,Green', '5-9,10,black', '<5,2,blue', ',2,green'];
      const table = expectOk(crossTabulateText(lines.join('\n'), { columns: ['age_band', 'lessons'] }));
      assert.deepEqual(table.rowLabels, ['<5', '5-9', '10-14', '15+', BLANK_LABEL]);
      assert.deepEqual(table.columnLabels, ['1', '2', '10']);
      assert.equal(table.rowsOrdered, true);
      assert.equal(table.columnsOrdered, true);
      const slopes = expectOk(crossTabulateText(lines.join('\n'), { columns: ['lessons', 'slope'] }));
      assert.deepEqual(slopes.columnLabels, ['black', 'blue', 'green', 'Green', 'red']);
      assert.equal(slopes.columnsOrdered, false);
    });

    it('keeps apart labels whose 32-bit text hashes collide, including one that extends the other', () => {
      // 'Aa'/'BB' and 'wybaa'/'wybaa\u6f55' have equal hashes under the look-up hash (found by search; checked here).
      const rows = ['Aa,x', 'BB,x', 'BB,y', 'wybaa,x', 'wybaa\u6f55,y', 'wybaa\u6f55,y', 'Aa,x'];
      const table = expectOk(crossTabulateText(['code,tray', ...rows].join('\n'), { columns: ['code', 'tray'] }));
      assert.deepEqual(table.rowLabels, ['Aa', 'BB', 'wybaa', 'wybaa\u6f55']);
      assert.deepEqual(table.observed, [[2, 0], [1, 1], [1, 0], [0, 2]]);
    });

    it('counts a lone CR inside a quoted value as a line break when placing later cells', () => {
      expectIssue(crossTabulateText('shift,fault,n\nearly,"door\rrear",x\n', { weight: 'n' }), 'text-in-count-cell', 3, 7);
      expectIssue(crossTabulateText('shift,fault,n\r\nearly,"door\r\nrear",x\n', { weight: 'n' }), 'text-in-count-cell', 3, 7);
    });

    it('gives the same table whatever the order of the rows', () => {
      const rows = ['Ina,novice', 'Ole,expert', 'Ina,expert', 'Per,novice', 'Ole,expert'];
      const forward = crossTabulateText(['instructor,level', ...rows].join('\n'));
      const backward = crossTabulateText(['instructor,level', ...rows.reverse()].join('\n'));
      assert.deepEqual(forward, backward);
    });
  });

  describe('column choice and layout', () => {
    it('crosses the first two categorical columns by default, passing over numbers, dates and identifiers', () => {
      const lines = ['lesson_id,date,minutes,instructor,level,completed'];
      for (let k = 0; k < 60; k++) {
        lines.push(`L-${1000 + k},2024-01-${String(1 + (k % 28)).padStart(2, '0')},${45 + (k % 4) * 15},${['Ina', 'Ole', 'Per'][k % 3]},${['novice', 'improver', 'expert'][(k >> 1) % 3]},${k % 5 ? 'yes' : 'no'}`);
      }
      const table = expectOk(crossTabulateText(lines.join('\r\n')));
      assert.deepEqual(table.columnsUsed, ['instructor', 'level']);
      assert.deepEqual(table.rowLabels, ['Ina', 'Ole', 'Per']);
      assert.equal(table.observed.flat().reduce((sum, count) => sum + count, 0), 60);
      assert.equal(table.startLine, 1);
      assert.equal(table.endLine, 61);
      const explicit = expectOk(crossTabulateText(lines.join('\n'), { columns: ['MINUTES', 'completed'] }));
      assert.deepEqual(explicit.columnsUsed, ['minutes', 'completed']);
      assert.deepEqual(explicit.rowLabels, ['45', '60', '75', '90']);
    });

    it('says which columns were found when fewer than two are categorical', () => {
      const message = expectIssue(crossTabulateText('level,minutes\nnovice,45\nexpert,60\n'), 'too-few-categories', 1, 1);
      assert.match(message, /only 'level'/);
    });

    it('detects the delimiter from the header line among comma, tab, semicolon and bar', () => {
      for (const delimiter of DELIMITERS) {
        const text = ['crop', 'bench', 'note'].join(delimiter) + '\n' + ['basil', 'north', '"a, b; c|d\te"'].join(delimiter) + '\n';
        const table = expectOk(crossTabulateText(text));
        assert.deepEqual(table.columnsUsed, ['crop', 'bench'], JSON.stringify(delimiter));
      }
    });

    it('skips blank lines, counts them in rowsSkipped, and reports lines in document numbering', () => {
      const table = expectOk(crossTabulateText('\n \nshift,fault\n\nearly,door\n   \nlate,door\n\n', { firstLine: 20 }));
      assert.equal(table.startLine, 22);
      assert.equal(table.endLine, 26);
      assert.equal(table.rowsRead, 5);
      assert.equal(table.rowsSkipped, 3);
      assert.equal(table.format, 'crosstab');
      assert.equal(table.cellLocations, undefined);
    });

    it('warns when a column named like counts is left out as weight', () => {
      const table = expectOk(crossTabulateText('shift,fault,count\nearly,door,4\nlate,door,2\n'));
      assert.equal(table.warnings.length, 1);
      assert.equal(table.warnings[0].code, 'raw-data');
      assert.match(table.warnings[0].message, /'count'/);
    });
  });

  describe('strata', () => {
    /** The reference for a stratified tally: csv-parse's records grouped by the stratum value, rows with an empty one left out. */
    function referenceStrata(text: string, delimiter: string, rowColumn: number, columnColumn: number, stratumColumn: number): { labels: string[]; counts: Map<string, number>; records: number; blankStrata: number } {
      const records = parse(text, { delimiter, bom: true, skip_empty_lines: true, record_delimiter: ['\r\n', '\n', '\r'] }) as string[][];
      const labels: string[] = [];
      const counts = new Map<string, number>();
      let blankStrata = 0;
      for (const record of records.slice(1)) {
        const stratum = record[stratumColumn].trim();
        if (stratum === '') {
          blankStrata++;
          continue;
        }
        if (!labels.includes(stratum)) labels.push(stratum);
        const key = JSON.stringify([stratum, record[rowColumn].trim() || BLANK_LABEL, record[columnColumn].trim() || BLANK_LABEL]);
        counts.set(key, (counts.get(key) ?? 0) + 1);
      }
      return { labels, counts, records: records.length - 1, blankStrata };
    }

    const stratifiedModel = documentModel.filter((model) => model.header.length >= 3);

    it('tabulates each stratum as csv-parse plus a plain loop does, and the strata add up to the whole table (fast-check, 300 runs)', () => {
      fc.assert(
        fc.property(stratifiedModel, fc.nat(), fc.array(fc.nat(), { maxLength: 12 }), (model, pick, cuts) => {
          const text = renderDocument(model);
          const count = model.header.length;
          const stratumColumn = pick % count;
          const rowColumn = (stratumColumn + 1) % count;
          const columnColumn = (stratumColumn + 2) % count;
          const options: CrossTabulateOptions = { columns: [model.header[rowColumn], model.header[columnColumn]], stratum: model.header[stratumColumn] };
          const result = tabulateInPieces(text, cuts, options);
          const reference = referenceStrata(text, model.delimiter, rowColumn, columnColumn, stratumColumn);
          if (reference.records === reference.blankStrata) {
            assert.equal(result.ok ? 'ok' : result.issue.code, 'empty-cell', 'every row lacks a stratum');
            return;
          }
          const table = expectOk(result);
          const strata = table.strata ?? assert.fail('no strata');
          assert.equal(table.stratumColumn, model.header[stratumColumn]);
          assert.deepEqual(strata.map((stratum) => stratum.label), reference.labels, 'stratum labels in order of first appearance');
          for (const stratum of strata) {
            assert.equal(stratum.observed.length, table.rowLabels.length);
            table.rowLabels.forEach((rowLabel, r) => table.columnLabels.forEach((columnLabel, c) => {
              assert.equal(stratum.observed[r][c], reference.counts.get(JSON.stringify([stratum.label, rowLabel, columnLabel])) ?? 0, `${stratum.label}: ${rowLabel} × ${columnLabel}`);
            }));
          }
          const summed = table.observed.map((row, r) => row.map((_, c) => strata.reduce((sum, stratum) => sum + stratum.observed[r][c], 0)));
          assert.deepEqual(summed, table.observed);
          assert.equal(table.rowsRead - table.rowsSkipped, reference.records - reference.blankStrata);
          if (reference.blankStrata === 0) {
            // With every stratum filled in, the strata add up to the unstratified table too.
            const unstratified = expectOk(crossTabulateText(text, { columns: options.columns }));
            assert.deepEqual(table.observed, unstratified.observed);
            assert.deepEqual(table.rowLabels, unstratified.rowLabels);
          } else {
            assert.ok(table.warnings.some((warning) => warning.code === 'empty-cell' && /stratum column/.test(warning.message)));
          }
        }),
        { seed: 20261202, numRuns: 300 },
      );
    });

    it('weights stratified rows, chooses the crossed columns around the stratum column, and skips rows without a stratum', () => {
      const lines = ['van,shift,late,crates'];
      for (let k = 0; k < 60; k++) lines.push(`${['Blue', 'Red'][k % 2]},${k % 7 === 0 ? '' : ['early', 'late', 'night'][k % 3]},${k % 5 ? 'no' : 'yes'},${1 + (k % 4)}`);
      const table = expectOk(crossTabulateText(lines.join('\n'), { stratum: 'SHIFT', weight: 'crates' }));
      assert.deepEqual(table.columnsUsed, ['van', 'late']);
      assert.equal(table.stratumColumn, 'shift');
      const strata = table.strata ?? assert.fail('no strata');
      assert.deepEqual(strata.map((stratum) => stratum.label), ['late', 'night', 'early']);
      // Hand tally of the rule above: rows k = 0, 7, ..., 56 (9 rows) have no shift.
      assert.equal(table.rowsSkipped, 9);
      let expectedTotal = 0;
      for (let k = 0; k < 60; k++) if (k % 7 !== 0) expectedTotal += 1 + (k % 4);
      assert.equal(table.observed.flat().reduce((sum, value) => sum + value, 0), expectedTotal);
      const warning = table.warnings.find((item) => /stratum column 'shift'/.test(item.message));
      assert.ok(warning);
      assert.match(warning.message, /^9 rows have no value in the stratum column 'shift'/);
      assert.deepEqual(warning.location, { line: 2, column: 6 });
    });

    it('names an unknown stratum column and lists the available ones, and refuses clashing choices', () => {
      const text = 'van,shift,late\nBlue,early,no\n';
      const message = expectIssue(crossTabulateText(text, { stratum: 'route' }), 'unknown-column', 1, 1);
      assert.match(message, /no column named 'route' for the strata/);
      assert.match(message, /'van', 'shift', 'late'/);
      expectIssue(crossTabulateText(text, { columns: ['van', 'late'], stratum: 'van' }), 'bad-option', 1, 1);
      expectIssue(crossTabulateText(text, { columns: ['van', 'late'], stratum: 'late', weight: 'late' }), 'bad-option', 1, 1);
      expectIssue(crossTabulateText(text, { stratum: ' ' }), 'bad-option', 1, 1);
      expectIssue(crossTabulateText('van,shift,late\nBlue,,no\nRed, ,yes\n', { columns: ['van', 'late'], stratum: 'shift' }), 'empty-cell', 2, 6);
    });

    it('leaves the result without strata when no stratum column is chosen', () => {
      const table = expectOk(crossTabulateText('van,late\nBlue,no\n'));
      assert.equal('strata' in table, false);
      assert.equal('stratumColumn' in table, false);
    });

    describe('strataFromCrossTabulation', () => {
      const deliveries = ['van,shift,late', 'Blue,early,no', 'Red,early,yes', 'Blue,early,yes', 'Red,night,no', 'Red,night,no', 'Blue,night,yes'].join('\n');

      it('gives one 2×2 table per stratum on the shared labels, with zeros for absent combinations', () => {
        const tabulation = expectOk(crossTabulateText(deliveries, { columns: ['van', 'late'], stratum: 'shift' }));
        const result = strataFromCrossTabulation(tabulation);
        if (!result.ok) assert.fail(result.issue.message);
        const strata = result.value;
        assert.deepEqual(strata.rowLabels, ['Blue', 'Red']);
        assert.deepEqual(strata.columnLabels, ['no', 'yes']);
        assert.deepEqual(strata.strata.map((stratum) => [stratum.label, stratum.table.observed]), [['early', [[1, 1], [0, 1]]], ['night', [[0, 1], [2, 0]]]]);
        assert.deepEqual([strata.firstIndex, strata.lastIndex, strata.count, strata.startLine, strata.endLine], [1, 1, 1, 1, 7]);
      });

      it('refuses a table that is not 2×2, a single stratum, and a tabulation without strata, saying what to do', () => {
        const threeGroups = expectOk(crossTabulateText(`${deliveries}\nGreen,night,no`, { columns: ['van', 'late'], stratum: 'shift' }));
        const wide = strataFromCrossTabulation(threeGroups);
        assert.equal(wide.ok, false);
        if (!wide.ok) assert.match(wide.issue.message, /^The group column 'van' has 3 values \("Blue", "Green", "Red"\); a stratified analysis needs exactly two groups and two outcomes/);
        const oneShift = strataFromCrossTabulation(expectOk(crossTabulateText(deliveries.split('\n').slice(0, 4).join('\n'), { columns: ['van', 'late'], stratum: 'shift' })));
        assert.equal(oneShift.ok, false);
        if (!oneShift.ok) assert.match(oneShift.issue.message, /'shift' has only one value \("early"\)/);
        const plain = strataFromCrossTabulation(expectOk(crossTabulateText(deliveries, { columns: ['van', 'late'] })));
        assert.equal(plain.ok, false);
        if (!plain.ok) assert.equal(plain.issue.code, 'bad-option');
      });
    });
  });
});
