import { fail, ok, type CountTable, type Issue, type IssueCode, type Result, type SourceLocation } from '../types';
import { categoricalColumns, RAW_DATA_SAMPLE_ROWS } from './rawData';

export interface CrossTabulateOptions {
  /** Header names of the row variable and the column variable; default: the first two categorical columns. */
  columns?: [string, string];
  /** Header name of a column holding how many observations each row stands for; default: each row counts once. */
  weight?: string;
  /** One character separating fields; default: detected from the header line among `,` tab `;` `|`. */
  delimiter?: string;
  /** Document line of the text's first line, so locations point into the whole document (default 1). */
  firstLine?: number;
}

export type CrossTabulation = CountTable & {
  columnsUsed: [string, string];
  weightColumn?: string;
  /** Data rows read below the header, blank lines included. */
  rowsRead: number;
  /** Blank lines among `rowsRead`, passed over without counting. */
  rowsSkipped: number;
};

export interface CrossTabulator {
  /** Feeds the next piece of text; pieces may split the text anywhere. */
  push(chunk: string): void;
  /** Ends the text and returns the table, or the first problem found. */
  finish(): Result<CrossTabulation>;
}

/** More distinct values than this in a chosen column means identifiers or measurements, not categories (project decision). */
export const MAX_CATEGORIES = 1000;

/** The label under which rows with an empty category value are counted. */
export const BLANK_LABEL = '(blank)';

const CANDIDATE_DELIMITERS = [',', '\t', ';', '|'];
const QUOTE = 34;
const LF = 10;
const CR = 13;
const SPACE = 32;
const BYTE_ORDER_MARK = 0xfeff;

const FIELD_START = 0;
const UNQUOTED = 1;
const QUOTED = 2;
const QUOTE_IN_QUOTED = 3;

const WHOLE_NUMBER = /^\d+$/;
const DECIMAL_NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const COUNT_LIKE_NAME = /^(?:counts?|n|freq|frequency|weights?|number|tally|observations?)$/i;

const PLAIN_NUMBER_LABEL = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)$/;
const RANGE_LABEL = /^(\d+(?:\.\d+)?)\s*(?:-|\u2013|to)\s*\d+(?:\.\d+)?$/;
const OPEN_ABOVE_LABEL = /^(?:(?:>=?|\u2265)\s*(\d+(?:\.\d+)?)|(\d+(?:\.\d+)?)\s*\+)$/;
const OPEN_BELOW_LABEL = /^(?:<=?|\u2264)\s*(\d+(?:\.\d+)?)$/;
const LABEL_COLLATOR = new Intl.Collator('en', { numeric: true, sensitivity: 'variant' });

interface LabelSet {
  name: string;
  index: Map<string, number>;
  labels: string[];
  blankRows: number;
  firstBlank?: SourceLocation;
  cache: Map<number, CachedLabel>;
}

/** A field text already seen, mapped to its label's index, so repeated labels are found without slicing. */
interface CachedLabel {
  text: string;
  index: number;
}

/** Raw texts remembered per crossed column; beyond this, new spellings take the slower path (project decision). */
const MAX_CACHED_TEXTS = 4 * MAX_CATEGORIES;

/** Values of the capture mask: slice the field, or look it up as a row or column label. */
const SLICE_FIELD = 1;
const ROW_LABEL_FIELD = 2;
const COLUMN_LABEL_FIELD = 3;

function hashText(text: string, start: number, end: number): number {
  let hash = end - start;
  for (let k = start; k < end; k++) hash = (Math.imul(hash, 31) + text.charCodeAt(k)) | 0;
  return hash;
}

/** Whether `text` equals `chunk` from `start` to `end`; a plain loop, as `startsWith` at an offset is slow in V8. */
function sameText(text: string, chunk: string, start: number, end: number): boolean {
  if (text.length !== end - start) return false;
  for (let k = 0; k < text.length; k++) {
    if (text.charCodeAt(k) !== chunk.charCodeAt(start + k)) return false;
  }
  return true;
}

