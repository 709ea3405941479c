import assert from 'node:assert/strict';
import { jStat } from 'jstat';
import { analyze, analyzeStrataTables } from '../../../src/core/analyze';
import { resolveOptions } from '../../../src/core/options';
import { readCountTable } from '../../../src/core/table/readCountTable';
import { locateTable } from '../../../src/core/table/locateTable';
import type { Analysis } from '../../../src/core/analysis';
import type { CountTable } from '../../../src/core/types';
import { assertClose } from '../../helpers/assertClose';

function markdown(header: string[], rows: (string | number)[][]): string {
  const line = (cells: (string | number)[]) => `| ${cells.join(' | ')} |`;
  return [line(header), line(header.map(() => '---')), ...rows.map(line)].join('\n') + '\n';
}

function analysed(text: string, options: Parameters<typeof analyze>[0]['options'] = {}): Analysis {
  const result = analyze({ text, format: 'markdown', line: 1, options });
  if (!result.ok) assert.fail(result.issue.message);
  return result.value;
}

function countTable(text: string): CountTable {
  const located = locateTable(text, { format: 'markdown', line: 1 });
  if (!located.ok) assert.fail(located.issue.message);
  const read = readCountTable(located.value.grid);
  if (!read.ok) assert.fail(read.issue.message);
  return read.value;
}

/** Pearson X² of a 2×c sub-table, written out here so the check does not reuse the engine's code. */
function pearsonSubTable(rows: number[][]): { statistic: number; df: number } {
  const columns = rows[0].map((_, c) => c).filter((c) => rows[0][c] + rows[1][c] > 0);
  const totals = rows.map((row) => columns.reduce((sum, c) => sum + row[c], 0));
  const n = totals[0] + totals[1];
  let statistic = 0;
  for (const c of columns) {
    const columnTotal = rows[0][c] + rows[1][c];
    for (let r = 0; r < 2; r++) {
      const expected = (totals[r] * columnTotal) / n;
      statistic += (rows[r][c] - expected) ** 2 / expected;
    }
  }
  return { statistic, df: columns.length - 1 };
}

