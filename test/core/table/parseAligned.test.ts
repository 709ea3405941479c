import assert from 'node:assert/strict';
import fc from 'fast-check';
import { parseAligned } from '../../../src/core/table/parseAligned';
import type { RawGrid, Result } from '../../../src/core/types';
import { anyText, assertPointsAt } from './tableTestKit';

function grid(result: Result<RawGrid>): RawGrid {
  assert.ok(result.ok, result.ok ? '' : result.issue.message);
  return result.value;
}

function texts(value: RawGrid): string[][] {
  return value.rows.map((row) => row.map((cell) => cell.text));
}

describe('parseAligned', () => {
  it('keeps multi-word labels when columns are separated by two or more spaces', () => {
    const document = 'Crew        Day shift  Night shift\nDrivers            12            7\nRepair crew         4            9\n';
    const value = grid(parseAligned(document));
    assert.deepEqual(texts(value), [['Crew', 'Day shift', 'Night shift'], ['Drivers', '12', '7'], ['Repair crew', '4', '9']]);
    assert.equal(value.format, 'aligned');
    for (const row of value.rows) for (const cell of row) assertPointsAt(document, cell, cell.text);
  });

  it('adds an empty corner cell when the header row is one cell short', () => {
    const document = '             Day   Night shift\nDrivers       12             7\nMechanics      4             9\n';
    const value = grid(parseAligned(document));
    assert.deepEqual(texts(value), [['', 'Day', 'Night shift'], ['Drivers', '12', '7'], ['Mechanics', '4', '9']]);
    assertPointsAt(document, value.rows[0][2], 'Night shift');
  });

  it('uses column boundaries shared by all rows, so a blank cell keeps the other cells in place', () => {
    const document = '           Day  Night shift\nDrivers     12            7\nMechanics                 9\n';
    const value = grid(parseAligned(document));
    assert.deepEqual(texts(value), [['', 'Day', 'Night shift'], ['Drivers', '12', '7'], ['Mechanics', '', '9']]);
    assert.deepEqual([value.rows[2][1].line, value.rows[2][1].column], [3, 12]);
  });

  it('splits at single spaces when every row then has the same number of cells', () => {
    assert.deepEqual(texts(grid(parseAligned('Bed Tomato Basil\nEast 14 9\nWest 3 11'))),
      [['Bed', 'Tomato', 'Basil'], ['East', '14', '9'], ['West', '3', '11']]);
    assert.deepEqual(texts(grid(parseAligned('Tomato Basil\nEast 14 9\nWest 3 11'))),
      [['', 'Tomato', 'Basil'], ['East', '14', '9'], ['West', '3', '11']]);
  });

  it('joins the leading words of single-spaced rows into a label when the rest are numbers', () => {
    const document = 'Crew Day Night\nNight owls 12 7\nEarly birds club 4 9\n';
    const value = grid(parseAligned(document));
    assert.deepEqual(texts(value), [['Crew', 'Day', 'Night'], ['Night owls', '12', '7'], ['Early birds club', '4', '9']]);
    assertPointsAt(document, value.rows[2][0], 'Early birds club');
  });

  it('reads tab-separated spreadsheet pastes, keeping an empty first cell', () => {
    const document = '\tRye\tSpelt loaf\nMonday\t31\t12\nTuesday\t28\t9\n';
    const value = grid(parseAligned(document));
    assert.deepEqual(texts(value), [['', 'Rye', 'Spelt loaf'], ['Monday', '31', '12'], ['Tuesday', '28', '9']]);
    assertPointsAt(document, value.rows[1][2], '12');
  });

  it('keeps numbers grouped with no-break spaces in one cell', () => {
    assert.deepEqual(texts(grid(parseAligned('Route  Riders\nR1     1\u00a0204\nR2     87'))), [['Route', 'Riders'], ['R1', '1\u00a0204'], ['R2', '87']]);
  });

  it('skips blank lines, numbers lines from firstLine, and leaves rows that do not line up for the table reader', () => {
    const value = grid(parseAligned('Kiln  Fired  Cracked\n\nA  12  2\nB  9\n', 20));
    assert.deepEqual(value.rows.map((row) => row.length), [3, 3, 2]);
    assert.deepEqual([value.startLine, value.endLine, value.rows[1][0].line], [20, 23, 22]);
  });

  it('reports text with no lines as no table, naming the line', () => {
    const result = parseAligned('  \n\t\n', 5);
    assert.equal(result.ok, false);
    if (!result.ok) {
      assert.equal(result.issue.code, 'no-table');
      assert.match(result.issue.message, /^line 5, column 1: /);
    }
  });

  it('never throws on arbitrary text, and every non-empty cell points at its own text', () => {
    fc.assert(fc.property(anyText, (document) => {
      const result = parseAligned(document);
      if (!result.ok) return;
      for (const row of result.value.rows) for (const cell of row) if (cell.text !== '') assertPointsAt(document, cell, cell.text);
    }), { numRuns: 2000 });
  });
});
