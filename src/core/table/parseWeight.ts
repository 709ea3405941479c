import type { Issue, SourceLocation } from '../types';

const WHOLE_NUMBER = /^\d+$/;
const DECIMAL_NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Reads a raw-data row's weight: how many observations the row stands for, a whole number of 0 or more
 * (`4.0` and `1e1` are accepted as whole).
 *
 * @param raw - the weight field as written
 * @param location - where the field starts
 * @param columnName - the weight column in words, e.g. `the weight column 'trays'`
 * @returns the weight, or an issue naming the cell and the remedy
 * @example parseWeight(' 3 ', { line: 2, column: 9 }, "the weight column 'trays'") // 3
 */
export function parseWeight(raw: string, location: SourceLocation, columnName: string): number | Issue {
  const text = raw.trim();
  if (WHOLE_NUMBER.test(text)) {
    const value = Number(text);
    if (value <= Number.MAX_SAFE_INTEGER) return value;
  }
  const value = Number(text);
  const issue = (code: Issue['code'], message: string): Issue => ({ code, message, location });
  if (text === '') {
    return issue('empty-cell', `The value in ${columnName} is empty. Write how many observations the row stands for (0 or more).`);
  } else if (!DECIMAL_NUMBER.test(text)) {
    return issue('text-in-count-cell', `The value "${text}" in ${columnName} is not a number. Write each row's count as a whole number such as 3, without units or separators.`);
  } else if (value < 0) {
    return issue('negative-count', `The value ${text} in ${columnName} is negative; a count cannot be. Correct it or remove the row.`);
  } else if (!Number.isInteger(value)) {
    return issue('non-integer-count', `The value ${text} in ${columnName} is not a whole number; a chi-square test needs counts of observations, not averages or rates. Correct it or choose another weight column.`);
  } else if (value > Number.MAX_SAFE_INTEGER) {
    return issue('table-too-large', `The value ${text} in ${columnName} is beyond exact counting (above ${Number.MAX_SAFE_INTEGER}). Check the weight column.`);
  }
  return value;
}
