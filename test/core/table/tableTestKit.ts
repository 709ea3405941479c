import assert from 'node:assert/strict';
import fc from 'fast-check';
import type { SourceLocation } from '../../../src/core/types';

/** The document's text from `location` to the end of that line (lines split as editors do). */
export function textAt(document: string, location: SourceLocation): string {
  const body = document.charCodeAt(0) === 0xfeff ? document.slice(1) : document;
  const line = body.split(/\r\n|\r|\n/)[location.line - 1] ?? '';
  return line.slice(location.column - 1);
}

/** Asserts that the document shows `expected` at `location`. */
export function assertPointsAt(document: string, location: SourceLocation | undefined, expected: string): void {
  assert.ok(location, `expected a location pointing at ${JSON.stringify(expected)}`);
  const found = textAt(document, location);
  assert.ok(found.startsWith(expected),
    `line ${location.line}, column ${location.column} shows ${JSON.stringify(found.slice(0, 40))}, expected ${JSON.stringify(expected)}`);
}

/** Scenario words of our own (greenhouse, bus depot, bakery, ski school); none of them means "total". */
const WORDS = ['Early', 'Late', 'Night', 'North', 'South', 'Depot', 'Blue', 'Red', 'Run', 'Shift', 'Oven', 'Rye',
  'Spelt', 'Tomato', 'Basil', 'Glasshouse', 'Slope', 'Beginner', 'Expert', 'Sourdough', 'Route', 'Tram', 'Kiln'];

export const labelArbitrary: fc.Arbitrary<string> = fc
  .tuple(fc.constantFrom(...WORDS), fc.option(fc.constantFrom(...WORDS.map((word) => word.toLowerCase())), { nil: undefined }))
  .map(([first, second]) => (second ? `${first} ${second}` : first));

export interface CountScenario {
  rowLabels: string[];
  columnLabels: string[];
  counts: number[][];
}

function hasZeroLine(counts: number[][]): boolean {
  const columns = counts[0].length;
  const rowZero = counts.length > 0 && columns >= 2 && counts.some((row) => row.every((value) => value === 0));
  const columnZero = counts.length >= 2 && counts[0].some((_, column) => counts.every((row) => row[column] === 0));
  return rowZero || columnZero;
}

function looksLikePercentages(counts: number[][]): boolean {
  if (counts.length < 2 || counts[0].length < 2) return false;
  const rowsAre100 = counts.every((row) => row.reduce((sum, value) => sum + value, 0) === 100);
  const columnsAre100 = counts[0].every((_, column) => counts.reduce((sum, row) => sum + row[column], 0) === 100);
  return rowsAre100 || columnsAre100;
}

/** A count matrix with distinct labels that a reader must give back unchanged (no all-zero lines, no 100-sums). */
export const countScenarioArbitrary: fc.Arbitrary<CountScenario> = fc
  .record({ rows: fc.integer({ min: 1, max: 6 }), columns: fc.integer({ min: 1, max: 6 }) })
  .filter(({ rows, columns }) => rows * columns >= 2)
  .chain(({ rows, columns }) => fc.record({
    rowLabels: fc.uniqueArray(labelArbitrary, { minLength: rows, maxLength: rows }),
    columnLabels: fc.uniqueArray(labelArbitrary, { minLength: columns, maxLength: columns }),
    counts: fc.array(fc.array(fc.oneof(fc.nat({ max: 30 }), fc.nat({ max: 250000 })), { minLength: columns, maxLength: columns }),
      { minLength: rows, maxLength: rows }),
  }))
  .filter((scenario) => !scenario.counts.every((row) => row.every((value) => value === 0)))
  .filter((scenario) => !hasZeroLine(scenario.counts) && !looksLikePercentages(scenario.counts));

/** Pieces that table parsers treat specially, to build table-ish noise. */
export const tableishText: fc.Arbitrary<string> = fc
  .array(fc.constantFrom('|', '| ', ' |', '---', ':--', '--:', ' ', '  ', '\t', '\n', '\r\n', '\r', '"', '""', ',', ';',
    '`', '```', '~~~', '\\', '\\|', '*', '**', '_', '%', '#', '>', '-', '<!--', '-->', '<pre>', 'Total', 'North', '12',
    '1,204', '0', '1.5', '\u00a0', '\ufeff', '    ', 'Night shift'), { maxLength: 80 })
  .map((pieces) => pieces.join(''));

/** Arbitrary text: UTF-16 strings, full Unicode (fast-check 4 spells fullUnicodeString as unit 'binary'), and table-ish noise. */
export const anyText: fc.Arbitrary<string> = fc.oneof(
  fc.string({ maxLength: 200 }),
  fc.string({ unit: 'binary', maxLength: 200 }),
  fc.string({ unit: fc.constantFrom('|', '-', ':', ' ', '\n', '"', ',', ';', '\t', 'a', '1'), maxLength: 200 }),
  tableishText,
);
