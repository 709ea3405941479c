import { fail, ok } from '../types';
import type { RawCell, RawGrid, Result } from '../types';
import { describeLocation } from './describeLocation';

export interface DelimitedOptions {
  /** Field separator; detected among `,` tab `;` `|` when absent. */
  delimiter?: string;
  /** Document line of the text's first line, when the text is a selection (default 1). */
  firstLine?: number;
}

/**
 * Reads comma-, tab-, semicolon- or pipe-separated text into a grid of cells with their document
 * positions (quoting as in RFC 4180: a field opened by `"` may hold delimiters, line breaks and
 * doubled quotes `""`).
 *
 * Hand-written rather than csv-parse: every cell needs the line and column where its trimmed text
 * starts, which csv-parse reports per record only.
 *
 * The delimiter, when not given, is the candidate that splits the first records into the same
 * number (two or more) of fields outside quotes; ties go to tab, then `;` (its commas are then
 * likely decimal commas), then `,`, then `|`. A leading byte order mark is dropped without
 * shifting columns; records whose fields are all empty (blank lines, `,,,` rows) are skipped; columns
 * at the edges that are empty in every record (from `|a|b|` lines or trailing delimiters) are dropped.
 *
 * @param text - the delimited text (a whole file or a selection)
 * @param options - delimiter and the document line of the first line
 * @returns the grid, or an issue for an unclosed quote, empty text or a bad option
 */
