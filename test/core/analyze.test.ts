import assert from 'node:assert/strict';
import fc from 'fast-check';
import { jStat } from 'jstat';
import { analyze, type AnalyzeRequest } from '../../src/core/analyze';
import type { IndependenceResult } from '../../src/core/stats/types';
import { assertClose } from '../helpers/assertClose';

function markdownTable(header: string[], rows: (string | number)[][]): string {
  return [`| ${header.join(' | ')} |`, `|${header.map(() => '---').join('|')}|`, ...rows.map((r) => `| ${r.join(' | ')} |`)].join('\n');
}

function mustAnalyze(request: AnalyzeRequest) {
  const result = analyze(request);
  if (!result.ok) assert.fail(`expected an analysis, got: ${result.issue.message}`);
  return result.value;
}

describe('analyze', () => {
  it('tests a dihybrid cross against 9:3:3:1 as published (goodness of fit through the whole pipeline)', () => {
    // Mendel (1866), round/yellow etc. peas 315, 108, 101, 32 against 9:3:3:1; X² ≈ 0.470 with 3 df
    // is the value given in many genetics texts (from memory), and p is checked live against jstat.
    const text = markdownTable(['Phenotype', 'Seeds'], [['Round yellow', 315], ['Round green', 108], ['Wrinkled yellow', 101], ['Wrinkled green', 32]]);
    const analysis = mustAnalyze({ text, format: 'markdown', fit: '9:3:3:1' });
    assert.equal(analysis.result.test, 'goodness-of-fit');
    assert.equal(analysis.result.df, 3);
    assert.equal(analysis.result.n, 556);
    assertClose(analysis.result.statistic, 0.470, 1e-3, 'X²');
    assertClose(analysis.result.p, 1 - jStat.chisquare.cdf(analysis.result.statistic, 3), { absolute: 1e-6 }, 'p vs jstat');
  });

  it('uses a row labelled Expected as the expected counts and says when they were rescaled', () => {
    const text = markdownTable(['', 'North', 'South', 'West'], [['Observed', 30, 50, 20], ['Expected', 60, 80, 60]]);
    const analysis = mustAnalyze({ text, format: 'markdown' });
    assert.equal(analysis.result.test, 'goodness-of-fit');
    if (analysis.result.test !== 'goodness-of-fit') return;
    assert.deepEqual(analysis.result.hypothesis, { kind: 'expected-counts', counts: [60, 80, 60], rescaled: true });
    assert.deepEqual(analysis.result.expected.map((e) => Number(e.toFixed(6))), [30, 40, 30]);
    assert.match(analysis.writeUp, /rescaled to the observed total/);
  });

  it('excludes a totals row and column and notes it', () => {
    const text = markdownTable(['Line', 'Pass', 'Fail', 'Total'], [['A', 40, 10, 50], ['B', 30, 20, 50], ['**Total**', 70, 30, 100]]);
    const analysis = mustAnalyze({ text, format: 'markdown' });
    assert.deepEqual(analysis.table.observed, [[40, 10], [30, 20]]);
    assert.equal(analysis.warnings.filter((w) => w.code === 'totals-excluded').length, 2);
  });

  it('refuses a goodness-of-fit request on a two-way table, naming the table line', () => {
    const text = '\n\n' + markdownTable(['Line', 'Pass', 'Fail'], [['A', 40, 10], ['B', 30, 20]]);
    const result = analyze({ text, format: 'markdown', fit: '1:1' });
    assert.equal(result.ok, false);
    if (result.ok) return;
    assert.equal(result.issue.location?.line, 3);
    assert.match(result.issue.message, /^line 3, column 1: a goodness-of-fit test needs a single row or a single column/);
  });

  it('cross-tabulates a delimited file of raw observations without being told to', () => {
    const rows = ['shift,station,result'];
    const shifts = ['Early', 'Late'];
    const results = ['pass', 'rework', 'scrap'];
    for (let i = 0; i < 60; i++) rows.push(`${shifts[i % 2]},S${(i % 3) + 1},${results[(i * 7) % 3]}`);
    const analysis = mustAnalyze({ text: rows.join('\n'), format: 'delimited' });
    assert.equal(analysis.table.format, 'crosstab');
    assert.equal(analysis.result.n, 60);
    assert.deepEqual(analysis.origin.crossTabulation?.columns, ['shift', 'station']);
  });

  it('refuses to turn a two-row comparison into a goodness-of-fit test by dropping an all-zero row', () => {
    const text = markdownTable(['Kiln', 'Cracked', 'Sound'], [['Old', 0, 0], ['New', 4, 40]]);
    const result = analyze({ text, format: 'markdown' });
    assert.equal(result.ok, false);
    if (!result.ok) assert.match(result.issue.message, /only one row of counts is left/);
  });

  it('rejects options no analysis can use', () => {
    const text = markdownTable(['', 'a', 'b'], [['x', 1, 2], ['y', 3, 4]]);
    for (const options of [{ alpha: 0 }, { alpha: 0.7 }, { confidenceLevel: 1 }, { decimals: 1.5 }]) {
      const result = analyze({ text, format: 'markdown', options });
      assert.equal(result.ok, false);
      if (!result.ok) assert.equal(result.issue.code, 'bad-option');
    }
  });

  it('matches the sum of expected counts to N and the contributions to X² for random tables', () => {
    fc.assert(fc.property(
      fc.integer({ min: 2, max: 5 }), fc.integer({ min: 2, max: 5 }), fc.array(fc.integer({ min: 1, max: 300 }), { minLength: 25, maxLength: 25 }),
      (r, c, pool) => {
        const rows = Array.from({ length: r }, (_, i) => [`G${i + 1}`, ...Array.from({ length: c }, (_, j) => pool[i * 5 + j])]);
        const text = markdownTable(['Group', ...Array.from({ length: c }, (_, j) => `K${j + 1}`)], rows);
        const analysis = mustAnalyze({ text, format: 'markdown' });
        const result = analysis.result as IndependenceResult;
        const expectedSum = result.expected.flat().reduce((a, b) => a + b, 0);
        assertClose(expectedSum, result.n, 1e-12, 'Σ expected');
        assertClose(result.contributions.flat().reduce((a, b) => a + b, 0), result.pearson.statistic, 1e-10, 'Σ contributions');
      },
    ), { numRuns: 60 });
  });

  it('gives the same result whatever the order of the rows in the document', () => {
    const rows: (string | number)[][] = [['Anvil', 12, 30, 8], ['Bracket', 25, 18, 11], ['Clamp', 9, 22, 30]];
    const first = mustAnalyze({ text: markdownTable(['Part', 'Mon', 'Tue', 'Wed'], rows), format: 'markdown' });
    const second = mustAnalyze({ text: markdownTable(['Part', 'Mon', 'Tue', 'Wed'], [rows[2], rows[0], rows[1]]), format: 'markdown' });
    assertClose(second.result.statistic, first.result.statistic, 1e-12, 'X²');
    assertClose(second.result.p, first.result.p, 1e-12, 'p');
  });

  it('never throws and never writes NaN, whatever the document', () => {
    fc.assert(fc.property(fc.string({ maxLength: 400 }), fc.constantFrom('markdown', 'delimited', 'text'), fc.integer({ min: 1, max: 12 }), (text, format, line) => {
      const result = analyze({ text, format: format as AnalyzeRequest['format'], line });
      const words = result.ok ? result.value.writeUp + result.value.expectedTable : result.issue.message;
      assert.ok(!/NaN|undefined/.test(words), words);
    }), { numRuns: 300 });
  });

  it('never throws on table-shaped noise', () => {
    const cell = fc.oneof(fc.integer({ min: -5, max: 50 }).map(String), fc.constantFrom('', 'x', '1,5', '12%', '**Total**', '0', '1 204', 'Σ'));
    fc.assert(fc.property(fc.array(fc.array(cell, { minLength: 1, maxLength: 5 }), { minLength: 1, maxLength: 6 }), (grid) => {
      const text = grid.map((row, i) => (i === 1 ? `|${row.map(() => '---').join('|')}|` : `| ${row.join(' | ')} |`)).join('\n');
      for (const format of ['markdown', 'text', 'delimited'] as const) {
        const result = analyze({ text: format === 'delimited' ? grid.map((r) => r.join(';')).join('\n') : text, format, line: 1 });
        const words = result.ok ? result.value.writeUp : result.issue.message;
        assert.ok(!/NaN|undefined/.test(words), words);
      }
    }), { numRuns: 300 });
  });
});
