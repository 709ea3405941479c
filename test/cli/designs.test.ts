import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import * as path from 'node:path';
import { jStat } from 'jstat';
import { parseCommandLine } from '../../src/cli/parseCommandLine';
import { assertClose } from '../helpers/assertClose';

// The bundled CLI (dist/cli.js, built by `npm test` before mocha) on the bundled design examples.
const root = path.resolve(__dirname, '..', '..', '..');
const cli = path.join(root, 'dist', 'cli.js');

// The JSON is read loosely here: the fields each test needs are documented in the README.
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- parsed CLI output, checked field by field below
function json(args: string[]): Record<string, any> {
  const result = spawnSync(process.execPath, [cli, ...args, '--json'], { cwd: root, encoding: 'utf8' });
  assert.equal(result.status, 0, result.stderr);
  return JSON.parse(result.stdout);
}

describe('command line: designs', () => {
  it('--design paired runs McNemar on the climbing-gym checks, with the exact p from the binomial tail (jstat live)', () => {
    const out = json(['analyze', 'examples/climbing-gym-checks.md', '--table', '1', '--design', 'paired', '--p-value', 'exact']);
    assert.equal(out.kind, 'paired');
    assert.deepEqual(out.paired.discordant, { b: 7, c: 23 });
    // Exact conditional McNemar p = 2 · P(X ≤ 7), X ~ Bin(30, ½) (McNemar 1947; Agresti 2013, §11.1).
    assertClose(out.paired.leading.p, 2 * jStat.binomial.cdf(7, 30, 0.5), { absolute: 1e-9 });
    assert.equal(out.options.design, 'paired');
  });

  it('--design stratified gathers the three ferry routes and reports CMH, the common odds ratio and Breslow–Day', () => {
    const out = json(['analyze', 'examples/ferry-seasickness.md', '--design', 'stratified']);
    assert.equal(out.kind, 'stratified');
    assert.equal(out.stratified.strata.length, 3);
    const summed = out.stratified.strata.reduce((sum: number[][], stratum: { observed: number[][] }) =>
      sum.map((row, r) => row.map((x, c) => x + stratum.observed[r][c])), [[0, 0], [0, 0]]);
    assert.deepEqual(out.table.observed, summed);
    assert.ok(out.stratified.pooledOddsRatio.lower < out.stratified.pooledOddsRatio.estimate);
    assert.ok(out.stratified.breslowDay.df === 2);
  });

  it('--stratum on a raw CSV implies the stratified design and tabulates one 2×2 per shift', () => {
    const out = json(['analyze', 'examples/bakery-late-deliveries.csv', '--columns', 'van,arrival', '--stratum', 'shift']);
    assert.equal(out.kind, 'stratified');
    assert.equal(out.table.crossTabulation.stratumColumn, 'shift');
    assert.deepEqual(out.stratified.strata.map((s: { label: string }) => s.label).sort(), ['early', 'midday', 'night']);
  });

  it('--scores sets the trend scores of the ordered columns', () => {
    const out = json(['analyze', 'examples/climbing-gym-checks.md', '--table', '2', '--scores', '1.5,5,8,11,15']);
    assert.deepEqual(out.followUps.trend.scores, [1.5, 5, 8, 11, 15]);
    assert.equal(out.followUps.trend.scoresGiven, true);
  });

  it('reports pairwise comparisons for the four ski instructors, and none with --pairwise off', () => {
    assert.equal(json(['analyze', 'examples/ski-school-notes.md', '--table', '1']).followUps.pairwise.comparisons.length, 6);
    assert.equal(json(['analyze', 'examples/ski-school-notes.md', '--table', '1', '--pairwise', 'off']).followUps.pairwise, undefined);
  });

  it('names the flag and the allowed values for a bad design flag', () => {
    const parsed = parseCommandLine(['analyze', 'x.md', '--design', 'crossover']);
    assert.equal(parsed.ok, false);
    if (!parsed.ok) assert.match(parsed.message, /--design must be independent, paired or stratified \(got "crossover"\)/);
    const scores = parseCommandLine(['analyze', 'x.md', '--scores', '1,2', '--row-scores', '1,2']);
    assert.equal(scores.ok, false);
  });

  it('exits 2 with a located message for --design paired on a 2×5 table', () => {
    const result = spawnSync(process.execPath, [cli, 'analyze', 'examples/climbing-gym-checks.md', '--table', '2', '--design', 'paired'], { cwd: root, encoding: 'utf8' });
    assert.equal(result.status, 2);
    assert.match(result.stderr, /line 14, column 1: a paired analysis needs a 2×2 table/);
  });
});
