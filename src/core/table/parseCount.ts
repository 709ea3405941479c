import { fail, ok } from '../types';
import type { IssueCode, Result, SourceLocation } from '../types';
import { describeLocation } from './describeLocation';
import { stripInlineMarkup } from './stripInlineMarkup';

export interface CountContext {
  /** True when `,` is the decimal mark (a `;`-separated file with comma numbers): `.` then groups thousands. */
  decimalComma: boolean;
}

/**
 * Reads one cell as a whole, non-negative count, accepting the digit-grouping conventions people
 * type: `1,204` (or `1.204` where `,` is the decimal mark), `1 204` with a space, no-break space or
 * narrow no-break space, `1'204`, Indian grouping `12,34,567`, and trailing zero decimals (`12.0`).
 * Emphasis and other Markdown is stripped first, so `**12**` reads as 12.
 *
 * Rejected, each with a message naming the cell and saying what to enter: empty cells, negative
 * numbers, fractions (`12.5`, or `12,5` with decimal commas), percentages, text, and separators
 * that could mean two different numbers (`1,20`; `1.204` where `.` is the decimal point).
 * Digit groups follow CLDR number formatting as produced by Intl.NumberFormat (common practice).
 *
 * @param text - the cell as written
 * @param location - where the cell's text starts, named in every message
 * @param context - which character is the decimal mark
 * @returns the count, or an issue
 */
export function parseCount(text: string, location: SourceLocation, context: CountContext): Result<number> {
  const shown = text.trim();
  const visible = stripInlineMarkup(text);
  const reject = (code: IssueCode, problem: string): Result<number> =>
    fail({ code, message: `${describeLocation(location)}: ${problem}`, location });
  if (visible === '') return reject('empty-cell', 'this count is empty; enter the number of cases (0 if there were none).');
  if (visible.includes('%')) {
    return reject('percentages-not-counts', `"${shown}" is a percentage; enter the counts, not percentages (the number of cases in the cell).`);
  }
  if (/^[-\u2212]\s*[\d.,]/.test(visible)) {
    return reject('negative-count', `"${shown}" is negative; a count is a number of cases, 0 or more.`);
  }
  if (!/^\d[\d.,'\u2019 \u00a0\u202f\u2009]*$/.test(visible)) {
    return reject('text-in-count-cell', `"${shown}" is not a count; enter a whole number of cases (0 if none), or keep labels in the first row and column.`);
  }
  const decimalMark = context.decimalComma ? ',' : '.';
  const parts = visible.split(decimalMark);
  const integerPart = parts[0];
  const fraction = parts.length === 2 ? parts[1] : undefined;
  const digits = parts.length <= 2 ? groupedDigits(integerPart, context.decimalComma) : undefined;
  const otherMark = context.decimalComma ? '.' : ',';
  const ambiguous = (): Result<number> => reject('ambiguous-number',
    `"${shown}" could be read more than one way (here "${decimalMark}" is the decimal mark and "${otherMark}" groups thousands); ` +
    'write the count as plain digits, e.g. 1204.');
  if (digits === undefined || (fraction !== undefined && !/^\d+$/.test(fraction))) return ambiguous();
  const mightGroupThousands = fraction !== undefined && fraction.length === THOUSANDS_GROUP && /^\d{1,3}$/.test(integerPart);
  if (fraction !== undefined && /[1-9]/.test(fraction)) {
    if (mightGroupThousands) return ambiguous();
    return reject('non-integer-count', `"${shown}" is not a whole number; enter counts of cases, not averages, rates or measurements.`);
  }
  if (mightGroupThousands) return ambiguous();
  const value = Number(digits);
  if (!Number.isSafeInteger(value)) {
    return reject('unreadable', `"${shown}" is too large to count exactly; counts must be below 2^53 (about 9 × 10^15).`);
  }
  return ok(value);
}

const THOUSANDS_GROUP = 3;
const SPACE_SEPARATORS = ' \u00a0\u202f\u2009';

/** The digits of an integer part written plainly or in consistent groups of three; undefined otherwise. */
function groupedDigits(integerPart: string, decimalComma: boolean): string | undefined {
  if (/^\d+$/.test(integerPart)) return integerPart;
  const separators = `${decimalComma ? '.' : ','}'\u2019${SPACE_SEPARATORS}`;
  const separator = [...integerPart].find((char) => !/\d/.test(char)) ?? '';
  if (!separators.includes(separator)) return undefined;
  const groups = integerPart.split(separator);
  const western = /^\d{1,3}$/.test(groups[0]) && groups.slice(1).every((group) => /^\d{3}$/.test(group));
  // Indian grouping (lakh, crore): the last group has three digits, the ones before it two.
  const indian = separator === ',' && groups.length > 2 && /^\d{1,2}$/.test(groups[0])
    && groups.slice(1, -1).every((group) => /^\d{2}$/.test(group)) && /^\d{3}$/.test(groups[groups.length - 1]);
  return western || indian ? groups.join('') : undefined;
}
