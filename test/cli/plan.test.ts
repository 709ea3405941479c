import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { parseCommandLine, type PlanCommand } from '../../src/cli/parseCommandLine';
import { runPlan } from '../../src/cli/runPlan';

// The compiled entry beside this test's compiled source, run as a user would (exit codes, stdout, stderr).
const mainFile = path.resolve(__dirname, '..', '..', 'src', 'cli', 'main.js');
const root = path.resolve(__dirname, '..', '..', '..');

function run(args: string[]) {
  const result = spawnSync(process.execPath, [mainFile, ...args], { cwd: root, encoding: 'utf8' });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

function planCommand(args: string[]): PlanCommand {
  const parsed = parseCommandLine(['plan', ...args]);
  assert.ok(parsed.ok, parsed.ok ? '' : parsed.message);
  assert.equal(parsed.command.kind, 'plan');
  return parsed.command as PlanCommand;
}

describe('tallywise plan', () => {
  it('prints the documented JSON fields for a plan from w and df', () => {
    const result = run(['plan', '--w', '0.3', '--df', '2', '--json']);
    assert.equal(result.code, 0, result.stderr);
    const json = JSON.parse(result.stdout);
    for (const field of ['n', 'perGroup', 'power', 'targetPower', 'w', 'df', 'alpha', 'criticalValue', 'lambda', 'curve', 'writeUp']) assert.ok(field in json, `missing ${field}`);
    assert.equal(json.n, 108);
    assert.equal(json.targetPower, 0.8);
    assert.ok(json.power >= 0.8 && json.power < 0.81);
    assert.equal(json.curve.length, 100);
  });

  it('plans from groups with an allocation, from anticipated against null proportions, and from two proportions', () => {
    const groups = runPlan(planCommand(['--groups', '0.04,0.96; 0.08,0.92', '--allocation', '1,1']));
    assert.ok(groups.ok);
    assert.deepEqual(groups.value.json.perGroup, [554, 554]);
    const fit = runPlan(planCommand(['--anticipated', '0.3,0.45,0.25', '--null', '0.25,0.5,0.25']));
    assert.ok(fit.ok);
    assert.equal(fit.value.json.df, 2);
    const two = runPlan(planCommand(['--p1', '0.05', '--p2', '0.10', '--power', '0.8']));
    assert.ok(two.ok);
    assert.match(two.value.text, /Fleiss, Levin & Paik 2003, eq\. 4\.14\): 435, 435 per group; with continuity correction \(4\.15\): 474, 474/);
    const odds = runPlan(planCommand(['--p1', '0.05', '--odds-ratio', String((0.1 / 0.9) / (0.05 / 0.95))]));
    assert.ok(odds.ok);
    assert.equal(odds.value.json.n, two.value.json.n);
  });

  it('reads the anticipated table of counts from a document', () => {
    // Invented greenhouse pilot: seedlings thriving / wilting on two benches.
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallywise-plan-'));
    const file = path.join(dir, 'pilot.md');
    fs.writeFileSync(file, '# Pilot\n\n| Bench | Thriving | Wilting |\n|---|---|---|\n| North | 40 | 10 |\n| South | 30 | 20 |\n\n| Tray | A | B | C |\n|---|---|---|---|\n| Seedlings | 30 | 45 | 25 |\n');
    const table = runPlan(planCommand([file, '--table', '1']));
    assert.ok(table.ok);
    assert.equal(table.value.result.design, 'independence');
    assert.match(table.value.text, /Group 1 has outcome proportions 0\.8, 0\.2\. Group 2 has outcome proportions 0\.6, 0\.4\./);
    const fit = runPlan(planCommand([file, '--table', '2', '--null', '0.25,0.5,0.25']));
    assert.ok(fit.ok);
    assert.equal(fit.value.result.design, 'goodness-of-fit');
    const missingNull = runPlan(planCommand([file, '--table', '2']));
    assert.ok(!missingNull.ok && /--null/.test(missingNull.issue.message));
  });

  it('gives the smallest detectable effect and difference with --sensitivity', () => {
    const w = runPlan(planCommand(['--sensitivity', '--n', '200', '--df', '2']));
    assert.ok(w.ok);
    assert.equal(w.value.json.design, 'sensitivity');
    assert.ok(Math.abs((w.value.json.w as number) - 0.2195) < 1e-4);
    const pair = runPlan(planCommand(['--sensitivity', '--n', '100,100', '--p1', '0.2']));
    assert.ok(pair.ok);
    assert.match(pair.value.text, /≤ 0\.0656 or ≥ 0\.3798/);
  });

  it('exits 2 with a clear message on bad input', () => {
    const cases: [string[], RegExp][] = [
      [['plan', '--groups', '0.2,0.3,0.4;0.3,0.3,0.4'], /Group 1: the proportions sum to 0\.9, not 1/],
      [['plan', '--w', '0.3', '--df', '1', '--power', '1.2'], /power must be between 0 and 1/],
      [['plan', '--w', '0.3', '--df', '1', '--alpha', '0.7'], /significance level must be above 0 and at most 0\.5/],
      [['plan', '--w', '0', '--df', '1'], /effect size w must be a positive number/],
      [['plan', '--w', '0.3'], /--w needs --df/],
      [['plan', '--sensitivity', '--n', '2', '--df', '2'], /above the degrees of freedom/],
      [['plan', '--groups', '0.5,0.5;0.4,0.6', '--allocation', '1,0'], /weights must be positive/],
      [['plan', '--w', '0.3', '--df', '1', '--p1', '0.2'], /exactly one starting point/],
      [['plan', '--p1', '0.2', '--p2', 'x'], /--p2 needs a number/],
      [['analyze', 'examples/ski-school-notes.md', '--power', '0.8'], /belongs to "tallywise plan"/],
    ];
    for (const [args, message] of cases) {
      const result = run(args);
      assert.equal(result.code, 2, args.join(' '));
      assert.match(result.stderr, message, args.join(' '));
      assert.equal(result.stdout, '');
    }
  });
});
