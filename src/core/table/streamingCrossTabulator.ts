import { fail, ok, type Issue, type Result, type SourceLocation } from '../types';
import { checkColumnOptions, chooseCrossedColumns, countColumnWarning, describeColumn } from './chooseCrossedColumns';
import type { CrossTabulateOptions, CrossTabulation, CrossTabulator, StratumCounts } from './crossTabulationTypes';
import { DelimitedScanner, SLICE_FIELD } from './delimitedScanner';
import { BLANK_LABEL, findCachedLabel, internLabel, MAX_CATEGORIES, newLabelSet, type LabelSet } from './labelSet';
import { orderLabels } from './orderLabels';
import { parseWeight } from './parseWeight';
import { RAW_DATA_SAMPLE_ROWS } from './rawData';

/** Capture-mask roles of the label fields (above `SLICE_FIELD`, so the scanner offers them to `lookUpLabel`). */
const ROW_LABEL_FIELD = 2;
const COLUMN_LABEL_FIELD = 3;
const STRATUM_LABEL_FIELD = 4;

interface SampledRecord {
  fieldCount: number;
  line: number;
  values: string[];
  lines: number[];
  columns: number[];
}

/**
 * Counts the records of a `DelimitedScanner` into a table of two categorical columns, optionally weighted and
 * split into strata. The first 50 records are kept until the columns are settled (they are needed to choose
 * columns by content); after that only the counts and the label sets are kept. See `createCrossTabulator`.
 */
export class StreamingCrossTabulator extends DelimitedScanner implements CrossTabulator {
  private readonly options: CrossTabulateOptions;
  private result: Result<CrossTabulation> | undefined;
  private header: string[] | undefined;
  private headerLine = 1;
  private sample: SampledRecord[] = [];
  private decided = false;
  private rowIndex = -1;
  private columnIndex = -1;
  private weightIndex = -1;
  private stratumIndex = -1;
  /** The weight column in words, for messages (built once, not per row). */
  private weightName = '';
  private rowHit = -1;
  private columnHit = -1;
  private stratumHit = -1;
  private rowSet = newLabelSet('');
  private columnSet = newLabelSet('');
  private stratumSet = newLabelSet('');
  /** counts[row][column], rows growing as labels appear. */
  private counts: number[][] = [];
  /** strataCounts[stratum][row][column], filled only with the `stratum` option. */
  private strataCounts: number[][][] = [];
  private rowsRead = 0;
  private rowsSkipped = 0;
  private lastContentLine: number;
  private warnings: Issue[] = [];

  constructor(options: CrossTabulateOptions) {
    const firstLine = options.firstLine ?? 1;
    const validFirstLine = Number.isInteger(firstLine) && firstLine >= 1;
    super(validFirstLine ? firstLine : 1);
    this.options = options;
    this.lastContentLine = this.firstLine;
    const where = { line: this.firstLine, column: 1 };
    const { delimiter } = options;
    if (!validFirstLine) {
      this.setFailure('bad-option', `The first line must be a whole number of 1 or more, not ${firstLine}.`, where);
    } else if (delimiter !== undefined) {
      if (delimiter.length !== 1 || delimiter === '"' || delimiter === '\n' || delimiter === '\r') {
        this.setFailure('bad-option', `The delimiter must be one character other than a quote or a line break, not ${JSON.stringify(delimiter)}. Use ",", ";", "|" or a tab.`, where);
      } else {
        this.delimiterCode = delimiter.charCodeAt(0);
      }
    }
    const problem = checkColumnOptions(options);
    if (problem !== undefined) this.setFailure('bad-option', problem, where);
  }

  push(chunk: string): void {
    if (this.result !== undefined) throw new Error('CrossTabulator.push() called after finish()');
    this.scanChunk(chunk);
  }

  finish(): Result<CrossTabulation> {
    if (this.result === undefined) this.result = this.finishOnce();
    return this.result;
  }

  protected storeValue(fieldIndex: number, value: string): void {
    this.values[fieldIndex] = value;
    if (fieldIndex === this.rowIndex) this.rowHit = -1;
    else if (fieldIndex === this.columnIndex) this.columnHit = -1;
    else if (fieldIndex === this.stratumIndex) this.stratumHit = -1;
  }