export function parseDelimited(text: string, options: DelimitedOptions = {}): Result<RawGrid> {
  const firstLine = options.firstLine ?? 1;
  if (!Number.isInteger(firstLine) || firstLine < 1) {
    return fail({ code: 'bad-option', message: `The first line must be a whole number from 1 up, not ${firstLine}.` });
  }
  const body = text.charCodeAt(0) === BYTE_ORDER_MARK ? text.slice(1) : text;
  let delimiter = options.delimiter;
  if (delimiter !== undefined && (delimiter.length !== 1 || /["\r\n]/.test(delimiter))) {
    return fail({
      code: 'bad-option',
      message: `The delimiter must be one character other than a quote or a line break, not ${JSON.stringify(delimiter)}.`,
    });
  }
  delimiter ??= detectDelimiter(body, firstLine);
  const scan = scanRecords(body, delimiter, firstLine, Infinity);
  if (scan.unclosedQuote) {
    const where = scan.unclosedQuote;
    return fail({
      code: 'unreadable',
      message: `${describeLocation(where)}: this quoted field never closes; add the closing " (write "" for a quote inside a field).`,
      location: where,
    });
  }
  if (scan.records.length === 0) {
    const location = { line: firstLine, column: 1 };
    return fail({
      code: 'no-table',
      message: `${describeLocation(location)}: there are no rows of data here; select the lines of a comma-, tab- or semicolon-separated table.`,
      location,
    });
  }
  const rows = dropEmptyEdgeColumns(scan.records.map((record) => record.cells));
  return ok({
    format: 'delimited',
    rows,
    startLine: scan.records[0].startLine,
    endLine: scan.records[scan.records.length - 1].endLine,
    delimiter,
  });
}

const BYTE_ORDER_MARK = 0xfeff;
const CANDIDATE_DELIMITERS = ['\t', ';', ',', '|'];
/** Records examined to detect the delimiter; enough to see a header and several rows (common practice in sniffers). */
const DETECTION_SAMPLE_RECORDS = 30;

interface ScannedRecord {
  cells: RawCell[];
  startLine: number;
  endLine: number;
}

interface Scan {
  records: ScannedRecord[];
  unclosedQuote?: { line: number; column: number };
}

function detectDelimiter(body: string, firstLine: number): string {
  let best = { delimiter: ',', agreeing: 0, width: 1 };
  for (const delimiter of CANDIDATE_DELIMITERS) {
    const scan = scanRecords(body, delimiter, firstLine, DETECTION_SAMPLE_RECORDS);
    const widths = scan.records.map((record) => record.cells.length);
    if (widths.length === 0) continue;
    const width = modalValue(widths);
    if (width < 2) continue;
    const agreeing = widths.filter((value) => value === width).length - (scan.unclosedQuote ? widths.length : 0);
    if (agreeing > best.agreeing) best = { delimiter, agreeing, width };
  }
  return best.delimiter;
}

function modalValue(values: number[]): number {
  const tally = new Map<number, number>();
  let mode = values[0];
  for (const value of values) {
    const seen = (tally.get(value) ?? 0) + 1;
    tally.set(value, seen);
    if (seen > (tally.get(mode) ?? 0) || (seen === tally.get(mode) && value > mode)) mode = value;
  }
  return mode;
}

function isLineBreak(code: number): boolean {
  return code === 10 || code === 13;
}

function scanRecords(body: string, delimiter: string, firstLine: number, maxRecords: number): Scan {
  const records: ScannedRecord[] = [];
  const delimiterCode = delimiter.charCodeAt(0);
  const length = body.length;
  let index = 0;
  let line = firstLine;
  let lineStart = 0;
  let cells: RawCell[] = [];
  let recordStartLine = line;
  let recordHasText = false;
  const skipLineBreak = (): void => {
    if (body.charCodeAt(index) === 13 && body.charCodeAt(index + 1) === 10) index += 1;
    index += 1;
    line += 1;
    lineStart = index;
  };
  while (index <= length && records.length < maxRecords) {
    while (index < length && (body[index] === ' ' || body[index] === '\t') && body.charCodeAt(index) !== delimiterCode) index += 1;
    let cell: RawCell;
    if (body[index] === '"') {
      const opening = { line, column: index - lineStart + 1 };
      index += 1;
      let content = '';
      let contentLocation: { line: number; column: number } | undefined;
      let closed = false;
      while (index < length) {
        const code = body.charCodeAt(index);
        if (code === 34) {
          if (body.charCodeAt(index + 1) === 34) {
            contentLocation ??= { line, column: index - lineStart + 1 };
            content += '"';
            index += 2;
            continue;
          }
          index += 1;
          closed = true;
          break;
        }
        if (isLineBreak(code)) {
          content += '\n';
          skipLineBreak();
          continue;
        }
        if (contentLocation === undefined && !/\s/.test(body[index])) contentLocation = { line, column: index - lineStart + 1 };
        content += body[index];
        index += 1;
      }
      if (!closed) return { records, unclosedQuote: opening };
      const trailingStart = index;
      while (index < length && body.charCodeAt(index) !== delimiterCode && !isLineBreak(body.charCodeAt(index))) index += 1;
      content += body.slice(trailingStart, index);
      const location = contentLocation ?? { line: opening.line, column: opening.column + 1 };
      cell = { text: content.trim(), line: location.line, column: location.column };
      recordHasText ||= cell.text !== '';
    } else {
      const fieldStart = index;
      while (index < length && body.charCodeAt(index) !== delimiterCode && !isLineBreak(body.charCodeAt(index))) index += 1;
      const raw = body.slice(fieldStart, index);
      const text = raw.trim();
      cell = { text, line, column: fieldStart - lineStart + 1 + (raw.length - raw.trimStart().length) };
      recordHasText ||= text !== '';
    }
    cells.push(cell);
    if (index < length && body.charCodeAt(index) === delimiterCode) {
      index += 1;
      continue;
    }
    if (recordHasText) records.push({ cells, startLine: recordStartLine, endLine: line });
    cells = [];
    recordHasText = false;
    if (index >= length) break;
    skipLineBreak();
    recordStartLine = line;
  }
  return { records };
}

function dropEmptyEdgeColumns(rows: RawCell[][]): RawCell[][] {
  let result = rows;
  while (result.every((row) => row.length > 1 && row[0].text === '')) result = result.map((row) => row.slice(1));
  for (;;) {
    const width = result.reduce((widest, row) => Math.max(widest, row.length), 0);
    const last = width - 1;
    if (width <= 1 || !result.every((row) => row.length <= last || row[last].text === '')) break;
    result = result.map((row) => (row.length > last ? row.slice(0, last) : row));
  }
  return result;
}
