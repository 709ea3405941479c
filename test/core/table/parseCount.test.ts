import assert from 'node:assert/strict';
import fc from 'fast-check';
import { parseCount } from '../../../src/core/table/parseCount';
import type { IssueCode } from '../../../src/core/types';

const at = { line: 7, column: 12 };
const plain = { decimalComma: false };
const comma = { decimalComma: true };

function expectIssue(text: string, context: { decimalComma: boolean }, code: IssueCode, mentions: RegExp): void {
  const result = parseCount(text, at, context);
  assert.equal(result.ok, false, `${JSON.stringify(text)} should be rejected`);
  if (result.ok) return;
  assert.equal(result.issue.code, code, `${JSON.stringify(text)}: ${result.issue.message}`);
  assert.deepEqual(result.issue.location, at);
  assert.match(result.issue.message, /^line 7, column 12: /);
  assert.match(result.issue.message, mentions);
}

function expectCount(text: string, context: { decimalComma: boolean }, expected: number): void {
  const result = parseCount(text, at, context);
  assert.deepEqual(result, { ok: true, value: expected }, `${JSON.stringify(text)}`);
}

describe('parseCount', () => {
  it('reads plain whole numbers, with markup and surrounding space stripped', () => {
    expectCount('0', plain, 0);
    expectCount(' 42 ', plain, 42);
    expectCount('**12**', plain, 12);
    expectCount('_7_', comma, 7);
    expectCount('0012', plain, 12);
  });

  it('reads thousands separators of the context: comma, space, no-break spaces and apostrophes', () => {
    expectCount('1,204', plain, 1204);
    expectCount('12,345,678', plain, 12345678);
    expectCount('1 204', plain, 1204);
    expectCount('1\u00a0204', comma, 1204);
    expectCount('1\u202f204\u202f000', comma, 1204000);
    expectCount("1'204", plain, 1204);
    expectCount('1\u2019204', comma, 1204);
    expectCount('1.204', comma, 1204);
    expectCount('1.204.000', comma, 1204000);
    expectCount('12,34,567', plain, 1234567);
  });

  it('accepts trailing zero decimals as whole numbers', () => {
    expectCount('12.0', plain, 12);
    expectCount('1,204.00', plain, 1204);
    expectCount('12,0', comma, 12);
  });

  it('agrees with Intl.NumberFormat digit grouping in several locales (ICU/CLDR bundled with Node, run live)', () => {
    const locales: [string, boolean][] = [
      ['en-US', false], ['en-GB', false], ['en-IN', false], ['de-CH', false],
      ['de-DE', true], ['fr-FR', true], ['nb-NO', true], ['it-IT', true],
    ];
    fc.assert(fc.property(fc.integer({ min: 0, max: 999_999_999_999 }), fc.constantFrom(...locales), (value, [locale, decimalComma]) => {
      const written = new Intl.NumberFormat(locale, { useGrouping: true, maximumFractionDigits: 0 }).format(value);
      assert.deepEqual(parseCount(written, at, { decimalComma }), { ok: true, value }, `${locale} wrote ${JSON.stringify(written)}`);
    }), { numRuns: 2000 });
  });

  it('rejects an empty cell, saying to enter 0 when there were none', () => {
    expectIssue('', plain, 'empty-cell', /empty.*0 if there were none/);
    expectIssue('  <b></b> ', plain, 'empty-cell', /empty/);
  });

  it('rejects negative numbers, with a hyphen or a minus sign', () => {
    expectIssue('-3', plain, 'negative-count', /"-3" is negative/);
    expectIssue('\u22123', plain, 'negative-count', /negative/);
  });

  it('rejects fractions in either decimal convention', () => {
    expectIssue('12.5', plain, 'non-integer-count', /"12.5" is not a whole number/);
    expectIssue('12,5', comma, 'non-integer-count', /not a whole number/);
    expectIssue('1,204.5', plain, 'non-integer-count', /not a whole number/);
  });

  it('rejects percentages, saying to enter the counts', () => {
    expectIssue('45%', plain, 'percentages-not-counts', /enter the counts, not percentages/);
    expectIssue('12,5 %', comma, 'percentages-not-counts', /percentage/);
  });

  it('rejects text, saying what to enter instead', () => {
    expectIssue('n/a', plain, 'text-in-count-cell', /"n\/a" is not a count; enter a whole number/);
    expectIssue('12 buses', plain, 'text-in-count-cell', /not a count/);
    expectIssue('+5', plain, 'text-in-count-cell', /not a count/);
    expectIssue('1e3', plain, 'text-in-count-cell', /not a count/);
  });

  it('rejects separators that could mean two different numbers', () => {
    expectIssue('1,20', plain, 'ambiguous-number', /"1,20" could be read more than one way.*1204/);
    expectIssue('12,5', plain, 'ambiguous-number', /more than one way/);
    expectIssue('1.204', plain, 'ambiguous-number', /more than one way/);
    expectIssue('1.000', plain, 'ambiguous-number', /more than one way/);
    expectIssue('1,204', comma, 'ambiguous-number', /"," is the decimal mark/);
    expectIssue('1 20', plain, 'ambiguous-number', /more than one way/);
    expectIssue('1,204 567', plain, 'ambiguous-number', /more than one way/);
  });

  it('rejects counts too large to hold exactly rather than rounding them', () => {
    expectIssue('9007199254740993', plain, 'unreadable', /too large/);
  });

  it('never throws and returns only safe non-negative integers', () => {
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 30 }), fc.boolean(), (text, decimalComma) => {
      const result = parseCount(text, at, { decimalComma });
      if (result.ok) assert.ok(Number.isSafeInteger(result.value) && result.value >= 0);
      else assert.match(result.issue.message, /^line 7, column 12: /);
    }), { numRuns: 3000 });
  });
});
