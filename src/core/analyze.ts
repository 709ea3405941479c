import type { Analysis, AnalyzeOptions, TableOrigin } from './analysis';
import { analyzePaired, analyzeStrata, sumStrata } from './designs/analyzeDesigns';
import { followUps as computeFollowUps, type FollowUps } from './designs/followUps';
import { choosePValue, type SearchControl } from './exact/choosePValue';
import { resolveOptions } from './options';
import { contributionsTable, expectedCountsTable } from './report/markdownTables';
import { writeUp } from './report/writeUp';
import { buildFitRequest } from './stats/buildFitRequest';
import { parseFitSpec } from './stats/parseFitSpec';
import type { FitRequest } from './stats/fitRequest';
import { proposeMerge } from './stats/proposeMerge';
import { testGoodnessOfFit } from './stats/testGoodnessOfFit';
import { testIndependence } from './stats/testIndependence';
import type { TestResult } from './stats/types';
import { crossTabulateText, type CrossTabulation } from './table/crossTabulate';
import { locateTable } from './table/locateTable';
import { describeLocation } from './table/describeLocation';
import { readCountTable } from './table/readCountTable';
import { locateStrata } from './table/locateStrata';
import { strataFromCrossTabulation } from './table/strataFromCrossTabulation';
import type { LabelledStratum, StrataTables } from './table/strataTables';
import { fail, ok, type CountTable, type Issue, type Result } from './types';

export type DocumentFormat = 'markdown' | 'delimited' | 'text';

/** One analysis request: the document text, where the table is, and what to test. */
export interface AnalyzeRequest {
  text: string;
  format: DocumentFormat;
  /** 1-based line inside the table (the editor's cursor). */
  line?: number;
  /** 1-based inclusive line range of a selection. */
  selection?: { startLine: number; endLine: number };
  /** 1-based index of the table in the document. */
  tableIndex?: number;
  /** Goodness-of-fit hypothesis: "9:3:3:1", "0.5,0.3,0.2", "equal", "poisson", "binomial", "binomial:10". */
  fit?: string;
  /** Raw observations: the two columns to cross-tabulate, and an optional count/weight column. */
  columns?: [string, string];
  weight?: string;
  /** Raw observations: the column naming each observation's stratum (implies the stratified design). */
  stratum?: string;
  options?: Partial<AnalyzeOptions>;
  /** Cancellation and progress for exact and Monte Carlo searches. */
  control?: SearchControl;
}

/** Labels that mark a row or column of expected counts to test the other one against. */
const EXPECTED_LABEL = /^(expected|expected counts?|expect(ed)? n)$/i;

/**
 * The engine's one entry: find the table, read it, choose and run the test, write it up.
 * Never throws on bad input; every failure is an Issue naming the place and the remedy.
 */
export function analyze(request: AnalyzeRequest): Result<Analysis> {
  const options = resolveOptions(request.stratum !== undefined ? { ...request.options, design: 'stratified' } : request.options);
  if (!options.ok) return options;
  if (options.value.design === 'stratified') return analyzeStratifiedRequest(request, options.value);
  const table = readTable(request);
  if (!table.ok) return table;
  return analyzeCountTable(table.value.table, table.value.origin, request.fit, options.value, request.control);
}

function readTable(request: AnalyzeRequest): Result<{ table: CountTable; origin: TableOrigin }> {
  if (request.format === 'delimited' && (request.columns || request.weight)) {
    return crossTabulate(request, { index: 1, count: 1 });
  }
  const located = locateTable(request.text, {
    format: request.format,
    line: request.line,
    selection: request.selection,
    tableIndex: request.tableIndex,
  });
  if (!located.ok) return located;
  const origin: TableOrigin = { index: located.value.index, count: located.value.count };
  if (request.columns || request.weight) {
    return fail({
      code: 'bad-option',
      message: 'Choosing columns to cross-tabulate works on CSV or other delimited files, one row per observation; this table already holds counts.',
    });
  }
  const read = readCountTable(located.value.grid);
  if (!read.ok && read.issue.code === 'raw-data' && located.value.grid.format === 'delimited') {
    return crossTabulate(request, origin);
  }
  if (!read.ok) return read;
  return ok({ table: read.value, origin });
}

function crossTabulate(request: AnalyzeRequest, origin: TableOrigin): Result<{ table: CountTable; origin: TableOrigin }> {
  const tabulated = crossTabulateText(request.text, { columns: request.columns, weight: request.weight });
  if (!tabulated.ok) return tabulated;
  return ok(splitCrossTabulation(tabulated.value, origin));
}

