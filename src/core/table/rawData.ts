/**
 * Telling raw data (one row per observation, categories spelled out) from a table of counts.
 *
 * A column is *categorical* when, in the first rows, most of its non-empty values are text
 * rather than numbers or dates, and (given enough values to tell) its values repeat the way
 * categories do. Both the router (`looksLikeRawData`) and the cross-tabulator's default choice of
 * columns use this one rule, so a file routed to cross-tabulation always has two columns to cross.
 */

/** Rows looked at when judging columns; enough to see text in a column, small enough to buffer (project decision). */
export const RAW_DATA_SAMPLE_ROWS = 50;

/** Below this many values a column is too short to judge whether its values repeat (project decision). */
const MIN_VALUES_FOR_REPEAT_CHECK = 20;

/** A column whose sampled values are more than this share distinct looks like identifiers or free text (project decision). */
const MAX_DISTINCT_SHARE = 0.5;

const NUMBER_LIKE = /^[+-]?(?:\d[\d,'\u00a0\u202f ]*(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?\s*%?$/;
const NUMBER_WITH_NOTE = /^[+-]?\d[\d,.]*\s*\(.*\)$/;
const DATE_OR_TIME_LIKE = /^(?:\d{1,4}[-/.]\d{1,2}[-/.]\d{1,4}(?:[ T]\d{1,2}:\d{2}(?::\d{2}(?:\.\d+)?)?)?|\d{1,2}:\d{2}(?::\d{2})?)(?:\s*(?:Z|[+-]\d{2}:?\d{2}|[ap]\.?m\.?))?$/i;

function isNumberOrDateLike(value: string): boolean {
  return NUMBER_LIKE.test(value) || NUMBER_WITH_NOTE.test(value) || DATE_OR_TIME_LIKE.test(value);
}

function isCategoricalColumn(rows: readonly (readonly string[])[], column: number): boolean {
  let nonEmpty = 0;
  let textual = 0;
  const distinct = new Set<string>();
  for (const row of rows) {
    const value = (row[column] ?? '').trim();
    if (value === '') continue;
    nonEmpty++;
    distinct.add(value);
    if (!isNumberOrDateLike(value)) textual++;
  }
  if (nonEmpty === 0 || textual * 2 <= nonEmpty) return false;
  return nonEmpty < MIN_VALUES_FOR_REPEAT_CHECK || distinct.size <= nonEmpty * MAX_DISTINCT_SHARE;
}

/**
 * Indices of the categorical columns, left to right, judged on the first `RAW_DATA_SAMPLE_ROWS` rows.
 *
 * @param header - Column names (only their count matters).
 * @param rows - Data rows below the header, as cell texts.
 * @returns Column indices, ascending.
 */
export function categoricalColumns(header: readonly string[], rows: readonly (readonly string[])[]): number[] {
  const sample = rows.slice(0, RAW_DATA_SAMPLE_ROWS);
  const columns: number[] = [];
  for (let column = 0; column < header.length; column++) {
    if (isCategoricalColumn(sample, column)) columns.push(column);
  }
  return columns;
}

/**
 * Whether a delimited table is raw data to cross-tabulate rather than a table of counts: true when two or
 * more columns are categorical (mostly non-numeric text that repeats; see the module comment).
 *
 * A table of counts has at most one text column (its row labels), so two text columns mean each row is an
 * observation described by categories, like a ski school log `date,instructor,level,completed`.
 *
 * @param header - The header row's cell texts.
 * @param rows - The data rows' cell texts (only the first `RAW_DATA_SAMPLE_ROWS` are read).
 * @returns True when the engine should cross-tabulate the file.
 * @example looksLikeRawData(['instructor', 'level'], [['Ines', 'novice'], ['Tomas', 'expert']]) // true
 */
export function looksLikeRawData(header: readonly string[], rows: readonly (readonly string[])[]): boolean {
  return categoricalColumns(header, rows).length >= 2;
}
