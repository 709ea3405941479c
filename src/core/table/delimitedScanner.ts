import type { Issue, IssueCode, SourceLocation } from '../types';
import { detectDelimiter } from './detectDelimiter';

const QUOTE = 34;
const LF = 10;
const CR = 13;
const SPACE = 32;
const BYTE_ORDER_MARK = 0xfeff;

const FIELD_START = 0;
const UNQUOTED = 1;
const QUOTED = 2;
const QUOTE_IN_QUOTED = 3;

/** Capture-mask value: slice the field's text into `values`. */
export const SLICE_FIELD = 1;
/** Capture-mask values above this one are label roles, handed to `lookUpLabel` when the field lies whole in a chunk. */
const LAST_SLICE_ROLE = SLICE_FIELD;

/** Position of the next `search` at or after `from`, or the end of `text`. */
function indexOrEnd(text: string, search: string, from: number): number {
  const at = text.indexOf(search, from);
  return at < 0 ? text.length : at;
}

/**
 * The CSV state machine of the cross-tabulator (quoting per RFC 4180, with the leniencies documented on
 * `createCrossTabulator`): it takes text in chunks split anywhere, detects the delimiter from the first
 * non-blank line, and hands each record to `endRecord`, having read only the fields its capture mask asks for.
 *
 * Until `captureAll` is turned off every field is sliced into `values` (with its line and column); after that a
 * field is skipped (mask 0), sliced (`SLICE_FIELD`) or offered to `lookUpLabel` with its role (any larger value),
 * so a label seen before is recognised without allocating a string. Fields past `lastCaptured` are only counted.
 * The first problem found is kept in `failure`; scanning stops there.
 */
export abstract class DelimitedScanner {
  protected readonly firstLine: number;
  protected failure: Issue | undefined;
  protected delimiterCode = -1;
  protected line: number;
  protected recordLine: number;
  protected values: string[] = [];
  protected valueLines: number[] = [];
  protected valueColumns: number[] = [];
  protected captureAll = true;
  protected capture = new Uint8Array(0);
  /** Fields after this one are only counted, not read; until the columns are settled, every field is read. */
  protected lastCaptured = Number.MAX_SAFE_INTEGER;

  private started = false;
  /** Before the delimiter is known: the text so far, and a quote-aware search for the first non-blank line. */
  private headerChunks: string[] = [];
  private headerSearch = { inQuotes: false, lineStart: 0, lineHasContent: false, scanned: 0 };
  private state = FIELD_START;
  private fieldIndex = 0;
  private capturing = false;
  private tracked = false;
  private pending = '';
  private crPending = false;
  private offset = 0;
  private lineStart = 0;
  private quoteLocation: SourceLocation = { line: 1, column: 1 };

  protected constructor(firstLine: number) {
    this.firstLine = firstLine;
    this.line = firstLine;
    this.recordLine = firstLine;
  }

  /** Keeps the first problem only: later ones are often consequences of it. */
  protected setFailure(code: IssueCode, message: string, location: SourceLocation): void {
    if (this.failure === undefined) this.failure = { code, message, location };
  }

  /** Stores a sliced field's text in `values[fieldIndex]`. */
  protected abstract storeValue(fieldIndex: number, value: string): void;

  /** Recognises (or else slices) the unquoted field `chunk[start, end)` whose capture-mask role is `role`. */
  protected abstract lookUpLabel(chunk: string, start: number, end: number, role: number): void;

  /** Receives a finished record of `fieldCount` fields that starts on `recordLine`. */
  protected abstract endRecord(fieldCount: number): void;

  /** Feeds the next piece of text (after `failure`, pieces are ignored). */
  protected scanChunk(chunk: string): void {
    if (this.failure !== undefined || chunk.length === 0) return;
    if (!this.started) {
      this.started = true;
      if (chunk.charCodeAt(0) === BYTE_ORDER_MARK) chunk = chunk.slice(1);
    }
    if (this.delimiterCode < 0) {
      this.headerChunks.push(chunk);
      const headerEnd = this.findHeaderEnd(chunk);
      if (headerEnd >= 0) this.startWithDelimiter(headerEnd);
      return;
    }
    this.scan(chunk);
  }

