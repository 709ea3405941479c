import { fail, ok } from '../types';
import type { RawCell, RawGrid, Result } from '../types';
import { describeLocation } from './describeLocation';
import { splitLines } from './splitLines';

/**
 * Reads a whitespace-aligned plain-text table, as pasted from a terminal or a spreadsheet, into a
 * grid of cells with their document positions.
 *
 * Tried in turn, the first that gives every row the same number of cells (two or more) wins:
 * 1. tab-separated cells, when the lines hold tabs (a spreadsheet paste; an empty first cell stays);
 * 2. cells separated by two or more spaces or tabs, so "Night shift" stays one label;
 * 3. the same with a header row one cell short (an empty top-left corner);
 * 4. column boundaries shared by all rows: cells whose character ranges overlap across rows form a
 *    column, so a row with a blank cell keeps its other cells in place;
 * 5. cells separated by single spaces (also with a short header row);
 * 6. single spaces where each row is a label of several words followed by the same number of numbers.
 * When none fits, the rows are returned as split (two-space cells if any row has several, else
 * single-space), so that a later check names the row that does not line up.
 *
 * @param text - the table's lines; blank lines are skipped
 * @param firstLine - document line of the text's first line (default 1)
 * @returns the grid, or a 'no-table' issue when the text has no non-blank line
 */
export function parseAligned(text: string, firstLine = 1): Result<RawGrid> {
  const lines: SourceLine[] = [];
  splitLines(text).forEach((content, index) => {
    if (!/^\s*$/.test(content)) lines.push({ content, line: firstLine + index });
  });
  if (lines.length === 0) {
    const location = { line: firstLine, column: 1 };
    return fail({
      code: 'no-table',
      message: `${describeLocation(location)}: there is no text here; put the cursor on a line of the table or select its lines.`,
      location,
    });
  }
  const rows = alignRows(lines);
  return ok({
    format: 'aligned',
    rows: rows.map((row, index) => row.map((field) => toCell(field, lines[index].line))),
    startLine: lines[0].line,
    endLine: lines[lines.length - 1].line,
  });
}

interface SourceLine {
  content: string;
  line: number;
}

interface Field {
  text: string;
  /** 0-based index of the first character in the line. */
  start: number;
  end: number;
}

const TWO_SPACE_FIELD = /[^ \t\f\v\r\n]+(?: [^ \t\f\v\r\n]+)*/g;
const WORD = /[^ \t\f\v\r\n]+/g;
const NUMBER_TOKEN = /^[+\-\u2212]?\d[\d.,'\u2019\u00a0\u202f\u2009]*%?$/;

function alignRows(lines: SourceLine[]): Field[][] {
  const hasTabs = lines.some((line) => line.content.includes('\t'));
  if (hasTabs) {
    const tabbed = lines.map((line) => splitOnTabs(line.content));
    if (sameWidth(tabbed)) return tabbed;
    const trimmed = tabbed.map(dropTrailingEmpty);
    if (sameWidth(trimmed)) return trimmed;
  }
  const twoSpace = lines.map((line) => matchFields(line.content, TWO_SPACE_FIELD));
  const viaTwoSpace = sameWidth(twoSpace) ? twoSpace : withCorner(twoSpace) ?? (hasTabs ? undefined : byColumnRanges(twoSpace));
  if (viaTwoSpace) return viaTwoSpace;
  const words = lines.map((line) => matchFields(line.content, WORD));
  const viaWords = sameWidth(words) ? words : withCorner(words) ?? labelsThenNumbers(words, lines);
  if (viaWords) return viaWords;
  return twoSpace.some((row) => row.length > 1) ? twoSpace : words;
}

function matchFields(content: string, pattern: RegExp): Field[] {
  const fields: Field[] = [];
  for (const match of content.matchAll(pattern)) {
    const start = match.index ?? 0;
    fields.push({ text: match[0], start, end: start + match[0].length });
  }
  return fields;
}

function splitOnTabs(content: string): Field[] {
  const fields: Field[] = [];
  let start = 0;
  for (const piece of content.split('\t')) {
    const lead = piece.length - piece.trimStart().length;
    const text = piece.trim();
    fields.push({ text, start: start + lead, end: start + lead + text.length });
    start += piece.length + 1;
  }
  return fields;
}

function dropTrailingEmpty(row: Field[]): Field[] {
  let end = row.length;
  while (end > 1 && row[end - 1].text === '') end -= 1;
  return row.slice(0, end);
}

function sameWidth(rows: Field[][]): boolean {
  const width = rows[0].length;
  return width >= 2 && rows.every((row) => row.length === width);
}

/** A header row one cell short of equally wide body rows: the top-left corner was left empty. */
function withCorner(rows: Field[][]): Field[][] | undefined {
  if (rows.length < 2) return undefined;
  const width = rows[1].length;
  if (width < 2 || rows[0].length !== width - 1 || !rows.slice(1).every((row) => row.length === width)) return undefined;
  return [[{ text: '', start: 0, end: 0 }, ...rows[0]], ...rows.slice(1)];
}

/** Columns as the union of overlapping character ranges over all rows; a row may miss a cell. */
function byColumnRanges(rows: Field[][]): Field[][] | undefined {
  const spans = rows.flat().sort((a, b) => a.start - b.start);
  const columns: { start: number; end: number }[] = [];
  for (const span of spans) {
    const last = columns[columns.length - 1];
    if (last && span.start < last.end) last.end = Math.max(last.end, span.end);
    else columns.push({ start: span.start, end: span.end });
  }
  const widest = rows.reduce((most, row) => Math.max(most, row.length), 0);
  if (columns.length < 2 || columns.length > widest) return undefined;
  const aligned: Field[][] = [];
  for (const row of rows) {
    const cells: (Field | undefined)[] = columns.map(() => undefined);
    for (const field of row) {
      const column = columns.findIndex((range) => field.start >= range.start && field.start < range.end);
      if (cells[column]) return undefined;
      cells[column] = field;
    }
    aligned.push(cells.map((cell, index) => cell ?? { text: '', start: columns[index].start, end: columns[index].start }));
  }
  return aligned;
}

/** Rows like "Night shift 12 7": leading words form the label, the trailing numbers the counts. */
function labelsThenNumbers(rows: Field[][], lines: SourceLine[]): Field[][] | undefined {
  const trailingNumbers = (row: Field[]): number => {
    let count = 0;
    while (count < row.length && NUMBER_TOKEN.test(row[row.length - 1 - count].text)) count += 1;
    return count;
  };
  const body = rows.slice(1);
  if (body.length === 0) return undefined;
  const width = trailingNumbers(body[0]);
  if (width < 1 || !body.every((row) => trailingNumbers(row) === width && row.length > width)) return undefined;
  const joinLabel = (row: Field[], index: number): Field[] => {
    const words = row.slice(0, row.length - width);
    const start = words[0].start;
    const end = words[words.length - 1].end;
    return [{ text: lines[index].content.slice(start, end), start, end }, ...row.slice(row.length - width)];
  };
  const header = rows[0];
  let headerRow: Field[];
  if (trailingNumbers(header) === width && header.length > width) headerRow = joinLabel(header, 0);
  else if (header.length === width) headerRow = [{ text: '', start: 0, end: 0 }, ...header];
  else if (header.length === width + 1) headerRow = header;
  else return undefined;
  return [headerRow, ...body.map((row, index) => joinLabel(row, index + 1))];
}

function toCell(field: Field, line: number): RawCell {
  return { text: field.text, line, column: field.start + 1 };
}
