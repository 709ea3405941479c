import { fail, ok, type CountTable, type Issue, type RawGrid, type Result, type SourceLocation } from '../types';
import { describeLocation } from './describeLocation';
import { findMarkdownTables } from './findMarkdownTables';
import { locateTable, readTextBlock, type TableRequest } from './locateTable';
import { readCountTable } from './readCountTable';
import { splitLines } from './splitLines';
import { alignLabels, applyAlignment, isTwoByTwo, type Alignment, type LabelledStratum, type StrataTables } from './strataTables';
import { stripInlineMarkup } from './stripInlineMarkup';
import { joinsStrata, labelAbove } from './textBetweenTables';

const HOW_TO_LAY_OUT = 'Put the strata as 2×2 tables one after another with the same row and column labels, ' +
  'with at most a heading or a short line of text between them (or select exactly the tables to use).';

/** A table of the document, read as counts once it is needed. */
interface Candidate {
  grid: RawGrid;
  read?: Result<CountTable>;
}

function readCandidate(candidate: Candidate): Result<CountTable> {
  // All-zero rows stay: a stratum where one group is empty carries no information but keeps the 2×2 layout.
  candidate.read ??= readCountTable(candidate.grid, { keepZeroLines: true });
  return candidate.read;
}

function where(grid: RawGrid): SourceLocation {
  const first = grid.rows[0]?.[0];
  return first ? { line: first.line, column: first.column } : { line: grid.startLine, column: 1 };
}

function strataIssue<T>(location: SourceLocation, problem: string): Result<T> {
  return fail({ code: 'strata', message: `${describeLocation(location)}: ${problem}`, location });
}

function shape(table: CountTable): string {
  return `${table.rowLabels.length}×${table.columnLabels.length}`;
}

function lines(grid: RawGrid): string {
  return grid.startLine === grid.endLine ? `line ${grid.startLine}` : `lines ${grid.startLine}-${grid.endLine}`;
}

/**
 * Gathers the strata of a stratified 2×2×K design (the same 2×2 comparison in several strata, such as
 * sites or shifts) from a note that holds them as 2×2 tables one after another.
 *
 * Intuition: a person writes one small table per stratum under its own heading; the run of such tables
 * around the cursor is the design.
 *
 * ## Method
 * The tables are the Markdown pipe tables of the document (see `findMarkdownTables`); for `'text'` without a
 * Markdown table at the cursor, the blocks of non-blank lines read as aligned or delimited tables, a block's
 * first line being taken as its name when the rest alone reads as a table. The starting table is the one
 * `locateTable` would choose (the table numbered `tableIndex`, the one at the cursor or selection, or the first).
 * From it the run extends in both directions over tables that
 * - stand close: only blank lines, headings and at most one short paragraph between them (`joinsStrata`);
 * - read as counts (`readCountTable`, totals left out, all-zero rows kept) and are 2×2;
 * - have the starting table's row and column labels, compared trimmed and case-insensitively. A table with
 *   the same labels in another order, or with rows and columns swapped, is rearranged to the first stratum's
 *   order, with a note.
 * The first table that does not fit ends the run, with a note saying why. A selection that overlaps several
 * tables takes exactly those, each of which must fit.
 *
 * Each stratum is named by the nearest heading or short line of text above its table (`labelAbove`), else by
 * the table's top-left cell, else "Stratum k"; names that repeat get their position added, as
 * "Route (2)", and repeated top-left cells (usually a variable's name, not a stratum's) give way to "Stratum k".
 *
 * Problems, each naming a line: no table, a starting table that cannot be read or is not 2×2, a selected table
 * that does not fit, and a run of only one table.
 *
 * @param text - the whole document
 * @param request - the document's kind and what the person pointed at, as for `locateTable`
 * @returns the strata with their shared labels and where they stand, or an issue
 * @example
 * locateStrata('## Early\n| | late | on time |\n|-|-|-|\n| van A | 3 | 40 |\n| van B | 7 | 35 |\n\n' +
 *   '## Late\n| | late | on time |\n|-|-|-|\n| van A | 5 | 30 |\n| van B | 9 | 28 |\n', { format: 'markdown' });
 * // ok: strata 'Early' and 'Late', rowLabels ['van A', 'van B'], columnLabels ['late', 'on time']
 */
