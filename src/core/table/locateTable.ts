import { fail, ok } from '../types';
import type { RawGrid, Result, SourceLocation } from '../types';
import { describeLocation } from './describeLocation';
import { findMarkdownTables } from './findMarkdownTables';
import { parseAligned } from './parseAligned';
import { parseDelimited } from './parseDelimited';
import { splitLines } from './splitLines';

export interface TableRequest {
  format: 'markdown' | 'delimited' | 'text';
  /** 1-based line of the cursor. */
  line?: number;
  /** 1-based, inclusive lines of a selection. */
  selection?: { startLine: number; endLine: number };
  /** 1-based number of the Markdown table in the document. */
  tableIndex?: number;
}

export interface LocatedTable {
  grid: RawGrid;
  /** 1-based number of the chosen table among `count` tables in the document. */
  index: number;
  count: number;
}

/**
 * Finds the table a person means: the one numbered `tableIndex`, the one the selection overlaps,
 * the one around the cursor line, or else the first (the caller can say "3 tables; analysed the
 * first" from `count`).
 *
 * - 'markdown': GFM pipe tables only; a line outside every table fails with the nearest table's lines.
 * - 'delimited': the whole text, or the selected lines, as comma/tab/semicolon/pipe-separated values.
 * - 'text': a Markdown table if the line or selection is in one; otherwise the block of non-blank
 *   lines around the line (or the selected lines), read as aligned columns, or as delimited values
 *   when the block splits consistently on a delimiter but not on spaces.
 *
 * @param text - the whole document
 * @param request - the document's kind and what the person pointed at
 * @returns the table's grid with its number and the number of tables, or an issue
 */
export function locateTable(text: string, request: TableRequest): Result<LocatedTable> {
  const lines = splitLines(text);
  const problem = checkRequest(request, lines.length);
  if (problem) return fail({ code: 'bad-option', message: problem });
  if (request.format === 'delimited') {
    const range = request.selection ?? { startLine: 1, endLine: lines.length };
    const grid = parseDelimited(lines.slice(range.startLine - 1, range.endLine).join('\n'), { firstLine: range.startLine });
    return grid.ok ? ok({ grid: grid.value, index: 1, count: 1 }) : grid;
  }
  const tables = findMarkdownTables(text);
  if (request.format === 'markdown') {
    if (tables.length === 0) {
      return failAt(pointedLine(request), 'there is no Markdown table in this document; a table needs a header row, a delimiter row ' +
        'such as | --- | --- |, and rows of counts.');
    }
    return pickMarkdownTable(tables, request);
  }
  const pointed = request.selection !== undefined || request.line !== undefined;
  if (tables.length > 0 && (!pointed || overlapping(tables, request) >= 0)) return pickMarkdownTable(tables, request);
  const block = textBlock(lines, request);
  if (!block.ok) return block;
  const grid = readTextBlock(lines.slice(block.value.startLine - 1, block.value.endLine).join('\n'), block.value.startLine);
  return grid.ok ? ok({ grid: grid.value, index: 1, count: 1 }) : grid;
}

function checkRequest(request: TableRequest, lineCount: number): string | undefined {
  const isLine = (value: number): boolean => Number.isInteger(value) && value >= 1 && value <= lineCount;
  if (request.line !== undefined && !isLine(request.line)) {
    return `Line ${request.line} is not in the document, which has ${lineCount} lines; give a line from 1 to ${lineCount}.`;
  }
  const selection = request.selection;
  if (selection && (!isLine(selection.startLine) || !isLine(selection.endLine) || selection.startLine > selection.endLine)) {
    return `The selection from line ${selection.startLine} to line ${selection.endLine} is not a range of lines in this ` +
      `${lineCount}-line document; select lines from 1 to ${lineCount}, first line before last.`;
  }
  if (request.tableIndex !== undefined && (!Number.isInteger(request.tableIndex) || request.tableIndex < 1)) {
    return `The table number must be a whole number from 1 up, not ${request.tableIndex}.`;
  }
  return undefined;
}

function pointedLine(request: TableRequest): number {
  return request.selection?.startLine ?? request.line ?? 1;
}

