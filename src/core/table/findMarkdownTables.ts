import type { RawCell, RawGrid } from '../types';

/**
 * Finds every GitHub Flavored Markdown pipe table in a document (GitHub Flavored Markdown Spec
 * 0.29-gfm, section 4.10 "Tables (extension)").
 *
 * A table is a header row, a delimiter row (`---`, `:--`, `--:`, `:-:` per cell) with as many
 * cells as the header, then body rows until a blank line or the start of another block
 * (block quote, heading, fence, thematic break, HTML block, list item). Cells are split at every
 * `|` that is not preceded by a backslash, inside code spans too, as the spec says. Lines inside
 * fenced code blocks, HTML comments and raw-text HTML blocks, and header rows indented four or more
 * spaces (indented code) are never tables.
 *
 * Unlike a renderer, body rows are kept as written (not padded or cut to the header's width), so
 * that a later check can name a row with a missing or extra cell.
 *
 * @param text - the whole Markdown document
 * @returns the tables in document order; rows[0] is the header row; the delimiter row is left out
 */
export function findMarkdownTables(text: string): RawGrid[] {
  const lines = new LineIndex(text);
  const tables: RawGrid[] = [];
  let fence: Fence | undefined;
  let htmlEnd: RegExp | undefined;
  let htmlUntilBlank = false;
  let index = 0;
  while (index < lines.count) {
    const lead = lines.leadingCode(index);
    if (fence) {
      if (lead === fence.code && closesFence(lines.text(index), fence)) fence = undefined;
    } else if (htmlEnd) {
      if (htmlEnd.test(lines.text(index))) htmlEnd = undefined;
    } else if (htmlUntilBlank) {
      htmlUntilBlank = lead !== BLANK;
    } else if ((lead === BACKTICK || lead === TILDE) && opensFence(lines.text(index))) {
      fence = opensFence(lines.text(index));
    } else if (lead === LESS_THAN && opensHtmlBlock(lines.text(index))) {
      const line = lines.text(index);
      const html = opensHtmlBlock(line);
      if (html === 'until-blank') htmlUntilBlank = true;
      else if (html && !html.test(line.slice(line.indexOf('<') + 1))) htmlEnd = html;
    } else if (lead !== BLANK && lead !== INDENTED && index + 1 < lines.count && DELIMITER_LEADS.has(lines.leadingCode(index + 1))) {
      const table = readTableAt(lines, index);
      if (table) {
        tables.push(table);
        index = table.endLine;
        continue;
      }
    }
    index += 1;
  }
  return tables;
}

const BYTE_ORDER_MARK = 0xfeff;
const BLANK = -1;
const INDENTED = -2;
const BACKTICK = 96;
const TILDE = 126;
const LESS_THAN = 60;
const DELIMITER_LEADS = new Set([124, 45, 58]);

/**
 * Line starts of a document, so that the scan touches most lines through a few character codes
 * instead of allocating every line (a 5 MB note is mostly prose).
 */
class LineIndex {
  private readonly source: string;
  private readonly starts: number[] = [0];
  readonly count: number;

  constructor(text: string) {
    const body = text.charCodeAt(0) === BYTE_ORDER_MARK ? text.slice(1) : text;
    // Replacing \r\n and lone \r by \n keeps every line number and column.
    this.source = body.includes('\r') ? body.replace(/\r\n?/g, '\n') : body;
    for (let at = this.source.indexOf('\n'); at >= 0; at = this.source.indexOf('\n', at + 1)) this.starts.push(at + 1);
    this.count = this.starts.length;
  }

  private end(index: number): number {
    return index + 1 < this.count ? this.starts[index + 1] - 1 : this.source.length;
  }

  text(index: number): string {
    return this.source.slice(this.starts[index], this.end(index));
  }

  /** The first non-blank character code within three spaces of indentation, BLANK, or INDENTED (code). */
  leadingCode(index: number): number {
    const end = this.end(index);
    let position = this.starts[index];
    let width = 0;
    for (; position < end; position += 1) {
      const code = this.source.charCodeAt(position);
      if (code === 32) width += 1;
      else if (code === 9) width += 4 - (width % 4);
      else break;
    }
    if (position === end) return BLANK;
    return width > MAX_BLOCK_INDENT ? INDENTED : this.source.charCodeAt(position);
  }
}

interface Fence {
  char: string;
  code: number;
  length: number;
}

/** CommonMark: up to three spaces of indentation before a block marker; four or more is indented code. */
const MAX_BLOCK_INDENT = 3;

function indentWidth(line: string): number {
  let width = 0;
  while (width < line.length && line.charCodeAt(width) === 32) width += 1;
  if (line.charCodeAt(width) === 9) return MAX_BLOCK_INDENT + 1;
  return width;
}

function opensFence(line: string): Fence | undefined {
  const match = /^ {0,3}(`{3,}|~{3,})(.*)$/.exec(line);
  if (!match) return undefined;
  const marker = match[1];
  if (marker[0] === '`' && match[2].includes('`')) return undefined;
  return { char: marker[0], code: marker.charCodeAt(0), length: marker.length };
}

function closesFence(line: string, fence: Fence): boolean {
  const match = /^ {0,3}(`{3,}|~{3,})[ \t]*$/.exec(line);
  return match !== null && match[1][0] === fence.char && match[1].length >= fence.length;
}