interface SampledRecord {
  fieldCount: number;
  line: number;
  values: string[];
  lines: number[];
  columns: number[];
}

function newLabelSet(name: string): LabelSet {
  return { name, index: new Map(), labels: [], blankRows: 0, cache: new Map() };
}

function describeColumn(header: readonly string[], index: number): string {
  return header[index] === '' ? `column ${index + 1} (no name)` : `'${header[index]}'`;
}

/** Sort key of a label that reads as a number or a numeric range, with a rank so `<5` < `5` < `5+`. */
function numericLabelKey(label: string): [number, number] | undefined {
  if (PLAIN_NUMBER_LABEL.test(label)) return [Number(label), 1];
  let match = RANGE_LABEL.exec(label);
  if (match) return [Number(match[1]), 1];
  match = OPEN_BELOW_LABEL.exec(label);
  if (match) return [Number(match[1]), 0];
  match = OPEN_ABOVE_LABEL.exec(label);
  if (match) return [Number(match[1] ?? match[2]), 2];
  return undefined;
}

/** Indices of `labels` in display order, and whether that order is numeric. `(blank)` always goes last. */
function orderLabels(labels: readonly string[]): { order: number[]; ordered: boolean } {
  const keys = labels.map(numericLabelKey);
  const present = labels.map((_, index) => index).filter((index) => labels[index] !== BLANK_LABEL);
  const ordered = present.length > 0 && present.every((index) => keys[index] !== undefined);
  const byText = (a: number, b: number): number =>
    LABEL_COLLATOR.compare(labels[a], labels[b]) || (labels[a] < labels[b] ? -1 : labels[a] > labels[b] ? 1 : 0);
  const byKey = (a: number, b: number): number => {
    const [keyA, rankA] = keys[a] as [number, number];
    const [keyB, rankB] = keys[b] as [number, number];
    return keyA - keyB || rankA - rankB || byText(a, b);
  };
  const order = present.sort(ordered ? byKey : byText);
  const blank = labels.indexOf(BLANK_LABEL);
  if (blank >= 0) order.push(blank);
  return { order, ordered };
}

/** Position of the next `search` at or after `from`, or the end of `text`. */
function indexOrEnd(text: string, search: string, from: number): number {
  const at = text.indexOf(search, from);
  return at < 0 ? text.length : at;
}

function detectDelimiter(headerLine: string): string {
  let best = CANDIDATE_DELIMITERS[0];
  let bestCount = 0;
  for (const candidate of CANDIDATE_DELIMITERS) {
    const code = candidate.charCodeAt(0);
    let count = 0;
    let inQuotes = false;
    for (let i = 0; i < headerLine.length; i++) {
      const c = headerLine.charCodeAt(i);
      if (c === QUOTE) inQuotes = !inQuotes;
      else if (c === code && !inQuotes) count++;
    }
    if (count > bestCount) {
      best = candidate;
      bestCount = count;
    }
  }
  return best;
}

class StreamingCrossTabulator implements CrossTabulator {
  private readonly options: CrossTabulateOptions;
  private readonly firstLine: number;
  private failure: Issue | undefined;
  private result: Result<CrossTabulation> | undefined;
  private started = false;

  /** Before the delimiter is known: the text so far, and a quote-aware search for the first non-blank line. */
  private headerChunks: string[] = [];
  private headerSearch = { inQuotes: false, lineStart: 0, lineHasContent: false, scanned: 0 };

  private delimiterCode = -1;
  private state = FIELD_START;
  private fieldIndex = 0;
  private capturing = false;
  private tracked = false;
  private pending = '';
  private crPending = false;
  private offset = 0;
  private line: number;
  private lineStart = 0;
  private recordLine: number;
  private quoteLocation: SourceLocation = { line: 1, column: 1 };
  private values: string[] = [];
  private valueLines: number[] = [];
  private valueColumns: number[] = [];

