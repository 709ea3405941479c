import assert from 'node:assert/strict';
import fc from 'fast-check';
import { parseFitSpec } from '../../../src/core/stats/parseFitSpec';
import type { Issue } from '../../../src/core/types';

const PROPERTY_SEED = 20260611;

function issueOf(text: string, categories: number): Issue {
  const result = parseFitSpec(text, categories);
  assert.equal(result.ok, false, `expected "${text}" to be refused`);
  if (result.ok) throw new Error('unreachable');
  assert.equal(result.issue.code, 'bad-expected');
  return result.issue;
}

describe('parseFitSpec', () => {
  it('reads ratios such as 9:3:3:1 and 1:1', () => {
    assert.deepEqual(parseFitSpec('9:3:3:1', 4), { ok: true, value: { kind: 'ratio', ratio: [9, 3, 3, 1], text: '9:3:3:1' } });
    assert.deepEqual(parseFitSpec(' 1 : 1 ', 2), { ok: true, value: { kind: 'ratio', ratio: [1, 1], text: '1 : 1' } });
    assert.deepEqual(parseFitSpec('1.5:1', 2), { ok: true, value: { kind: 'ratio', ratio: [1.5, 1], text: '1.5:1' } });
  });

  it('reads decimal proportions and percentages', () => {
    assert.deepEqual(parseFitSpec('0.5, 0.25, 0.25', 3), { ok: true, value: { kind: 'proportions', proportions: [0.5, 0.25, 0.25], text: '0.5, 0.25, 0.25' } });
    assert.deepEqual(parseFitSpec('50%, 25%, 25%', 3), { ok: true, value: { kind: 'proportions', proportions: [0.5, 0.25, 0.25], text: '50%, 25%, 25%' } });
    const thirds = parseFitSpec('33.3%, 33.3%, 33.3%', 3);
    assert.ok(thirds.ok && thirds.value.kind === 'proportions');
  });

  it('reads the keywords equal, poisson, binomial and binomial:10', () => {
    assert.deepEqual(parseFitSpec('equal', 5), { ok: true, value: { kind: 'equal' } });
    assert.deepEqual(parseFitSpec('Poisson', 5), { ok: true, value: { kind: 'poisson' } });
    assert.deepEqual(parseFitSpec('binomial', 5), { ok: true, value: { kind: 'binomial' } });
    assert.deepEqual(parseFitSpec('binomial:10', 5), { ok: true, value: { kind: 'binomial', trials: 10 } });
  });

  it('says what proportions add up to when they miss 1 or 100%', () => {
    assert.match(issueOf('0.5, 0.3, 0.3', 3).message, /add up to 1\.1; they must add up to 1 \(or 100%\)/);
    assert.match(issueOf('50%, 30%, 30%', 3).message, /add up to 110%/);
    assert.match(issueOf('30, 20, 10', 3).message, /add up to 60.*write 30:20:10/);
  });

  it('says how many parts there are when they do not match the categories', () => {
    assert.match(issueOf('9:3:3', 4).message, /has 3 parts but the table has 4 categories/);
    assert.match(issueOf('0.5, 0.5', 3).message, /has 2 parts but the table has 3 categories/);
  });

  it('refuses zero parts, words, mixed % and bad trial counts with a remedy', () => {
    assert.match(issueOf('1:0', 2).message, /greater than 0/);
    assert.match(issueOf('2:-1', 2).message, /greater than 0 \("-1" is not\)/);
    assert.match(issueOf('0.5, -0.5, 1', 3).message, /greater than 0/);
    assert.match(issueOf('1:two', 2).message, /"two" that is not a number/);
    assert.match(issueOf('50%, 0.5', 2).message, /some do not/);
    assert.match(issueOf('binomial:0', 3).message, /at least 1/);
    assert.match(issueOf('binomial:2.5', 3).message, /whole number/);
    assert.match(issueOf('', 3).message, /empty/);
    assert.match(issueOf('normal', 3).message, /"normal" .* is not a number/);
  });

  it('never throws on arbitrary text (fast-check)', () => {
    fc.assert(fc.property(fc.string({ maxLength: 40 }), fc.integer({ min: 1, max: 10 }), (text, categories) => {
      const result = parseFitSpec(text, categories);
      if (!result.ok) assert.ok(result.issue.message.length > 0);
    }), { seed: PROPERTY_SEED, numRuns: 300 });
  });
});