export function locateStrata(text: string, request: TableRequest): Result<StrataTables> {
  if (request.format === 'delimited') {
    return fail({ code: 'bad-option', message: 'A delimited file holds one table. For a stratified analysis of raw data, add a column naming each row\'s stratum (such as its site or shift) and choose it as the stratum column; or write the strata as 2×2 tables in a note.' });
  }
  const documentLines = splitLines(text);
  const markdown = findMarkdownTables(text);
  const located = locateTable(text, request);
  if (!located.ok) return located;
  const fromMarkdown = markdown.some((grid) => grid.startLine === located.value.grid.startLine && grid.endLine === located.value.grid.endLine);
  const grids = fromMarkdown ? markdown : textBlockTables(documentLines);
  const candidates: Candidate[] = grids.map((grid) => ({ grid }));
  const startIndex = !fromMarkdown && request.tableIndex !== undefined
    ? Math.min(request.tableIndex, grids.length) - 1
    : grids.findIndex((grid) => grid.startLine <= located.value.grid.endLine && grid.endLine >= located.value.grid.startLine);
  if (!fromMarkdown && request.tableIndex !== undefined && request.tableIndex > grids.length) {
    return fail({ code: 'bad-option', message: `There ${grids.length === 1 ? 'is 1 table' : `are ${grids.length} tables`} in this document, so there is no table ${request.tableIndex}; choose a table from 1 to ${grids.length}.` });
  }
  if (startIndex < 0) {
    // The located block reads as no table of counts: say why, in the reader's words.
    const read = readCountTable(located.value.grid);
    if (!read.ok) return read;
    return strataIssue(where(located.value.grid), `the table on ${lines(located.value.grid)} could not be taken as a stratum. ${HOW_TO_LAY_OUT}`);
  }
  const selected = request.selection && request.tableIndex === undefined
    ? candidates.map((_, index) => index).filter((index) => grids[index].startLine <= request.selection!.endLine && grids[index].endLine >= request.selection!.startLine)
    : [];
  const run = selected.length >= 2 ? checkSelection(candidates, selected) : gatherRun(candidates, startIndex, documentLines);
  if (!run.ok) return run;
  return ok(assemble(candidates, run.value.indices, run.value.notes, documentLines));
}

/** Tables of a plain-text document: blocks of non-blank lines that read as counts, a first line of text being the name. */
function textBlockTables(documentLines: readonly string[]): RawGrid[] {
  const tables: RawGrid[] = [];
  let index = 0;
  while (index < documentLines.length) {
    if (/^\s*$/.test(documentLines[index])) {
      index++;
      continue;
    }
    const start = index;
    while (index < documentLines.length && !/^\s*$/.test(documentLines[index])) index++;
    const block = documentLines.slice(start, index);
    for (const skip of [0, 1]) {
      if (block.length - skip < 2) break;
      const grid = readTextBlock(block.slice(skip).join('\n'), start + skip + 1);
      if (grid.ok && readCountTable(grid.value, { keepZeroLines: true }).ok) {
        tables.push(grid.value);
        break;
      }
    }
  }
  return tables;
}

interface Run {
  indices: number[];
  notes: Issue[];
}

/** Why `candidates[index]` cannot join a run whose first table is `reference`, or undefined when it can. */
function misfit(candidate: Candidate, reference: CountTable | undefined): string | undefined {
  const read = readCandidate(candidate);
  const grid = candidate.grid;
  if (!read.ok) return `the table on ${lines(grid)} cannot be read as counts (${read.issue.message})`;
  if (!isTwoByTwo(read.value)) return `the table on ${lines(grid)} is ${shape(read.value)} (after totals are left out), not 2×2`;
  if (reference && alignLabels(read.value, reference).kind === 'different') {
    return `the table on ${lines(grid)} has other labels (rows ${quoteList(read.value.rowLabels)}, columns ${quoteList(read.value.columnLabels)}) than the strata beside it (rows ${quoteList(reference.rowLabels)}, columns ${quoteList(reference.columnLabels)})`;
  }
  return undefined;
}

function quoteList(labels: readonly string[]): string {
  return labels.map((label) => `"${label}"`).join(' and ');
}

function checkSelection(candidates: Candidate[], selected: number[]): Result<Run> {
  let reference: CountTable | undefined;
  for (const index of selected) {
    const problem = misfit(candidates[index], reference);
    if (problem) return strataIssue(where(candidates[index].grid), `the selection covers ${selected.length} tables, but ${problem}. ${HOW_TO_LAY_OUT}`);
    reference ??= (readCandidate(candidates[index]) as { ok: true; value: CountTable }).value;
  }
  return ok({ indices: selected, notes: [] });
}

