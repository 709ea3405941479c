import { fail, ok, type Result } from '../types';
import type { FitSpec } from './fitRequest';

/** Decimal proportions must total 1 within this (common practice: allows 1/3-style rounding in 7 digits). */
const PROPORTION_TOTAL_TOLERANCE = 1e-6;
/** Percentages must total 100 within this, so that rounded shares such as 33.3, 33.3, 33.3 pass. */
const PERCENT_TOTAL_TOLERANCE = 0.5;

const NUMBER = /^(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?$/i;
const NEGATIVE = /^-\s*(?:\d|\.\d)/;
const BINOMIAL = /^binomial(?:\s*[:=]?\s*(.+))?$/i;

/**
 * Reads a goodness-of-fit hypothesis: `equal`, a ratio `9:3:3:1`, proportions `0.5, 0.25, 0.25`
 * or `50%, 25%, 25%`, `poisson`, `binomial` or `binomial:10`. Category values for the Poisson and
 * binomial fits come from the labels later (`buildFitRequest`).
 *
 * Intuition: the user writes the hypothesis as they would on paper; anything that cannot be one is
 * refused with what it adds up to or how many parts it has, and what to write instead.
 *
 * @param text - the hypothesis as written
 * @param categoryCount - how many categories the counts have
 * @returns the spec, or a 'bad-expected' issue
 * @example parseFitSpec('9:3:3:1', 4) // ok({ kind: 'ratio', ratio: [9, 3, 3, 1], text: '9:3:3:1' })
 */
export function parseFitSpec(text: string, categoryCount: number): Result<FitSpec> {
  const trimmed = text.trim();
  const bad = (message: string) => fail<FitSpec>({ code: 'bad-expected', message });
  if (trimmed === '') {
    return bad('The expected pattern is empty. Write "equal", a ratio such as 9:3:3:1, proportions such as 0.5, 0.3, 0.2, or "poisson" / "binomial".');
  }
  const word = trimmed.toLowerCase();
  if (word === 'equal') return ok({ kind: 'equal' });
  if (word === 'poisson') return ok({ kind: 'poisson' });
  const binomial = BINOMIAL.exec(trimmed);
  if (binomial) {
    if (binomial[1] === undefined) return ok({ kind: 'binomial' });
    const trials = Number(binomial[1].trim());
    if (!NUMBER.test(binomial[1].trim()) || !Number.isInteger(trials) || trials < 1) {
      return bad(`The number of binomial trials must be a whole number of at least 1 (got "${binomial[1].trim()}"); write for example binomial:10.`);
    }
    return ok({ kind: 'binomial', trials });
  }
  if (trimmed.includes(':')) return parseRatio(trimmed, categoryCount);
  return parseProportions(trimmed, categoryCount);
}

function parseRatio(text: string, categoryCount: number): Result<FitSpec> {
  const parts = text.split(':').map((part) => part.trim());
  const ratio: number[] = [];
  for (const part of parts) {
    if (NEGATIVE.test(part)) {
      return fail({ code: 'bad-expected', message: `Every part of the ratio ${text} must be greater than 0 ("${part}" is not).` });
    }
    if (!NUMBER.test(part)) {
      return fail({
        code: 'bad-expected',
        message: `The ratio ${text} has a part "${part}" that is not a number; write positive numbers separated by colons, such as 9:3:3:1.`,
      });
    }
    const value = Number(part);
    if (!(value > 0) || !Number.isFinite(value)) {
      return fail({ code: 'bad-expected', message: `Every part of the ratio ${text} must be greater than 0 ("${part}" is not); a category expected to be empty cannot be tested.` });
    }
    ratio.push(value);
  }
  const countIssue = checkPartCount('ratio', text, ratio.length, categoryCount);
  if (countIssue) return countIssue;
  return ok({ kind: 'ratio', ratio, text });
}

function parseProportions(text: string, categoryCount: number): Result<FitSpec> {
  const parts = text.split(/[,;\s]+/).filter((part) => part !== '');
  const percent = parts.map((part) => part.endsWith('%'));
  if (percent.some((flag) => flag) && !percent.every((flag) => flag)) {
    return fail({ code: 'bad-expected', message: `Some of the proportions ${text} end in % and some do not; write all as percentages (50%, 30%, 20%) or all as decimals (0.5, 0.3, 0.2).` });
  }
  const values: number[] = [];
  for (const part of parts) {
    const digits = part.replace(/%$/, '').trim();
    if (NEGATIVE.test(digits)) {
      return fail({ code: 'bad-expected', message: `Every proportion in ${text} must be greater than 0 ("${part}" is not).` });
    }
    if (!NUMBER.test(digits)) {
      return fail({
        code: 'bad-expected',
        message: `"${part}" in the expected pattern ${text} is not a number. Write "equal", a ratio such as 9:3:3:1, proportions such as 0.5, 0.3, 0.2, or "poisson" / "binomial".`,
      });
    }
    values.push(Number(digits));
  }
  if (values.some((value) => !(value > 0) || !Number.isFinite(value))) {
    return fail({ code: 'bad-expected', message: `Every proportion in ${text} must be greater than 0; a category expected to be empty cannot be tested.` });
  }
  const countIssue = checkPartCount('list of proportions', text, values.length, categoryCount);
  if (countIssue) return countIssue;
  const total = values.reduce((sum, value) => sum + value, 0);
  const asPercent = percent[0] || Math.abs(total - 100) <= PERCENT_TOTAL_TOLERANCE;
  if (asPercent && Math.abs(total - 100) > PERCENT_TOTAL_TOLERANCE) {
    return fail({ code: 'bad-expected', message: `The percentages ${text} add up to ${formatTotal(total)}%; they must add up to 100%. To give a ratio instead, write ${values.join(':')}.` });
  }
  if (!asPercent && Math.abs(total - 1) > PROPORTION_TOTAL_TOLERANCE) {
    return fail({ code: 'bad-expected', message: `The proportions ${text} add up to ${formatTotal(total)}; they must add up to 1 (or 100%). To give a ratio instead, write ${values.join(':')}.` });
  }
  return ok({ kind: 'proportions', proportions: values.map((value) => value / total), text });
}

function checkPartCount(what: string, text: string, parts: number, categoryCount: number): Result<FitSpec> | undefined {
  if (parts === categoryCount) return undefined;
  return fail({
    code: 'bad-expected',
    message: `The ${what} ${text} has ${parts} part${parts === 1 ? '' : 's'} but the table has ${categoryCount} categories; give one part per category, in the order of the table.`,
  });
}

function formatTotal(total: number): string {
  return String(Number(total.toPrecision(10)));
}