function failAt<T>(line: number, problem: string): Result<T> {
  const location: SourceLocation = { line, column: 1 };
  return fail({ code: 'no-table', message: `${describeLocation(location)}: ${problem}`, location });
}

function overlapping(tables: RawGrid[], request: TableRequest): number {
  const from = request.selection?.startLine ?? request.line;
  const to = request.selection?.endLine ?? request.line;
  if (from === undefined || to === undefined) return -1;
  return tables.findIndex((table) => table.startLine <= to && table.endLine >= from);
}

function pickMarkdownTable(tables: RawGrid[], request: TableRequest): Result<LocatedTable> {
  const count = tables.length;
  if (request.tableIndex !== undefined) {
    if (request.tableIndex > count) {
      return fail({
        code: 'bad-option',
        message: `There ${count === 1 ? 'is 1 table' : `are ${count} tables`} in this document, so there is no table ${request.tableIndex}; choose a table from 1 to ${count}.`,
      });
    }
    return ok({ grid: tables[request.tableIndex - 1], index: request.tableIndex, count });
  }
  if (request.selection === undefined && request.line === undefined) return ok({ grid: tables[0], index: 1, count });
  const found = overlapping(tables, request);
  if (found >= 0) return ok({ grid: tables[found], index: found + 1, count });
  const from = pointedLine(request);
  const to = request.selection?.endLine ?? from;
  const distance = (table: RawGrid): number => Math.max(table.startLine - to, from - table.endLine, 0);
  let nearest = 0;
  tables.forEach((table, index) => { if (distance(table) < distance(tables[nearest])) nearest = index; });
  const table = tables[nearest];
  const where = request.selection ? `lines ${from}-${to} do not overlap a table` : `line ${from} is not inside a table`;
  return failAt(from, `${where}; the nearest table is on lines ${table.startLine}-${table.endLine} (table ${nearest + 1} of ${count}). ` +
    'Put the cursor inside it, select its lines, or choose it by number.');
}

function isBlank(line: string): boolean {
  return /^\s*$/.test(line);
}

function textBlock(lines: string[], request: TableRequest): Result<{ startLine: number; endLine: number }> {
  if (request.selection) {
    let { startLine, endLine } = request.selection;
    while (startLine <= endLine && isBlank(lines[startLine - 1])) startLine += 1;
    while (endLine >= startLine && isBlank(lines[endLine - 1])) endLine -= 1;
    if (startLine > endLine) return failAt(request.selection.startLine, 'the selected lines are blank; select the lines of the table.');
    return ok({ startLine, endLine });
  }
  let around = request.line;
  if (around === undefined) {
    const first = lines.findIndex((line) => !isBlank(line));
    if (first < 0) return failAt(1, 'this document is empty; paste or type a table of counts first.');
    around = first + 1;
  } else if (isBlank(lines[around - 1])) {
    return failAt(around, `line ${around} is blank; put the cursor on a line of the table.`);
  }
  let startLine = around;
  let endLine = around;
  while (startLine > 1 && !isBlank(lines[startLine - 2])) startLine -= 1;
  while (endLine < lines.length && !isBlank(lines[endLine])) endLine += 1;
  return ok({ startLine, endLine });
}

function sameWidth(grid: RawGrid): boolean {
  const width = grid.rows[0].length;
  return width >= 2 && grid.rows.every((row) => row.length === width);
}

/** Aligned columns first; a delimiter when splitting on spaces leaves delimiters on the cells (`North,`) or none to split. */
export function readTextBlock(block: string, firstLine: number): Result<RawGrid> {
  const aligned = parseAligned(block, firstLine);
  const leavesDelimiters = aligned.ok && aligned.value.rows.some((row) => row.some((cell) => cell.text === '|' || /[,;]$/.test(cell.text)));
  if (aligned.ok && sameWidth(aligned.value) && !leavesDelimiters) return aligned;
  const delimited = parseDelimited(block, { firstLine });
  if (delimited.ok && sameWidth(delimited.value)) return delimited;
  return aligned;
}
