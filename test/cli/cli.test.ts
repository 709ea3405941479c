import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';

// These run the bundled CLI (dist/cli.js, built by `npm test` before mocha) as a user would.
const root = path.resolve(__dirname, '..', '..', '..');
const cli = path.join(root, 'dist', 'cli.js');

function run(args: string[], input?: string) {
  const result = spawnSync(process.execPath, [cli, ...args], { cwd: root, input, encoding: 'utf8' });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

function tempFile(name: string, text: string): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallywise-cli-'));
  const file = path.join(dir, name);
  fs.writeFileSync(file, text);
  return file;
}

describe('command line', () => {
  it('runs the demo over every bundled example and exits 0', () => {
    const result = run(['demo']);
    assert.equal(result.stderr, '');
    assert.equal(result.code, 0);
    const manifest = JSON.parse(fs.readFileSync(path.join(root, 'examples', 'demo.json'), 'utf8')) as unknown[];
    assert.equal(result.stdout.split('Write-up:').length - 1, manifest.length);
    assert.ok(!/NaN|undefined|Error/.test(result.stdout));
  });

  it('prints the documented JSON fields for a Markdown table', () => {
    const result = run(['analyze', 'examples/ski-school-notes.md', '--table', '1', '--json']);
    assert.equal(result.code, 0, result.stderr);
    const json = JSON.parse(result.stdout);
    for (const field of ['test', 'n', 'df', 'statistic', 'p', 'log10p', 'expected', 'contributions', 'adjustedResiduals', 'g', 'cramersV', 'validity', 'warnings', 'writeUp', 'table']) {
      assert.ok(field in json, `missing ${field}`);
    }
    assert.equal(json.test, 'independence');
    assert.equal(json.n, 412);
    assert.equal(json.df, 6);
    assert.deepEqual(json.table.rowLabels, ['Anouk', 'Bjørn', 'Carmen', 'Dario']);
    assert.deepEqual(json.table.columnLabels, ['Completed', 'Left early', 'No-show']);
    assert.equal(json.table.startLine, 6);
    assert.equal(json.table.endLine, 12);
    for (const key of ['minExpected', 'shareBelow5', 'ok']) assert.ok(key in json.validity);
  });

  it('finds the table that contains --line', () => {
    const result = run(['analyze', 'examples/ski-school-notes.md', '--line', '17', '--json']);
    assert.equal(result.code, 0, result.stderr);
    assert.deepEqual(JSON.parse(result.stdout).table.rowLabels, ['Rented helmet', 'Own helmet']);
  });

  it('cross-tabulates raw observations by the chosen columns', () => {
    const result = run(['analyze', 'examples/bus-depot-breakdowns.csv', '--columns', 'depot,engine_type', '--json']);
    assert.equal(result.code, 0, result.stderr);
    const json = JSON.parse(result.stdout);
    assert.equal(json.n, 480);
    assert.equal(json.table.format, 'crosstab');
    assert.deepEqual(json.table.crossTabulation.columns, ['depot', 'engine_type']);
  });

  it('reads standard input with --format', () => {
    const result = run(['analyze', '-', '--format', 'delimited', '--json'], 'kind,passed,failed\nweld,40,12\nbolt,35,20\n');
    assert.equal(result.code, 0, result.stderr);
    assert.equal(JSON.parse(result.stdout).n, 107);
  });

  it('exits 2 with the file, line and column when a count cell holds text', () => {
    const file = tempFile('notes.md', '# Notes\n\n| Shift | Pass | Fail |\n|---|---|---|\n| Early | 12 | 3 |\n| Late | nine | 4 |\n');
    const result = run(['analyze', file]);
    assert.equal(result.code, 2);
    assert.equal(result.stdout, '');
    assert.match(result.stderr, /notes\.md: line 6, column \d+: /);
    assert.ok(!/at .*\.js:\d+/.test(result.stderr), 'no stack trace');
  });

  it('exits 2 with a clear message for a missing file and for bad options', () => {
    const missing = run(['analyze', 'no-such-file.md']);
    assert.equal(missing.code, 2);
    assert.match(missing.stderr, /no such file/);
    const badAlpha = run(['analyze', 'examples/ski-school-notes.md', '--alpha', '0.9']);
    assert.equal(badAlpha.code, 2);
    assert.match(badAlpha.stderr, /significance level/);
    const unknown = run(['analyse-this']);
    assert.equal(unknown.code, 2);
  });
});