const RAW_TEXT_TAGS = /^ {0,3}<(?:script|pre|style|textarea)(?:[\s>]|$)/i;
const BLOCK_TAGS = new Set(('address article aside base basefont blockquote body caption center col colgroup dd details ' +
  'dialog dir div dl dt fieldset figcaption figure footer form frame frameset h1 h2 h3 h4 h5 h6 head header hr ' +
  'html iframe legend li link main menu menuitem nav noframes ol optgroup option p param section source summary ' +
  'table tbody td tfoot th thead title tr track ul').split(' '));

/** HTML block kinds 1-6 of CommonMark 0.29 section 4.6: the end condition, or "ends at a blank line". */
function opensHtmlBlock(line: string): RegExp | 'until-blank' | undefined {
  if (indentWidth(line) > MAX_BLOCK_INDENT || !/^ {0,3}</.test(line)) return undefined;
  if (RAW_TEXT_TAGS.test(line)) return /<\/(?:script|pre|style|textarea)>/i;
  if (/^ {0,3}<!--/.test(line)) return /-->/;
  if (/^ {0,3}<\?/.test(line)) return /\?>/;
  if (/^ {0,3}<![A-Z]/.test(line)) return />/;
  if (/^ {0,3}<!\[CDATA\[/.test(line)) return /\]\]>/;
  const tag = /^ {0,3}<\/?([A-Za-z][A-Za-z0-9]*)(?:[\s/>]|$)/.exec(line);
  if (tag && BLOCK_TAGS.has(tag[1].toLowerCase())) return 'until-blank';
  return undefined;
}

/** A line that starts another block and so ends a table (GFM 4.10: "the table is broken at ... another block-level structure"). */
function startsOtherBlock(line: string): boolean {
  if (indentWidth(line) > MAX_BLOCK_INDENT) return false;
  return /^ {0,3}(?:>|#{1,6}(?:[ \t]|$)|[-+*][ \t]|\d{1,9}[.)][ \t]|(?:(?:\*[ \t]*){3,}|(?:-[ \t]*){3,}|(?:_[ \t]*){3,})$)/.test(line)
    || opensFence(line) !== undefined
    || opensHtmlBlock(line) !== undefined;
}

/** Splits a row at unescaped pipes, dropping one leading and one trailing pipe (GFM 4.10). */
function splitRow(line: string, lineNumber: number): RawCell[] {
  let end = line.length;
  while (end > 0 && isSpaceOrTab(line.charCodeAt(end - 1))) end -= 1;
  let start = 0;
  while (start < end && isSpaceOrTab(line.charCodeAt(start))) start += 1;
  if (line.charCodeAt(start) === PIPE) start += 1;
  if (end > start && line.charCodeAt(end - 1) === PIPE && line.charCodeAt(end - 2) !== BACKSLASH) end -= 1;
  const cells: RawCell[] = [];
  let cellStart = start;
  for (let index = start; index <= end; index += 1) {
    if (index === end || (line.charCodeAt(index) === PIPE && line.charCodeAt(index - 1) !== BACKSLASH)) {
      cells.push(trimmedCell(line, cellStart, index, lineNumber));
      cellStart = index + 1;
    }
  }
  return cells;
}

const PIPE = 124;
const BACKSLASH = 92;

function isSpaceOrTab(code: number): boolean {
  return code === 32 || code === 9;
}

function trimmedCell(line: string, from: number, to: number, lineNumber: number): RawCell {
  let start = from;
  let end = to;
  while (start < end && isSpaceOrTab(line.charCodeAt(start))) start += 1;
  while (end > start && isSpaceOrTab(line.charCodeAt(end - 1))) end -= 1;
  return { text: line.slice(start, end), line: lineNumber, column: (start === end ? from : start) + 1 };
}

const DELIMITER_CELL = /^:?-+:?$/;

function delimiterCellCount(line: string): number {
  if (indentWidth(line) > MAX_BLOCK_INDENT || !line.includes('|')) return 0;
  const first = line.trimStart()[0];
  if (first !== '|' && first !== '-' && first !== ':') return 0;
  const cells = splitRow(line, 0);
  for (const cell of cells) {
    if (!DELIMITER_CELL.test(cell.text)) return 0;
  }
  return cells.length;
}

function readTableAt(lines: LineIndex, headerIndex: number): RawGrid | undefined {
  const delimiterLine = lines.text(headerIndex + 1);
  if (!delimiterLine.includes('-') || !delimiterLine.includes('|')) return undefined;
  const header = lines.text(headerIndex);
  if (startsOtherBlock(header)) return undefined;
  const columnCount = delimiterCellCount(delimiterLine);
  if (columnCount === 0) return undefined;
  const headerCells = splitRow(header, headerIndex + 1);
  if (headerCells.length !== columnCount) return undefined;
  const rows: RawCell[][] = [headerCells];
  let index = headerIndex + 2;
  while (index < lines.count) {
    const lead = lines.leadingCode(index);
    if (lead === BLANK) break;
    const line = lines.text(index);
    if (lead !== PIPE && startsOtherBlock(line)) break;
    rows.push(splitRow(line, index + 1));
    index += 1;
  }
  return { format: 'markdown', rows, startLine: headerIndex + 1, endLine: index };
}