  /** Ends the text: scans what waited for a delimiter, and ends the last record when the text stops without a line break. */
  protected endInput(): void {
    if (this.failure === undefined && this.delimiterCode < 0) this.startWithDelimiter(this.headerSearch.scanned);
    if (this.failure === undefined) this.endText();
  }

  /** Continues the quote-aware search for the first non-blank line over `chunk`; returns where it ends, or -1. */
  private findHeaderEnd(chunk: string): number {
    const search = this.headerSearch;
    for (let i = 0; i < chunk.length; i++) {
      const c = chunk.charCodeAt(i);
      if (c === QUOTE) {
        search.inQuotes = !search.inQuotes;
      } else if (!search.inQuotes && (c === LF || c === CR)) {
        if (search.lineHasContent) return search.scanned + i;
        search.lineStart = search.scanned + i + 1;
      } else if (c !== SPACE) {
        search.lineHasContent = true;
      }
    }
    search.scanned += chunk.length;
    return -1;
  }

  /** Detects the delimiter from the header line ending at `headerEnd` in the buffered text, then parses that text. */
  private startWithDelimiter(headerEnd: number): void {
    const buffered = this.headerChunks.join('');
    this.headerChunks = [];
    const headerLine = this.headerSearch.lineHasContent ? buffered.slice(this.headerSearch.lineStart, headerEnd) : '';
    this.delimiterCode = detectDelimiter(headerLine).charCodeAt(0);
    this.scan(buffered);
  }