/** Several 2×2 tables in a row in the document, or raw data with a stratum column, tested together. */
function analyzeStratifiedRequest(request: AnalyzeRequest, options: AnalyzeOptions): Result<Analysis> {
  if (request.fit !== undefined) {
    return fail({ code: 'bad-option', message: 'A stratified analysis compares two groups within each stratum; it cannot be combined with expected proportions. Drop one of the two.' });
  }
  if (request.format === 'delimited' && (request.stratum !== undefined || request.columns !== undefined)) {
    const tabulated = crossTabulateText(request.text, { columns: request.columns, weight: request.weight, stratum: request.stratum });
    if (!tabulated.ok) return tabulated;
    return analyzeTabulatedStrata(tabulated.value, options);
  }
  const located = locateStrata(request.text, { format: request.format, line: request.line, selection: request.selection, tableIndex: request.tableIndex });
  if (!located.ok) return located;
  return analyzeLocatedStrata(located.value, { index: located.value.firstIndex, count: located.value.count }, options);
}

/** A cross-tabulation made with a stratum column, as strata (the CLI's streaming path enters here too). */
export function analyzeTabulatedStrata(tabulation: CrossTabulation, options: AnalyzeOptions): Result<Analysis> {
  const strata = strataFromCrossTabulation(tabulation);
  if (!strata.ok) return strata;
  const { origin } = splitCrossTabulation(tabulation);
  return analyzeLocatedStrata(strata.value, origin, options);
}

function analyzeLocatedStrata(strata: StrataTables, origin: TableOrigin, options: AnalyzeOptions): Result<Analysis> {
  const analysis = analyzeStrataTables(strata.strata, origin, options);
  if (!analysis.ok) return analysis;
  return ok({ ...analysis.value, warnings: [...strata.notes, ...analysis.value.warnings] });
}

/** A finished cross-tabulation as the count table to test and where it came from (the CLI's streaming path uses it too). */
export function splitCrossTabulation(tabulation: CrossTabulation, origin: TableOrigin = { index: 1, count: 1 }): { table: CountTable; origin: TableOrigin } {
  const { columnsUsed, weightColumn, rowsRead, rowsSkipped, stratumColumn, strata: _strata, ...table } = tabulation;
  const crossTabulation = { columns: columnsUsed, weightColumn, rowsRead, rowsSkipped, ...(stratumColumn !== undefined ? { stratumColumn } : {}) };
  return { table, origin: { ...origin, crossTabulation } };
}

/** Which row or column, if any, holds expected counts (a 2×k or k×2 table with one labelled "Expected"). */
function findExpectedLine(table: CountTable): { dimension: 'row' | 'column'; index: number } | undefined {
  const label = (text: string) => EXPECTED_LABEL.test(text.trim());
  if (table.rowLabels.length === 2) {
    const index = table.rowLabels.findIndex(label);
    if (index >= 0) return { dimension: 'row', index };
  }
  if (table.columnLabels.length === 2) {
    const index = table.columnLabels.findIndex(label);
    if (index >= 0) return { dimension: 'column', index };
  }
  return undefined;
}

/** Reduce a table with an "Expected" row/column to its observed vector, labels and expected counts. */
function splitExpected(table: CountTable, where: { dimension: 'row' | 'column'; index: number }): { table: CountTable; expected: number[] } {
  const keep = 1 - where.index;
  if (where.dimension === 'row') {
    return {
      expected: table.observed[where.index],
      table: {
        ...table,
        rowLabels: [table.rowLabels[keep]],
        observed: [table.observed[keep]],
        cellLocations: table.cellLocations ? [table.cellLocations[keep]] : undefined,
      },
    };
  }
  return {
    expected: table.observed.map((row) => row[where.index]),
    table: {
      ...table,
      columnLabels: [table.columnLabels[keep]],
      observed: table.observed.map((row) => [row[keep]]),
      cellLocations: table.cellLocations?.map((row) => [row[keep]]),
    },
  };
}