describe('analyze with a study design', () => {
  describe('paired (McNemar)', () => {
    // Agresti, Categorical Data Analysis 3rd ed. (2013), §11.1: presidential approval, 1600 people rated
    // twice: 794 approve/approve, 150 approve/disapprove, 86 disapprove/approve, 570 both disapprove;
    // McNemar z² = 17.36 (from memory).
    const approval = markdown(['First survey', 'Approve', 'Disapprove'], [['Approve', 794, 150], ['Disapprove', 86, 570]]);

    it('leads with McNemar, reproduces z² = 17.36 and takes the exact p from the binomial tail (jstat live)', () => {
      const analysis = analysed(approval, { design: 'paired', pValueMethod: 'exact' });
      assert.equal(analysis.kind, 'paired');
      assert.ok(analysis.paired);
      assertClose(analysis.paired.chiSquare.statistic, 17.36, { absolute: 0.005 });
      // Exact conditional p = 2 · P(X ≤ 86), X ~ Bin(236, ½); jstat 1.9.6 rounds to 10 decimals.
      assertClose(analysis.paired.leading.p, 2 * jStat.binomial.cdf(86, 236, 0.5), { absolute: 1e-9 });
      assert.equal(analysis.paired.leading.method, 'exact');
      assert.match(analysis.writeUp, /treated the table as paired/);
      assert.match(analysis.writeUp, /150 went from Approve to Disapprove and 86 from Disapprove to Approve/);
      assert.match(analysis.writeUp, /not by itself evidence of what caused it/);
      assert.match(analysis.writeUp, /qualified statistician/);
    });

    it('leads with the mid-p by default and says which p leads', () => {
      const small = markdown(['Before', 'Pass', 'Fail'], [['Pass', 31, 2], ['Fail', 9, 8]]);
      const analysis = analysed(small, { design: 'paired' });
      assert.equal(analysis.paired?.leading.method, 'mid-p');
      // mid-p = 2 · P(X ≤ 2) − P(X = 2), X ~ Bin(11, ½) (Fagerland, Lydersen & Laake 2013), jstat live.
      const expected = 2 * jStat.binomial.cdf(2, 11, 0.5) - jStat.binomial.pdf(2, 11, 0.5);
      assertClose(analysis.paired!.leading.p, expected, { absolute: 1e-9 });
      assert.match(analysis.writeUp, /mid-\*p\* = \.0\d\d/);
      assert.match(analysis.writeUp, /exact conditional \*p\*/);
    });

    it('refuses a table that is not 2×2, naming its line', () => {
      const wide = markdown(['Before', 'A', 'B', 'C'], [['A', 3, 4, 5], ['B', 1, 2, 3]]);
      const result = analyze({ text: wide, format: 'markdown', line: 1, options: { design: 'paired' } });
      assert.equal(result.ok, false);
      if (!result.ok) assert.match(result.issue.message, /^line 1, column 1: a paired analysis needs a 2×2 table/);
    });

    it('warns when rows and columns are not the same two answers', () => {
      const text = markdown(['Before', 'Yes', 'No'], [['Pass', 10, 3], ['Fail', 6, 11]]);
      assert.ok(analysed(text, { design: 'paired' }).warnings.some((warning) => warning.code === 'paired-labels'));
    });
  });

  describe('stratified (CMH)', () => {
    // McDonald, Handbook of Biological Statistics 3rd ed. (2014), Cochran–Mantel–Haenszel chapter:
    // Lap94 allele in marine vs estuarine mussels at four sites; continuity-corrected X²MH = 5.05,
    // P = 0.025 (from memory).
    const sites: [string, number[][]][] = [
      ['Tillamook', [[56, 40], [69, 77]]],
      ['Yaquina', [[61, 57], [257, 301]]],
      ['Alsea', [[73, 71], [65, 79]]],
      ['Umpqua', [[71, 55], [48, 48]]],
    ];
    const strata = sites.map(([label, rows]) => ({
      label,
      table: countTable(markdown(['Habitat', 'Lap94', 'Other'], [['Marine', ...rows[0]], ['Estuarine', ...rows[1]]])),
    }));
    const options = resolveOptions({});
    if (!options.ok) throw new Error(options.issue.message);

    it('reproduces McDonald\'s corrected X²MH = 5.05 and writes the stratified paragraph', () => {
      const result = analyzeStrataTables(strata, { index: 1, count: 4 }, options.value);
      if (!result.ok) assert.fail(result.issue.message);
      const analysis = result.value;
      assert.equal(analysis.kind, 'stratified');
      assertClose(analysis.stratified!.cmh.corrected.value, 5.05, { absolute: 0.005 });
      assert.deepEqual(analysis.table.observed, [[261, 223], [439, 505]]);
      assert.match(analysis.writeUp, /within each of 4 strata \(Tillamook, Yaquina, Alsea and Umpqua/);
      assert.match(analysis.writeUp, /Breslow–Day test with Tarone's correction/);
      assert.match(analysis.writeUp, /Mantel–Fleiss criterion/);
      assert.match(analysis.writeUp, /other differences between the groups remain/);
      assert.equal(analysis.stratified!.mantelFleiss.ok, true);
    });

    it('computes the Mantel–Fleiss distances by hand for the mussel strata', () => {
      const result = analyzeStrataTables(strata, { index: 1, count: 4 }, options.value);
      if (!result.ok) assert.fail(result.issue.message);
      const check = result.value.stratified!.mantelFleiss;
      // Σ n₁m₁/n over the four sites, and the bounds Σ max(0, m₁ − n₂), Σ min(n₁, m₁), by hand.
      const expected = 96 * 125 / 242 + 118 * 318 / 676 + 144 * 138 / 288 + 126 * 119 / 222;
      assertClose(check.expected, expected, 1e-12);
      assert.equal(check.lowerBound, 119 - 96);
      assert.equal(check.upperBound, 96 + 118 + 138 + 119);
    });

    it('leads with the exact conditional p when the Mantel–Fleiss criterion fails, and says why', () => {
      const sparse = [
        { label: 'Site 1', rows: [[2, 5], [0, 6]] },
        { label: 'Site 2', rows: [[1, 4], [0, 5]] },
        { label: 'Site 3', rows: [[3, 2], [1, 6]] },
      ].map(({ label, rows }) => ({ label, table: countTable(markdown(['Arm', 'Yes', 'No'], [['A', ...rows[0]], ['B', ...rows[1]]])) }));
      const result = analyzeStrataTables(sparse, { index: 1, count: 3 }, options.value);
      if (!result.ok) assert.fail(result.issue.message);
      const stratified = result.value.stratified!;
      assert.equal(stratified.mantelFleiss.ok, false);
      assert.ok(stratified.exact);
      assert.match(result.value.writeUp, /exact conditional \*p\*/);
      assert.match(result.value.writeUp, /the p-value is from the exact conditional test/);
      assert.ok(result.value.warnings.some((warning) => warning.code === 'validity' && /exact conditional p leads/.test(warning.message)));
    });

    it('refuses a single stratum through analyze()', () => {
      const result = analyze({ text: markdown(['G', 'Y', 'N'], [['A', 3, 4], ['B', 5, 6]]), format: 'markdown', line: 1, options: { design: 'stratified' } });
      assert.equal(result.ok, false);
    });
  });

  describe('follow-ups after an r×c test', () => {
    it('compares the rows two at a time with Holm, checked against jstat chi-square tails live', () => {
      const rows = [[30, 10, 5], [28, 12, 6], [8, 20, 25]];
      const text = markdown(['Line', 'Good', 'Minor', 'Major'], [['Line A', ...rows[0]], ['Line B', ...rows[1]], ['Line C', ...rows[2]]]);
      const analysis = analysed(text);
      const pairwise = analysis.followUps?.pairwise;
      assert.ok(pairwise);
      assert.equal(pairwise.groupsAlong, 'rows');
      const raw = [[0, 1], [0, 2], [1, 2]].map(([i, j]) => {
        const { statistic, df } = pearsonSubTable([rows[i], rows[j]]);
        return 1 - jStat.chisquare.cdf(statistic, df);
      });
      // Holm by hand: sort ascending, multiply by 3, 2, 1, keep monotone.
      const order = raw.map((p, index) => ({ p, index })).sort((x, y) => x.p - y.p);
      const holm: number[] = [];
      let running = 0;
      order.forEach(({ p, index }, rank) => { running = Math.max(running, Math.min(1, p * (3 - rank))); holm[index] = running; });
      pairwise.comparisons.forEach((pair, index) => assertClose(pair.adjustedP, holm[index], { absolute: 1e-9 }));
      assert.match(analysis.writeUp, /Line C differs from Line A and Line B/);
      assert.match(analysis.writeUp, /Line A and Line B do not differ clearly/);
    });

    it('runs a trend test when the columns read as ordered and reproduces Agresti\'s M² = 6.57 with given scores', () => {
      // Agresti (2007), An Introduction to Categorical Data Analysis 2nd ed., Table 2.7 (from memory).
      const text = markdown(['Malformation', '0', '<1', '1-2', '3-5', '6+'], [['Present', 48, 38, 5, 1, 1], ['Absent', 17066, 14464, 788, 126, 37]]);
      const analysis = analysed(text, { ordered: 'columns', columnScores: [0, 0.5, 1.5, 4, 7] });
      const trend = analysis.followUps?.trend;
      assert.ok(trend);
      assertClose(trend.zConditional ** 2, 6.57, { absolute: 0.005 });
      assert.match(analysis.writeUp, /Cochran–Armitage test for trend with scores 0, 0\.50, 1\.50, 4, 7/);
      assert.match(analysis.writeUp, /share of "Present" rises along the order/);
    });

    it('offers the linear-by-linear test when both dimensions read as numbers', () => {
      const text = markdown(['Visits', '0', '1', '2'], [['0-1', 20, 10, 5], ['2-3', 10, 12, 9], ['4+', 4, 9, 16]]);
      const analysis = analysed(text);
      assert.equal(analysis.followUps?.rowsOrdered, true);
      const association = analysis.followUps?.linearByLinear;
      assert.ok(association);
      // M² = (N − 1) r², with r the Pearson correlation of the scores over the 95 observations, from jstat live.
      const xs: number[] = [];
      const ys: number[] = [];
      [[20, 10, 5], [10, 12, 9], [4, 9, 16]].forEach((row, r) => row.forEach((count, c) => { for (let k = 0; k < count; k++) { xs.push(r); ys.push(c); } }));
      const r = jStat.corrcoeff(xs, ys);
      assertClose(association.statistic, (xs.length - 1) * r * r, 1e-10);
      assert.match(analysis.writeUp, /linear-by-linear association test/);
    });

    it('does not treat named categories as ordered, and pairwise can be switched off', () => {
      const text = markdown(['Shop', 'Red', 'Blue'], [['North', 20, 10], ['South', 12, 18], ['East', 15, 15]]);
      const analysis = analysed(text, { pairwise: 'off' });
      assert.equal(analysis.followUps?.pairwise, undefined);
      assert.equal(analysis.followUps?.trend, undefined);
    });

    it('rejects scores that do not match the table, naming the table', () => {
      const text = markdown(['Dose', '0', '1', '2'], [['Yes', 1, 4, 9], ['No', 9, 6, 1]]);
      const result = analyze({ text, format: 'markdown', line: 1, options: { columnScores: [0, 1] } });
      assert.equal(result.ok, false);
      if (!result.ok) assert.match(result.issue.message, /line 1, column 1: 2 column scores were given but the table has 3 columns/);
    });

    it('rejects unknown design options with a message naming them', () => {
      const result = analyze({ text: markdown(['G', 'Y', 'N'], [['A', 3, 4], ['B', 5, 6]]), format: 'markdown', options: { design: 'crossover' as never } });
      assert.equal(result.ok, false);
      if (!result.ok) assert.match(result.issue.message, /design must be independent, paired or stratified/);
    });
  });
});