  private captureAll = true;
  private capture = new Uint8Array(0);
  /** Fields after this one are only counted, not read; until the columns are settled, every field is read. */
  private lastCaptured = Number.MAX_SAFE_INTEGER;
  private header: string[] | undefined;
  private headerLine = 1;
  private sample: SampledRecord[] = [];
  private decided = false;
  private rowIndex = -1;
  private columnIndex = -1;
  private weightIndex = -1;
  private rowHit = -1;
  private columnHit = -1;
  private rowSet = newLabelSet('');
  private columnSet = newLabelSet('');
  private counts: number[][] = [];
  private rowsRead = 0;
  private rowsSkipped = 0;
  private lastContentLine: number;
  private warnings: Issue[] = [];

  constructor(options: CrossTabulateOptions) {
    this.options = options;
    const firstLine = options.firstLine ?? 1;
    this.firstLine = Number.isInteger(firstLine) && firstLine >= 1 ? firstLine : 1;
    this.line = this.firstLine;
    this.recordLine = this.firstLine;
    this.lastContentLine = this.firstLine;
    this.checkOptions(firstLine);
  }

  private checkOptions(firstLine: number): void {
    const { delimiter, columns, weight } = this.options;
    const where = { line: this.firstLine, column: 1 };
    if (!Number.isInteger(firstLine) || firstLine < 1) {
      this.setFailure('bad-option', `The first line must be a whole number of 1 or more, not ${firstLine}.`, where);
    } else if (delimiter !== undefined) {
      if (delimiter.length !== 1 || delimiter === '"' || delimiter === '\n' || delimiter === '\r') {
        this.setFailure('bad-option', `The delimiter must be one character other than a quote or a line break, not ${JSON.stringify(delimiter)}. Use ",", ";", "|" or a tab.`, where);
      } else {
        this.delimiterCode = delimiter.charCodeAt(0);
      }
    }
    if (columns !== undefined && columns[0].trim() === columns[1].trim()) {
      this.setFailure('bad-option', `Choose two different columns to cross; both are '${columns[0]}'.`, where);
    } else if (columns !== undefined && weight !== undefined && columns.some((name) => name.trim() === weight.trim())) {
      this.setFailure('bad-option', `The weight column '${weight}' cannot also be one of the crossed columns. Choose another weight or other columns.`, where);
    }
  }

  private setFailure(code: IssueCode, message: string, location: SourceLocation): void {
    if (this.failure === undefined) this.failure = { code, message, location };
  }