/** Run the right test on a table that is already read (the CLI's streaming path enters here too). */
export function analyzeCountTable(
  inputTable: CountTable,
  origin: TableOrigin,
  fit: string | undefined,
  options: AnalyzeOptions,
  control: SearchControl = {},
): Result<Analysis> {
  let table = inputTable;
  let fitRequest: FitRequest | undefined;
  const expectedLine = findExpectedLine(table);
  if (expectedLine && fit === undefined) {
    const split = splitExpected(table, expectedLine);
    table = split.table;
    fitRequest = { kind: 'expected-counts', counts: split.expected };
  }
  const isVector = table.rowLabels.length === 1 || table.columnLabels.length === 1;
  const dropped = table.warnings.find((w) => w.code === 'zero-row-dropped' || w.code === 'zero-column-dropped');
  if (isVector && dropped && fit === undefined && !fitRequest) {
    // Dropping an all-zero row left one row: a goodness-of-fit test now would answer another question.
    const location = { line: table.startLine, column: 1 };
    return fail({
      code: 'too-few-categories',
      message: `${describeLocation(location)}: after leaving out the all-zero ${dropped.code === 'zero-row-dropped' ? 'row' : 'column'}, only one ${table.rowLabels.length === 1 ? 'row' : 'column'} of counts is left, and comparing groups needs at least two. Add the missing counts, or give expected proportions (--fit) to test the remaining counts against them.`,
      location,
    });
  }
  if (!fitRequest && (isVector || fit !== undefined)) {
    if (!isVector) {
      const location = { line: table.startLine, column: 1 };
      return fail({
        code: 'bad-option',
        message: `${describeLocation(location)}: a goodness-of-fit test needs a single row or a single column of counts; this table is ${table.rowLabels.length}×${table.columnLabels.length}. Select one row or column, or drop the expected proportions to test independence.`,
        location,
      });
    }
    const labels = table.rowLabels.length === 1 ? table.columnLabels : table.rowLabels;
    const spec = parseFitSpec(fit ?? 'equal', labels.length);
    if (!spec.ok) return spec;
    const built = buildFitRequest(spec.value, labels);
    if (!built.ok) return built;
    fitRequest = built.value;
  }
  // Designs that cannot apply to this one table are refused before any test runs.
  if (options.design === 'stratified') {
    const location = { line: table.startLine, column: 1 };
    return fail({
      code: 'bad-option',
      message: `${describeLocation(location)}: a stratified analysis needs several 2×2 tables one after another with the same labels, or a raw data file with a stratum column; this is one table.`,
      location,
    });
  }
  if (options.design === 'paired' && fitRequest) {
    return fail({ code: 'bad-option', message: 'A paired analysis compares two measurements of the same units; it cannot be combined with expected proportions. Drop one of the two.' });
  }
  const result = runTest(table, fitRequest, options);
  if (!result.ok) return result;
  if (options.design === 'paired') {
    const paired = analyzePaired(table, options);
    if (!paired.ok) return paired;
    return ok(finish({ kind: 'paired', table, origin, result: result.value, paired: paired.value.paired, warnings: paired.value.warnings, options }));
  }
  const choice = choosePValue(result.value, table.observed, options, control);
  if (choice.kind === 'failed') return fail(choice.issue);
  if (choice.kind === 'cancelled') {
    return fail({ code: 'cancelled', message: 'The exact or simulated test was cancelled; nothing was changed.' });
  }
  const exact = choice.kind === 'computed' ? choice.value : undefined;
  const exactNote = choice.kind === 'asymptotic' ? choice.reason : undefined;
  const warnings: Issue[] = [...table.warnings];
  if (!result.value.validity.ok) {
    const location = { line: table.startLine, column: 1 };
    const remedy = exact ? `${exact.reason}` : 'Merge sparse categories or use an exact test.';
    warnings.push({
      code: 'validity',
      message: `${describeLocation(location)}: Cochran's rule is not met: ${result.value.validity.cellsBelow5} of ${result.value.validity.cellCount} expected counts are below 5 (smallest ${result.value.validity.minExpected.toFixed(2)}). ${remedy}`,
      location,
    });
  }
  let followUps: FollowUps | undefined;
  if (result.value.test === 'independence') {
    const computed = computeFollowUps(table, result.value, options);
    if (!computed.ok) return computed;
    followUps = computed.value;
  }
  const kind = result.value.test === 'independence' ? 'independence' : 'goodness-of-fit';
  return ok(finish({ kind, table, origin, result: result.value, exact, exactNote, followUps, warnings, options }));
}

/** Several 2×2 strata tested together (CMH); the strata summed stand in as the table for context. */
export function analyzeStrataTables(strata: readonly LabelledStratum[], origin: TableOrigin, options: AnalyzeOptions): Result<Analysis> {
  const checked = analyzeStrata(strata, options);
  if (!checked.ok) return checked;
  const table = sumStrata(strata);
  const result = testIndependence(table.observed, { ...options, rowsOrdered: false, columnsOrdered: false });
  const warnings = [...table.warnings, ...checked.value.warnings];
  return ok(finish({ kind: 'stratified', table, origin, result, stratified: checked.value.stratified, warnings, options: { ...options, design: 'stratified' } }));
}

/** Adds the text that every analysis carries: the write-up and the ready-to-insert tables. */
function finish(analysis: Omit<Analysis, 'writeUp' | 'expectedTable' | 'contributionsTable'>): Analysis {
  return {
    ...analysis,
    writeUp: writeUp(analysis, analysis.options),
    expectedTable: expectedCountsTable(analysis.result, analysis.table, analysis.options),
    contributionsTable: contributionsTable(analysis.result, analysis.table, analysis.options),
  };
}

function runTest(table: CountTable, fitRequest: FitRequest | undefined, options: AnalyzeOptions): Result<TestResult> {
  const testOptions = { ...options, rowsOrdered: table.rowsOrdered, columnsOrdered: table.columnsOrdered };
  if (fitRequest) {
    const observed = table.observed.flat();
    const alongRow = table.rowLabels.length === 1;
    return testGoodnessOfFit(observed, fitRequest, {
      ...testOptions,
      labels: alongRow ? table.columnLabels : table.rowLabels,
      ordered: alongRow ? table.columnsOrdered : table.rowsOrdered,
      categoriesAlong: alongRow ? 'columns' : 'rows',
    });
  }
  const result = testIndependence(table.observed, testOptions);
  if (!result.validity.ok) {
    const merge = proposeMerge(table.observed, { rows: table.rowLabels, columns: table.columnLabels }, testOptions);
    if (merge) return ok({ ...result, mergeProposal: merge });
  }
  return ok(result);
}