  /**
   * Walks `chunk` once, slicing only the fields that are counted. It jumps between delimiters, line breaks
   * and quotes with `indexOf` (much faster than testing every character), caching the next position of each,
   * which stays valid until the walk passes it.
   */
  private scan(chunk: string): void {
    const n = chunk.length;
    if (n === 0) return;
    const delimiterCode = this.delimiterCode;
    const delimiter = String.fromCharCode(delimiterCode);
    let i = 0;
    let state = this.state;
    let fieldIndex = this.fieldIndex;
    let capturing = this.capturing;
    let tracked = this.tracked;
    let captureAll = this.captureAll;
    let capture = this.capture;
    let lastCaptured = this.lastCaptured;
    let segmentStart = 0;
    let nextDelimiter = -1;
    let nextLineFeed = -1;
    let nextCarriageReturn = -1;
    let nextQuote = -1;
    if (this.crPending) {
      this.crPending = false;
      if (chunk.charCodeAt(0) === LF) {
        i = 1;
        this.lineStart = this.offset + 1;
      }
    }
    while (i < n) {
      if (state === FIELD_START && fieldIndex > lastCaptured) {
        // Past the last field that counts: jump to the line end, counting delimiters, unless a quote comes first.
        if (nextLineFeed < i) nextLineFeed = indexOrEnd(chunk, '\n', i);
        if (nextCarriageReturn < i) nextCarriageReturn = indexOrEnd(chunk, '\r', i);
        if (nextQuote < i) nextQuote = indexOrEnd(chunk, '"', i);
        const lineBreak = nextLineFeed < nextCarriageReturn ? nextLineFeed : nextCarriageReturn;
        if (lineBreak < nextQuote) {
          for (;;) {
            if (nextDelimiter < i) nextDelimiter = indexOrEnd(chunk, delimiter, i);
            if (nextDelimiter >= lineBreak) break;
            fieldIndex++;
            i = nextDelimiter + 1;
          }
          capturing = false;
          tracked = false;
          segmentStart = i;
          state = UNQUOTED;
        }
      }
      if (state === FIELD_START) {
        if (fieldIndex === 0) this.recordLine = this.line;
        capturing = captureAll || (fieldIndex < capture.length && capture[fieldIndex] !== 0);
        tracked = capturing || fieldIndex === 0;
        if (capturing) {
          this.valueLines[fieldIndex] = this.line;
          this.valueColumns[fieldIndex] = this.offset + i - this.lineStart + 1;
        }
        if (tracked) this.pending = '';
        segmentStart = i;
        if (chunk.charCodeAt(i) === QUOTE) {
          this.quoteLocation = { line: this.line, column: this.offset + i - this.lineStart + 1 };
          state = QUOTED;
          i++;
          segmentStart = i;
          continue;
        }
        state = UNQUOTED;
      }
      if (nextLineFeed < i) nextLineFeed = indexOrEnd(chunk, '\n', i);
      if (nextCarriageReturn < i) nextCarriageReturn = indexOrEnd(chunk, '\r', i);
      const nextLineBreak = nextLineFeed < nextCarriageReturn ? nextLineFeed : nextCarriageReturn;
      if (state === UNQUOTED) {
        if (nextDelimiter < i) nextDelimiter = indexOrEnd(chunk, delimiter, i);
        i = nextDelimiter < nextLineBreak ? nextDelimiter : nextLineBreak;
        if (i === n) break;
        const c = chunk.charCodeAt(i);
        const endsRecord = c !== delimiterCode;
        if (!captureAll && capturing && capture[fieldIndex] > LAST_SLICE_ROLE && this.pending === '') {
          this.lookUpLabel(chunk, segmentStart, i, capture[fieldIndex]);
        } else if (capturing || (fieldIndex === 0 && endsRecord)) {
          this.storeValue(fieldIndex, this.pending + chunk.slice(segmentStart, i));
        }
        i++;
        state = FIELD_START;
        if (!endsRecord) {
          fieldIndex++;
          continue;
        }
        this.endRecord(fieldIndex + 1);
        if (this.failure !== undefined) return;
        captureAll = this.captureAll;
        capture = this.capture;
        lastCaptured = this.lastCaptured;
        fieldIndex = 0;
        i = this.passLineBreak(chunk, i, c);
        continue;
      }
      if (state === QUOTED) {
        if (nextQuote < i) nextQuote = indexOrEnd(chunk, '"', i);
        if (nextLineBreak < nextQuote) {
          i = this.passLineBreak(chunk, nextLineBreak + 1, chunk.charCodeAt(nextLineBreak));
          continue;
        }
        if (nextQuote === n) break;
        i = nextQuote + 1;
        if (i === n) {
          if (tracked) this.pending += chunk.slice(segmentStart, i - 1);
          state = QUOTE_IN_QUOTED;
          break;
        }
        if (chunk.charCodeAt(i) === QUOTE) {
          if (tracked) this.pending += chunk.slice(segmentStart, i);
          i++;
        } else {
          if (tracked) this.pending += chunk.slice(segmentStart, i - 1);
          state = UNQUOTED;
        }
        segmentStart = i;
        continue;
      }
      // QUOTE_IN_QUOTED: the previous chunk ended on a quote inside a quoted field.
      if (chunk.charCodeAt(i) === QUOTE) {
        if (tracked) this.pending += '"';
        i++;
        state = QUOTED;
      } else {
        state = UNQUOTED;
      }
      segmentStart = i;
    }
    if (tracked && (state === UNQUOTED || state === QUOTED)) this.pending += chunk.slice(segmentStart, n);
    this.state = state;
    this.fieldIndex = fieldIndex;
    this.capturing = capturing;
    this.tracked = tracked;
    this.offset += n;
  }

  /** Counts the line break `c` just before `i` (CR LF as one, even split across chunks); returns where the next line starts. */
  private passLineBreak(chunk: string, i: number, c: number): number {
    this.line++;
    if (c === CR) {
      if (i === chunk.length) this.crPending = true;
      else if (chunk.charCodeAt(i) === LF) i++;
    }
    this.lineStart = this.offset + i;
    return i;
  }

  /** Ends the last record when the text stops without a line break. */
  private endText(): void {
    if (this.state === QUOTED) {
      this.setFailure('unreadable', 'A quoted value starting here is never closed. Add the closing quote ("), and write a quote inside a quoted value as two quotes ("").', this.quoteLocation);
      return;
    }
    if (this.state === FIELD_START) {
      if (this.fieldIndex === 0) return;
      const capturing = this.captureAll || (this.fieldIndex < this.capture.length && this.capture[this.fieldIndex] !== 0);
      if (capturing) {
        this.storeValue(this.fieldIndex, '');
        this.valueLines[this.fieldIndex] = this.line;
        this.valueColumns[this.fieldIndex] = this.offset - this.lineStart + 1;
      }
    } else if (this.tracked) {
      this.storeValue(this.fieldIndex, this.pending);
    }
    this.endRecord(this.fieldIndex + 1);
  }
}