function gatherRun(candidates: Candidate[], startIndex: number, documentLines: readonly string[]): Result<Run> {
  const start = candidates[startIndex];
  const startRead = readCandidate(start);
  if (!startRead.ok) return startRead;
  if (!isTwoByTwo(startRead.value)) {
    return strataIssue(where(start.grid), `the table on ${lines(start.grid)} is ${shape(startRead.value)} (after totals are left out); a stratified analysis needs 2×2 tables, one per stratum. ${HOW_TO_LAY_OUT}`);
  }
  const indices = [startIndex];
  const notes: Issue[] = [];
  const stops: string[] = [];
  const extend = (step: 1 | -1): void => {
    for (let index = startIndex + step; index >= 0 && index < candidates.length; index += step) {
      const [upper, lower] = step === 1 ? [candidates[index - 1].grid, candidates[index].grid] : [candidates[index].grid, candidates[index + 1].grid];
      if (!joinsStrata(documentLines, upper.endLine, lower.startLine)) return;
      const problem = misfit(candidates[index], startRead.value);
      if (problem) {
        const location = where(candidates[index].grid);
        stops.push(problem);
        notes.push({ code: 'strata', message: `${describeLocation(location)}: the strata ${step === 1 ? 'end before' : 'start after'} this table: ${problem}.`, location });
        return;
      }
      if (step === 1) indices.push(index);
      else indices.unshift(index);
    }
  };
  extend(-1);
  extend(1);
  if (indices.length === 1) {
    const why = stops.length > 0 ? `Next to it, ${stops.join('; and ')}.` : 'No other 2×2 table stands right before or after it.';
    return strataIssue(where(start.grid), `the table on ${lines(start.grid)} is the only stratum found; a stratified analysis needs two or more 2×2 tables. ${why} ${HOW_TO_LAY_OUT}`);
  }
  return ok({ indices, notes });
}

function assemble(candidates: Candidate[], indices: number[], runNotes: Issue[], documentLines: readonly string[]): StrataTables {
  const notes = [...runNotes];
  const tables = indices.map((index) => (readCandidate(candidates[index]) as { ok: true; value: CountTable }).value);
  const reference = tables[0];
  const strata: LabelledStratum[] = [];
  const sources: ('text' | 'corner' | 'generated')[] = [];
  indices.forEach((candidateIndex, position) => {
    const grid = candidates[candidateIndex].grid;
    const alignment: Alignment = alignLabels(tables[position], reference);
    const table = applyAlignment(tables[position], alignment, reference);
    if (alignment.kind === 'reordered' || alignment.kind === 'transposed') {
      const location = where(grid);
      const how = alignment.kind === 'reordered' ? 'lists the same labels in another order' : 'has the rows and columns the other way round';
      notes.push({ code: 'strata', message: `${describeLocation(location)}: the table on ${lines(grid)} ${how}; it was rearranged to match the first stratum (rows ${quoteList(reference.rowLabels)}, columns ${quoteList(reference.columnLabels)}).`, location });
    }
    const topLine = position === 0 ? (candidateIndex === 0 ? 1 : candidates[candidateIndex - 1].grid.endLine + 1) : candidates[indices[position - 1]].grid.endLine + 1;
    const heading = labelAbove(documentLines, grid.startLine, topLine);
    const corner = tables[position].generatedRowLabels ? '' : stripInlineMarkup(grid.rows[0]?.[0]?.text ?? '');
    sources.push(heading ? 'text' : corner ? 'corner' : 'generated');
    strata.push({ label: heading || corner || `Stratum ${position + 1}`, table });
  });
  const counts = new Map<string, number>();
  for (const stratum of strata) counts.set(stratum.label.toLowerCase(), (counts.get(stratum.label.toLowerCase()) ?? 0) + 1);
  strata.forEach((stratum, position) => {
    if ((counts.get(stratum.label.toLowerCase()) ?? 0) < 2) return;
    stratum.label = sources[position] === 'corner' ? `Stratum ${position + 1}` : `${stratum.label} (${position + 1})`;
  });
  const first = candidates[indices[0]].grid;
  const last = candidates[indices[indices.length - 1]].grid;
  return {
    strata,
    rowLabels: [...reference.rowLabels],
    columnLabels: [...reference.columnLabels],
    firstIndex: indices[0] + 1,
    lastIndex: indices[indices.length - 1] + 1,
    count: candidates.length,
    startLine: first.startLine,
    endLine: last.endLine,
    notes,
  };
}