  push(chunk: string): void {
    if (this.result !== undefined) throw new Error('CrossTabulator.push() called after finish()');
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
   * The CSV state machine: walks `chunk` once, slicing only the fields that are counted. It jumps between
   * delimiters, line breaks and quotes with `indexOf` (much faster than testing every character), caching the
   * next position of each, which stays valid until the walk passes it.
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
        if (!captureAll && capturing && capture[fieldIndex] !== SLICE_FIELD && this.pending === '') {
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

  private storeValue(fieldIndex: number, value: string): void {
    this.values[fieldIndex] = value;
    if (fieldIndex === this.rowIndex) this.rowHit = -1;
    else if (fieldIndex === this.columnIndex) this.columnHit = -1;
  }

  /** Finds the label of an unquoted field lying whole in `chunk` without slicing it, or else slices it. */
  private lookUpLabel(chunk: string, start: number, end: number, role: number): void {
    const set = role === ROW_LABEL_FIELD ? this.rowSet : this.columnSet;
    const cached = set.cache.get(hashText(chunk, start, end));
    const hit = cached !== undefined && sameText(cached.text, chunk, start, end) ? cached.index : -1;
    if (role === ROW_LABEL_FIELD) this.rowHit = hit;
    else this.columnHit = hit;
    if (hit < 0) this.values[role === ROW_LABEL_FIELD ? this.rowIndex : this.columnIndex] = chunk.slice(start, end);
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

  private endRecord(fieldCount: number): void {
    if (fieldCount === 1 && this.values[0].trim() === '') {
      if (this.header !== undefined) {
        this.rowsRead++;
        this.rowsSkipped++;
      }
      return;
    }
    this.lastContentLine = this.line;
    if (this.header === undefined) {
      this.acceptHeader(fieldCount);
    } else if (!this.decided) {
      this.sample.push({
        fieldCount,
        line: this.recordLine,
        values: this.values.slice(0, fieldCount),
        lines: this.valueLines.slice(0, fieldCount),
        columns: this.valueColumns.slice(0, fieldCount),
      });
      if (this.sample.length >= RAW_DATA_SAMPLE_ROWS) this.decide();
    } else {
      this.tally(fieldCount, this.recordLine, this.values, this.valueLines, this.valueColumns, this.rowHit, this.columnHit);
    }
  }

  private acceptHeader(fieldCount: number): void {
    this.header = this.values.slice(0, fieldCount).map((name) => name.trim());
    this.headerLine = this.recordLine;
    if (fieldCount < 2) {
      const how = this.options.delimiter === undefined ? 'none of , tab ; | was found in it' : `the delimiter ${JSON.stringify(this.options.delimiter)} was not found in it`;
      this.setFailure('too-few-categories', `The header line has only one column (${how}). Raw data needs two or more columns separated by one delimiter, such as "instructor,level".`, { line: this.headerLine, column: 1 });
      return;
    }
    if (this.options.columns !== undefined) this.decide();
  }

  private findColumn(name: string, role: string): number {
    const header = this.header as string[];
    const wanted = name.trim();
    let index = header.indexOf(wanted);
    if (index < 0) {
      const folded = header.map((column) => column.toLowerCase());
      const matches = folded.filter((column) => column === wanted.toLowerCase()).length;
      if (matches === 1) index = folded.indexOf(wanted.toLowerCase());
    }
    if (index < 0) {
      const available = header.map((_, at) => describeColumn(header, at)).join(', ');
      this.setFailure('unknown-column', `There is no column named '${name}' for the ${role} in the header. Available columns: ${available}.`, { line: this.headerLine, column: 1 });
    }
    return index;
  }

  /** Settles which columns to cross, then counts the rows read so far. */
  private decide(): void {
    this.decided = true;
    if (this.failure !== undefined) return;
    const header = this.header as string[];
    const { columns, weight } = this.options;
    if (weight !== undefined) {
      this.weightIndex = this.findColumn(weight, 'weight');
      if (this.weightIndex < 0) return;
    }
    if (columns !== undefined) {
      this.rowIndex = this.findColumn(columns[0], 'rows');
      if (this.rowIndex < 0) return;
      this.columnIndex = this.findColumn(columns[1], 'columns');
      if (this.columnIndex < 0) return;
      if (this.rowIndex === this.columnIndex || this.rowIndex === this.weightIndex || this.columnIndex === this.weightIndex) {
        this.setFailure('bad-option', `The names given select the same column twice (${describeColumn(header, this.rowIndex)}). Choose two different columns to cross and a third as weight.`, { line: this.headerLine, column: 1 });
        return;
      }
    } else {
      const chosen = categoricalColumns(header, this.sample.map((record) => record.values)).filter((index) => index !== this.weightIndex);
      if (chosen.length < 2) {
        const found = chosen.length === 0 ? 'none' : `only ${describeColumn(header, chosen[0])}`;
        this.setFailure('too-few-categories', `Two columns of categories are needed to cross-tabulate, but in the first ${RAW_DATA_SAMPLE_ROWS} rows ${found} holds repeating text values. Name the two columns to cross (a numeric column can be chosen by name).`, { line: this.headerLine, column: 1 });
        return;
      }
      [this.rowIndex, this.columnIndex] = chosen;
    }
    this.rowSet = newLabelSet(header[this.rowIndex]);
    this.columnSet = newLabelSet(header[this.columnIndex]);
    this.capture = new Uint8Array(header.length);
    this.capture[this.rowIndex] = ROW_LABEL_FIELD;
    this.capture[this.columnIndex] = COLUMN_LABEL_FIELD;
    if (this.weightIndex >= 0) this.capture[this.weightIndex] = SLICE_FIELD;
    this.captureAll = false;
    this.lastCaptured = Math.max(this.rowIndex, this.columnIndex, this.weightIndex, 0);
    if (this.weightIndex < 0) this.warnAboutCountColumn(header);
    for (const record of this.sample) {
      this.tally(record.fieldCount, record.line, record.values, record.lines, record.columns, -1, -1);
      if (this.failure !== undefined) break;
    }
    this.sample = [];
  }

  private warnAboutCountColumn(header: readonly string[]): void {
    const countColumn = header.findIndex((name, index) => index !== this.rowIndex && index !== this.columnIndex && COUNT_LIKE_NAME.test(name));
    if (countColumn < 0) return;
    this.warnings.push({
      code: 'raw-data',
      message: `Each row was counted once, but the column ${describeColumn(header, countColumn)} looks like it holds counts. If each row stands for several observations, choose it as the weight column.`,
      location: { line: this.headerLine, column: 1 },
    });
  }

  /** Counts one data record; `rowHit`/`columnHit` are label indices already found, or -1 to read `values`. */
  private tally(fieldCount: number, line: number, values: string[], lines: number[], columns: number[], rowHit: number, columnHit: number): void {
    const header = this.header as string[];
    if (fieldCount !== header.length) {
      const fewer = fieldCount < header.length;
      this.setFailure('ragged-row', `Line ${line} has ${fieldCount} ${fieldCount === 1 ? 'field' : 'fields'} but the header has ${header.length}. ${fewer ? 'Add the missing values (leave them empty between delimiters if unknown)' : 'Put quotes around values that contain the delimiter'}, so every row has one value per column.`, { line, column: 1 });
      return;
    }
    this.rowsRead++;
    let weight = 1;
    if (this.weightIndex >= 0) {
      weight = this.parseWeight(values[this.weightIndex], { line: lines[this.weightIndex], column: columns[this.weightIndex] });
      if (weight < 0) return;
    }
    const row = rowHit >= 0 ? rowHit : this.intern(this.rowSet, values[this.rowIndex], lines[this.rowIndex], columns[this.rowIndex]);
    if (row < 0) return;
    const column = columnHit >= 0 ? columnHit : this.intern(this.columnSet, values[this.columnIndex], lines[this.columnIndex], columns[this.columnIndex]);
    if (column < 0) return;
    const counts = this.counts[row];
    while (counts.length <= column) counts.push(0);
    counts[column] += weight;
    if (counts[column] > Number.MAX_SAFE_INTEGER) {
      this.setFailure('table-too-large', `The weights for ${this.rowSet.labels[row]} × ${this.columnSet.labels[column]} add up to more than ${Number.MAX_SAFE_INTEGER}, beyond exact counting. Check the weight column.`, { line: lines[this.weightIndex], column: columns[this.weightIndex] });
    }
  }

  /** Returns the weight, or -1 after recording why it is unusable. */
  private parseWeight(raw: string, location: SourceLocation): number {
    const text = raw.trim();
    if (WHOLE_NUMBER.test(text)) {
      const value = Number(text);
      if (value <= Number.MAX_SAFE_INTEGER) return value;
    }
    const name = `the weight column ${describeColumn(this.header as string[], this.weightIndex)}`;
    const value = Number(text);
    if (text === '') {
      this.setFailure('empty-cell', `The value in ${name} is empty. Write how many observations the row stands for (0 or more).`, location);
    } else if (!DECIMAL_NUMBER.test(text)) {
      this.setFailure('text-in-count-cell', `The value "${text}" in ${name} is not a number. Write each row's count as a whole number such as 3, without units or separators.`, location);
    } else if (value < 0) {
      this.setFailure('negative-count', `The value ${text} in ${name} is negative; a count cannot be. Correct it or remove the row.`, location);
    } else if (!Number.isInteger(value)) {
      this.setFailure('non-integer-count', `The value ${text} in ${name} is not a whole number; a chi-square test needs counts of observations, not averages or rates. Correct it or choose another weight column.`, location);
    } else if (value > Number.MAX_SAFE_INTEGER) {
      this.setFailure('table-too-large', `The value ${text} in ${name} is beyond exact counting (above ${Number.MAX_SAFE_INTEGER}). Check the weight column.`, location);
    } else {
      return value;
    }
    return -1;
  }

  /** Returns the label's index, or -1 after recording that the column has too many categories. */
  private intern(set: LabelSet, raw: string, line: number, column: number): number {
    let label = raw.trim();
    if (label === '') {
      label = BLANK_LABEL;
      set.blankRows++;
      if (set.firstBlank === undefined) set.firstBlank = { line, column };
    }
    let index = set.index.get(label);
    if (index === undefined) {
      if (set.labels.length >= MAX_CATEGORIES) {
        this.setFailure('table-too-large', `The column '${set.name}' has more than ${MAX_CATEGORIES} different values ("${label}" is number ${MAX_CATEGORIES + 1}), so it holds identifiers or measurements rather than categories. Cross another column, or group the values into fewer categories first.`, { line, column });
        return -1;
      }
      index = set.labels.length;
      set.labels.push(label);
      set.index.set(label, index);
      if (set === this.rowSet) this.counts.push([]);
    }
    if (label !== BLANK_LABEL && set.cache.size < MAX_CACHED_TEXTS) {
      const hash = hashText(raw, 0, raw.length);
      if (!set.cache.has(hash)) set.cache.set(hash, { text: raw, index });
    }
    return index;
  }

  finish(): Result<CrossTabulation> {
    if (this.result === undefined) this.result = this.finishOnce();
    return this.result;
  }

  private finishOnce(): Result<CrossTabulation> {
    if (this.failure === undefined && this.delimiterCode < 0) this.startWithDelimiter(this.headerSearch.scanned);
    if (this.failure === undefined) this.endText();
    if (this.failure === undefined && !this.decided && this.sample.length > 0) this.decide();
    if (this.failure !== undefined) return fail(this.failure);
    if (this.header === undefined) {
      return fail({ code: 'no-table', message: 'The text is empty. Raw data needs a header line naming the columns and one line per observation.', location: { line: this.firstLine, column: 1 } });
    }
    if (this.rowsRead === this.rowsSkipped) {
      return fail({ code: 'no-table', message: 'There are no data rows below the header line. Add one line per observation.', location: { line: this.headerLine, column: 1 } });
    }
    return ok(this.buildTable());
  }

  private buildTable(): CrossTabulation {
    const header = this.header as string[];
    const rows = orderLabels(this.rowSet.labels);
    const columns = orderLabels(this.columnSet.labels);
    const observed = rows.order.map((row) => columns.order.map((column) => this.counts[row][column] ?? 0));
    const warnings = [...this.warnings];
    for (const set of [this.rowSet, this.columnSet]) {
      if (set.blankRows === 0) continue;
      warnings.push({
        code: 'empty-cell',
        message: `${set.blankRows} ${set.blankRows === 1 ? 'row has' : 'rows have'} no value in '${set.name}'; ${set.blankRows === 1 ? 'it is' : 'they are'} counted under "${BLANK_LABEL}". Fill in the values, or remove those rows if they should not count.`,
        location: set.firstBlank,
      });
    }
    const table: CrossTabulation = {
      format: 'crosstab',
      rowLabels: rows.order.map((index) => this.rowSet.labels[index]),
      columnLabels: columns.order.map((index) => this.columnSet.labels[index]),
      observed,
      startLine: this.headerLine,
      endLine: this.lastContentLine,
      rowsOrdered: rows.ordered,
      columnsOrdered: columns.ordered,
      generatedRowLabels: false,
      generatedColumnLabels: false,
      warnings,
      columnsUsed: [header[this.rowIndex], header[this.columnIndex]],
      rowsRead: this.rowsRead,
      rowsSkipped: this.rowsSkipped,
    };
    if (this.weightIndex >= 0) table.weightColumn = header[this.weightIndex];
    return table;
  }
}

/**
 * Starts a streaming cross-tabulation of raw data: delimited text with a header line and one line per
 * observation, counted into a table of the two chosen categorical columns (optionally weighted).
 *
 * Intuition: a log of observations becomes a count table by tallying how often each pair of categories occurs.
 *
 * ## Method
 * Reference: Y. Shafranovich, RFC 4180, "Common Format and MIME Type for Comma-Separated Values (CSV) Files", 2005
 * (quoting rules); the leniencies below are our own.
 *
 * A hand-written CSV state machine walks each chunk once, reading single
 * characters with `charCodeAt` and jumping to the next delimiter, line break or quote with `indexOf`. Apart from
 * the header and the first 50 rows (kept only when the columns must be chosen), it slices just the weight field
 * and those crossed fields it cannot recognise in place (an unquoted label seen before is found by a hash of its
 * characters); no row arrays are built, so memory follows the number of categories, not the length of the text.
 * Quoted fields may hold delimiters, doubled quotes and line breaks; a
 * quote inside an unquoted field, or text after a closing quote, is kept as written. Line breaks are LF, CRLF
 * or CR; a leading byte order mark is dropped. Chunks may split the text anywhere, including inside a quoted
 * field or between CR and LF. Without `delimiter`, the one of `,` tab `;` `|` that occurs most often outside
 * quotes in the first non-blank line is used (ties go to the earlier in that list).
 *
 * Without `columns`, the first two categorical columns of the first 50 data rows are crossed (see
 * `categoricalColumns`); any column, numeric too, can be chosen by name (exact, else a unique case-insensitive match).
 * Labels are trimmed. Rows with an empty value are counted under `(blank)` and a warning gives how many.
 * Lines that are empty (a single blank field) are skipped and counted in `rowsSkipped`. Each row counts once unless
 * `weight` names a column of whole counts; a column named like counts (`count`, `n`, `weight`...) left unused
 * draws a `raw-data` warning. `startLine` is the header's line, `endLine` the last line with data.
 *
 * Category order: when every label of a variable reads as a number or a numeric range (`3`, `0-4`, `<5`, `65+`),
 * labels are sorted numerically and `rowsOrdered`/`columnsOrdered` is true; otherwise they are sorted alphabetically
 * (English collation, digits compared as numbers), so the table never depends on the order of the rows.
 * `(blank)` always comes last.
 *
 * Problems are returned by `finish()` as an `Issue` with a 1-based line and column: an unknown column name
 * (listing the available ones), fewer than two columns, a row with a different number of fields from the header,
 * a weight that is empty, not a number, negative or not whole, more than 1,000 distinct values in a crossed
 * column (`table-too-large`), an unclosed quote, or no data rows.
 *
 * @param options - Columns to cross, weight column, delimiter and the document line of the text's first line.
 * @returns A tabulator; call `push` with each chunk, then `finish`.
 * @example
 * const tabulator = createCrossTabulator({ columns: ['level', 'completed'] });
 * tabulator.push('instructor,level,completed\nIna,novice,yes\nOle,');
 * tabulator.push('novice,no\n');
 * tabulator.finish(); // ok: rowLabels ['novice'], columnLabels ['no', 'yes'], observed [[1, 1]]
 */
export function createCrossTabulator(options: CrossTabulateOptions = {}): CrossTabulator {
  return new StreamingCrossTabulator(options);
}

/**
 * Cross-tabulates raw data held in one string; see `createCrossTabulator` for the rules.
 *
 * @param text - The whole delimited text.
 * @param options - As for `createCrossTabulator`.
 * @returns The count table of the two crossed columns, or the first problem found.
 * @example crossTabulateText('shift,fault\nearly,brakes\nlate,brakes\n').ok // true
 */
export function crossTabulateText(text: string, options: CrossTabulateOptions = {}): Result<CrossTabulation> {
  const tabulator = createCrossTabulator(options);
  tabulator.push(text);
  return tabulator.finish();
}