  /** Finds the label of an unquoted field lying whole in `chunk` without slicing it, or else slices it. */
  protected lookUpLabel(chunk: string, start: number, end: number, role: number): void {
    if (role === ROW_LABEL_FIELD) {
      this.rowHit = findCachedLabel(this.rowSet, chunk, start, end);
      if (this.rowHit < 0) this.values[this.rowIndex] = chunk.slice(start, end);
    } else if (role === COLUMN_LABEL_FIELD) {
      this.columnHit = findCachedLabel(this.columnSet, chunk, start, end);
      if (this.columnHit < 0) this.values[this.columnIndex] = chunk.slice(start, end);
    } else {
      this.stratumHit = findCachedLabel(this.stratumSet, chunk, start, end);
      if (this.stratumHit < 0) this.values[this.stratumIndex] = chunk.slice(start, end);
    }
  }

  protected endRecord(fieldCount: number): void {
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
      this.tally(fieldCount, this.recordLine, this.values, this.valueLines, this.valueColumns, this.rowHit, this.columnHit, this.stratumHit);
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

  /** Settles which columns to cross, then counts the rows read so far. */
  private decide(): void {
    this.decided = true;
    if (this.failure !== undefined) return;
    const header = this.header as string[];
    const chosen = chooseCrossedColumns(header, this.sample.map((record) => record.values), this.options, this.headerLine);
    if (!chosen.ok) {
      this.failure = chosen.issue;
      return;
    }
    ({ rowIndex: this.rowIndex, columnIndex: this.columnIndex, weightIndex: this.weightIndex, stratumIndex: this.stratumIndex } = chosen.value);
    this.rowSet = newLabelSet(header[this.rowIndex]);
    this.columnSet = newLabelSet(header[this.columnIndex]);
    this.capture = new Uint8Array(header.length);
    this.capture[this.rowIndex] = ROW_LABEL_FIELD;
    this.capture[this.columnIndex] = COLUMN_LABEL_FIELD;
    if (this.weightIndex >= 0) {
      this.capture[this.weightIndex] = SLICE_FIELD;
      this.weightName = `the weight column ${describeColumn(header, this.weightIndex)}`;
    }
    if (this.stratumIndex >= 0) {
      this.stratumSet = newLabelSet(header[this.stratumIndex]);
      this.capture[this.stratumIndex] = STRATUM_LABEL_FIELD;
    }
    this.captureAll = false;
    this.lastCaptured = Math.max(this.rowIndex, this.columnIndex, this.weightIndex, this.stratumIndex, 0);
    const warning = countColumnWarning(header, chosen.value, this.headerLine);
    if (warning) this.warnings.push(warning);
    for (const record of this.sample) {
      this.tally(record.fieldCount, record.line, record.values, record.lines, record.columns, -1, -1, -1);
      if (this.failure !== undefined) break;
    }
    this.sample = [];
  }

  /** Counts one data record; the hits are label indices already found, or -1 to read `values`. */
  private tally(fieldCount: number, line: number, values: string[], lines: number[], columns: number[], rowHit: number, columnHit: number, stratumHit: number): void {
    const header = this.header as string[];
    if (fieldCount !== header.length) {
      const fewer = fieldCount < header.length;
      this.setFailure('ragged-row', `Line ${line} has ${fieldCount} ${fieldCount === 1 ? 'field' : 'fields'} but the header has ${header.length}. ${fewer ? 'Add the missing values (leave them empty between delimiters if unknown)' : 'Put quotes around values that contain the delimiter'}, so every row has one value per column.`, { line, column: 1 });
      return;
    }
    this.rowsRead++;
    let stratum = -1;
    if (this.stratumIndex >= 0) {
      stratum = stratumHit >= 0 ? stratumHit : this.internStratum(values[this.stratumIndex], lines[this.stratumIndex], columns[this.stratumIndex]);
      if (stratum < 0) return;
    }
    let weight = 1;
    if (this.weightIndex >= 0) {
      const parsed = parseWeight(values[this.weightIndex], { line: lines[this.weightIndex], column: columns[this.weightIndex] }, this.weightName);
      if (typeof parsed !== 'number') {
        this.setFailure(parsed.code, parsed.message, parsed.location as SourceLocation);
        return;
      }
      weight = parsed;
    }
    const row = rowHit >= 0 ? rowHit : this.intern(this.rowSet, values[this.rowIndex], lines[this.rowIndex], columns[this.rowIndex]);
    if (row < 0) return;
    const column = columnHit >= 0 ? columnHit : this.intern(this.columnSet, values[this.columnIndex], lines[this.columnIndex], columns[this.columnIndex]);
    if (column < 0) return;
    while (this.counts.length <= row) this.counts.push([]);
    const counts = this.counts[row];
    while (counts.length <= column) counts.push(0);
    counts[column] += weight;
    if (counts[column] > Number.MAX_SAFE_INTEGER) {
      this.setFailure('table-too-large', `The weights for ${this.rowSet.labels[row]} × ${this.columnSet.labels[column]} add up to more than ${Number.MAX_SAFE_INTEGER}, beyond exact counting. Check the weight column.`, { line: lines[this.weightIndex], column: columns[this.weightIndex] });
    }
    if (stratum >= 0) {
      // A stratum's cell never exceeds the whole table's cell, so the check above covers it.
      const layer = this.strataCounts[stratum];
      while (layer.length <= row) layer.push([]);
      const stratumRow = layer[row];
      while (stratumRow.length <= column) stratumRow.push(0);
      stratumRow[column] += weight;
    }
  }

  /** Returns the label's index, or -1 after recording that the column has too many categories. */
  private intern(set: LabelSet, raw: string, line: number, column: number): number {
    const index = internLabel(set, raw, line, column);
    if (index < 0) {
      const label = raw.trim() === '' ? BLANK_LABEL : raw.trim();
      this.setFailure('table-too-large', `The column '${set.name}' has more than ${MAX_CATEGORIES} different values ("${label}" is number ${MAX_CATEGORIES + 1}), so it holds identifiers or measurements rather than categories. Cross another column, or group the values into fewer categories first.`, { line, column });
    }
    return index;
  }

  /** Returns the stratum's index, or -1 for a row to skip (empty stratum value) or after recording too many strata. */
  private internStratum(raw: string, line: number, column: number): number {
    const set = this.stratumSet;
    if (raw.trim() === '') {
      set.blankRows++;
      if (set.firstBlank === undefined) set.firstBlank = { line, column };
      this.rowsSkipped++;
      return -1;
    }
    const index = this.intern(set, raw, line, column);
    if (index >= 0 && index === this.strataCounts.length) this.strataCounts.push([]);
    return index;
  }

  private finishOnce(): Result<CrossTabulation> {
    this.endInput();
    if (this.failure === undefined && !this.decided && this.sample.length > 0) this.decide();
    if (this.failure !== undefined) return fail(this.failure);
    if (this.header === undefined) {
      return fail({ code: 'no-table', message: 'The text is empty. Raw data needs a header line naming the columns and one line per observation.', location: { line: this.firstLine, column: 1 } });
    }
    if (this.rowsRead === this.rowsSkipped) {
      if (this.stratumSet.blankRows > 0) {
        return fail({ code: 'empty-cell', message: `Every data row has an empty value in the stratum column '${this.stratumSet.name}', so no row can be counted. Fill in each row's stratum (such as its site or shift), or analyse without strata.`, location: this.stratumSet.firstBlank });
      }
      return fail({ code: 'no-table', message: 'There are no data rows below the header line. Add one line per observation.', location: { line: this.headerLine, column: 1 } });
    }
    return ok(this.buildTable());
  }

  private buildTable(): CrossTabulation {
    const header = this.header as string[];
    const rows = orderLabels(this.rowSet.labels);
    const columns = orderLabels(this.columnSet.labels);
    const arrange = (counts: number[][]): number[][] => rows.order.map((row) => columns.order.map((column) => counts[row]?.[column] ?? 0));
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
      observed: arrange(this.counts),
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
    if (this.stratumIndex >= 0) {
      const set = this.stratumSet;
      table.stratumColumn = header[this.stratumIndex];
      table.strata = set.labels.map((label, index): StratumCounts => ({ label, observed: arrange(this.strataCounts[index]) }));
      if (set.blankRows > 0) {
        warnings.push({
          code: 'empty-cell',
          message: `${set.blankRows} ${set.blankRows === 1 ? 'row has' : 'rows have'} no value in the stratum column '${set.name}'; ${set.blankRows === 1 ? 'it was' : 'they were'} left out of every table. Fill in each row's stratum if ${set.blankRows === 1 ? 'it' : 'they'} should count.`,
          location: set.firstBlank,
        });
      }
    }
    return table;
  }
}
