import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as path from 'node:path';
import type { FrameLocator } from 'playwright-core';
import { cliJson, fixed } from './cliReference';
import { waitUntil } from './host';
import type { UiScenario } from './scenarios';
import { STEP_MS, type Workbench } from './workbench';

// Issue 6: a person plans the next study from the command palette, and the plan panel shows what the
// CLI's `tallywise plan` computes for the same inputs (sizes, effect size, power curve, paragraph), so
// no number here is typed in by hand. The power figures themselves are checked against outside
// references in the unit tests (test/core/plan/); these scenarios show that the extension and the CLI
// agree, that the paragraph lands in the notes once and undoes in one step, and that a bad entry is
// refused in the box with the engine's message instead of producing a plan.

const PLAN = 'Tallywise: Plan the sample size for the next study';
/** The title of every quick pick and input box the plan command shows. */
const PLAN_TITLE = 'Tallywise: plan the sample size';
const SENSITIVITY_ITEM = 'Smallest effect this table could detect';
const NOTES = 'ski-school-notes.md';

const root = path.resolve(__dirname, '..', '..', '..');
const CLI = path.join(root, 'dist', 'cli.js');
const CLI_MS = 60_000;

interface PlanJson {
  n: number;
  perGroup: number[];
  w: number;
  power: number;
  curve: { n: number; power: number }[];
  twoProportions: { normalApproximation: { perGroup: number[]; correctedPerGroup: number[] } };
  writeUp: string;
}

interface SensitivityJson {
  n: number;
  w: number;
  twoProportions?: { n1: number; n2: number; baseline: number; higher?: number; lower?: number };
  writeUp: string;
}

interface TableJson {
  n: number;
  df: number;
  table: { rowLabels: string[]; columnLabels: string[]; observed: number[][] };
}

/** `tallywise plan <args> --json` from dist/cli.js, parsed. */
function cliPlan<T>(args: string[]): T {
  const result = spawnSync(process.execPath, [CLI, 'plan', ...args, '--json'], { encoding: 'utf8', timeout: CLI_MS });
  if (result.status !== 0) throw new Error(`the CLI reference run failed (exit ${result.status ?? result.signal}): tallywise plan ${args.join(' ')}\n${result.stderr}`);
  return JSON.parse(result.stdout) as T;
}

/** Whole numbers as the report prints them (src/core/report/formatNumber.ts, formatCount). */
const count = (value: number) => Math.round(value).toLocaleString('en-US');
/** Shares as the report prints them (formatPercent). */
const percent = (share: number, decimals: number) => `${(share * 100).toFixed(decimals)}%`;

const QUICK_INPUT = '.quick-input-widget';

/** The message line under the plan command's input box (its prompt, or the validation message). */
function boxMessage(workbench: Workbench, containing: string | RegExp) {
  return workbench.page.locator(`${QUICK_INPUT} .quick-input-message:visible`, { hasText: containing }).first();
}

/**
 * Answers one of the plan command's input boxes. They all carry the same title, so the box is told
 * apart by its prompt; the value typed replaces the suggested one.
 */
async function answerBox(workbench: Workbench, prompt: string, value: string): Promise<void> {
  const input = await workbench.question(PLAN_TITLE);
  await workbench.visible(boxMessage(workbench, prompt), `the input box asking "${prompt}"`);
  await input.fill(value);
  // A refused entry would replace the prompt with the check's message and keep the box open.
  await workbench.visible(boxMessage(workbench, prompt), `"${value}" to be accepted by the box "${prompt}"`);
  await workbench.page.keyboard.press('Enter');
  await waitUntil(async () => (await boxMessage(workbench, prompt).count()) === 0, `the box "${prompt}" to close`, STEP_MS);
}

/** The plan panel's facts (dt → dd) in order. */
async function planFacts(panel: FrameLocator): Promise<Map<string, string>> {
  const pairs = await panel.locator('dl.plan-facts > dt').evaluateAll((terms) => terms.map((term): [string, string] => {
    const value = term.nextElementSibling;
    return [term.textContent ?? '', value?.tagName === 'DD' ? value.textContent ?? '' : ''];
  }));
  return new Map(pairs);
}

function fact(facts: Map<string, string>, label: string): string {
  const value = facts.get(label);
  assert.ok(value !== undefined, `the plan panel lists "${label}" (it lists: ${[...facts.keys()].join(', ')})`);
  return value;
}

/** The power curve is drawn: an SVG with a path of one point per curve point, the target line and the marker. */
async function expectPowerCurve(workbench: Workbench, points: number, markerLabel: string, targetLabel: string): Promise<void> {
  const panel = workbench.panel();
  const chart = panel.locator('figure[data-chart="power-curve"] svg.power-curve-chart');
  await workbench.visible(chart, 'the power curve chart');
  const d = (await chart.locator('path.power-curve').getAttribute('d')) ?? '';
  assert.equal(d.match(/[ML]/g)?.length ?? 0, points, 'the curve has one point per point of the CLI curve');
  assert.ok(!/NaN/.test(d), `the curve's path has no NaN: ${d.slice(0, 80)}…`);
  const box = await chart.locator('path.power-curve').boundingBox();
  assert.ok(box && box.width > 100 && box.height > 50, `the curve is drawn at a visible size (${JSON.stringify(box)})`);
  // A level line has an empty bounding box, so Playwright never calls it visible: read its ends instead.
  const target = chart.locator('line.target-line');
  assert.equal(await target.count(), 1, 'one target-power line');
  const [x1, x2, y1, y2] = await Promise.all(['x1', 'x2', 'y1', 'y2'].map(async (name) => Number(await target.getAttribute(name))));
  assert.ok(x2 - x1 > 100 && y1 === y2 && Number.isFinite(y1), `the target-power line runs across the plot (${x1},${y1} → ${x2},${y2})`);
  await workbench.visible(chart.locator('text.target-label', { hasText: targetLabel }), `the target label "${targetLabel}"`);
  assert.equal((await chart.locator('circle.planned-marker title').textContent())?.trim(), markerLabel, 'the marker at N');
}

/** The curve's table (the chart's text fallback) row by row against the CLI's curve. */
async function expectCurveTable(panel: FrameLocator, curve: { n: number; power: number }[]): Promise<void> {
  const cells = await panel.locator('details.curve-table tbody tr > *').evaluateAll((nodes) => nodes.map((node) => (node.textContent ?? '').trim()));
  const rows = Array.from({ length: Math.ceil(cells.length / 2) }, (_, i) => cells.slice(2 * i, 2 * i + 2));
  assert.deepEqual(rows, curve.map((point) => [count(point.n), percent(point.power, 1)]), 'the power curve table against the CLI curve');
}

export const PLAN_SCENARIOS: UiScenario[] = [
  {
    name: 'plan-two-proportions',
    files: [NOTES],
    async run({ page, workbench, workspace, screenshot }) {
      const reference = cliPlan<PlanJson>(['--p1', '0.04', '--p2', '0.08', '--alpha', '0.05', '--power', '0.8', '--allocation', '1,1']);
      const file = path.join(workspace, NOTES);
      const original = fs.readFileSync(file, 'utf8');
      assert.ok(original.endsWith('\n'), 'the example ends with a line break');
      // The empty last line, after the weekday table: the notes' end.
      const lastLine = original.split('\n').length;

      const editor = await workbench.open(NOTES);
      await workbench.goToLine(editor, lastLine);
      await workbench.runCommand(PLAN);
      await workbench.question(PLAN_TITLE);
      const rows = page.locator(`${QUICK_INPUT} .quick-input-list .monaco-list-row`);
      await workbench.visible(rows.filter({ hasText: 'Two proportions' }).first(), 'the "Two proportions" start');
      assert.equal(await rows.filter({ hasText: SENSITIVITY_ITEM }).count(), 0, 'no sensitivity choice outside a table');
      await workbench.pick('Two proportions');
      await answerBox(workbench, 'Proportions expected in group 1 and group 2', '0.04, 0.08');
      await answerBox(workbench, 'Allocation between the groups', '1:1');
      await answerBox(workbench, 'Significance level α', '0.05');
      await answerBox(workbench, 'Target power', '0.8');

      const panel = workbench.panel();
      const headline = (await (await workbench.visible(panel.locator('p.plan-headline'), 'the plan headline')).textContent()) ?? '';
      const [first, second] = reference.perGroup;
      assert.ok(headline.startsWith(`The study needs N = ${count(reference.n)} observations (group 1 ${count(first)}, group 2 ${count(second)})`), `the headline gives N and the groups: "${headline}"`);
      const facts = await planFacts(panel);
      assert.equal(fact(facts, 'Total sample size (N)'), count(reference.n), 'the total N against the CLI');
      assert.equal(fact(facts, 'Per group'), `group 1: ${count(first)}; group 2: ${count(second)}`, 'the group sizes against the CLI');
      assert.equal(fact(facts, 'Effect size (w)'), fixed(reference.w, 3), 'w against the CLI');
      assert.equal(fact(facts, 'Power at these sizes'), percent(reference.power, 1), 'the power reached against the CLI');
      const fleiss = reference.twoProportions.normalApproximation;
      assert.equal(fact(facts, 'Normal approximation (Fleiss, Levin & Paik)'), `${fleiss.perGroup.map(count).join(' and ')} per group; ${fleiss.correctedPerGroup.map(count).join(' and ')} with the continuity correction`, 'the normal approximation against the CLI');
      await expectPowerCurve(workbench, reference.curve.length, `The planned N = ${count(reference.n)}: power ${percent(reference.power, 1)}`, 'Target 80%');
      await expectCurveTable(panel, reference.curve);
      assert.equal((await panel.locator('p.plan-paragraph').textContent())?.trim(), reference.writeUp, 'the planning paragraph against the CLI write-up');
      await panel.locator('figure[data-chart="power-curve"]').scrollIntoViewIfNeeded();
      await screenshot('plan-two-proportions');

      await panel.getByRole('button', { name: `Insert below line ${lastLine}`, exact: true }).click();
      await workbench.visible(panel.locator('#status', { hasText: `Inserted the planning paragraph below line ${lastLine}.` }), 'the panel to confirm the insertion');
      await workbench.save(NOTES, editor);
      await waitUntil(() => fs.readFileSync(file, 'utf8') !== original, `${NOTES} to change on disk`, STEP_MS);
      const after = fs.readFileSync(file, 'utf8');
      assert.ok(after.startsWith(original), 'the notes above the cursor are unchanged');
      const added = after.slice(original.length);
      assert.equal(after.split(reference.writeUp).length - 1, 1, 'the planning paragraph appears once in the file');
      assert.ok(reference.writeUp.includes(`needs ${reference.n} observations`), 'the CLI paragraph names N');
      assert.match(added, /^\n+/, 'a blank line separates the notes from the paragraph');
      assert.equal(added.replace(/^\n+/, ''), `${reference.writeUp}\n`, 'only the paragraph (and its line break) is added');
      await screenshot('plan-two-proportions-inserted');

      // One undo takes the whole insertion back.
      await editor.locator('.view-lines').click();
      await page.keyboard.press('Control+Z');
      await workbench.save(NOTES, editor);
      await waitUntil(() => fs.readFileSync(file, 'utf8') === original, `one undo to restore ${NOTES} on disk`, STEP_MS);
    },
  },
  {
    name: 'plan-sensitivity',
    files: [NOTES],
    async run({ workbench, screenshot }) {
      // Table 2 (lines 16–19): helmet source × falls, a 2×2 table of a study already run.
      const table = cliJson<TableJson>(NOTES, ['--table', '2']);
      const { observed, rowLabels, columnLabels } = table.table;
      const totals = observed.map((row) => row.reduce((sum, cell) => sum + cell, 0));
      const baseline = observed[0][0] / totals[0];
      const byN = cliPlan<SensitivityJson>(['--sensitivity', '--n', String(table.n), '--df', String(table.df)]);
      const byGroups = cliPlan<SensitivityJson>(['--sensitivity', '--n', totals.join(','), '--p1', String(baseline)]);
      const pair = byGroups.twoProportions;
      assert.ok(pair, 'the CLI gives the smallest detectable second proportion for the two groups');
      assert.equal(fixed(byGroups.w, 3), fixed(byN.w, 3), 'the same w from N alone and from the two groups');

      const editor = await workbench.open(NOTES);
      await workbench.goToLine(editor, 18);
      await workbench.runCommand(PLAN);
      await workbench.answer(PLAN_TITLE, SENSITIVITY_ITEM);
      await answerBox(workbench, 'Significance level α', '0.05');
      await answerBox(workbench, 'Target power', '0.8');

      const panel = workbench.panel();
      await workbench.visible(panel.locator('h1', { hasText: 'What this study could detect' }), 'the sensitivity view');
      const headline = (await panel.locator('p.plan-headline').textContent()) ?? '';
      assert.ok(headline.includes(`With N = ${count(table.n)} observations`) && headline.includes(`w = ${fixed(byN.w, 3)} or larger`), `the headline gives N and w: "${headline}"`);
      const facts = await planFacts(panel);
      assert.equal(fact(facts, 'Table'), `the table on lines 16–19 of ${NOTES}`, 'the table planned from');
      assert.equal(fact(facts, 'Observations (N)'), count(table.n), "the table's N against the CLI");
      assert.equal(fact(facts, 'Smallest detectable effect (w)'), fixed(byN.w, 3), 'the smallest w against `tallywise plan --sensitivity --n N --df 1`');
      assert.equal(fact(facts, 'Groups'), `${rowLabels[0]}: ${count(totals[0])}; ${rowLabels[1]}: ${count(totals[1])}`, 'the two groups as the rows of the table');
      const difference = fact(facts, 'Smallest detectable difference');
      assert.ok(difference.startsWith(`the proportion of ${columnLabels[0]} in ${rowLabels[1]} at `), `the difference is about "${columnLabels[0]}": "${difference}"`);
      for (const side of [pair.lower, pair.higher]) {
        if (side !== undefined) assert.ok(difference.includes(fixed(side, 3)), `the difference names ${fixed(side, 3)}, as the CLI does: "${difference}"`);
      }
      assert.ok(difference.endsWith(`against ${fixed(pair.baseline, 3)} in ${rowLabels[0]}`), `the baseline is the first row's proportion: "${difference}"`);
      await expectPowerCurve(workbench, await panel.locator('details.curve-table tbody tr').count(), `The table's N = ${count(table.n)}: power ${percent(0.8, 1)}`, 'Target 80%');
      assert.equal((await panel.locator('p.plan-paragraph').textContent())?.trim(), byGroups.writeUp, 'the paragraph against the CLI write-up for the two groups');
      await workbench.visible(panel.getByRole('button', { name: 'Insert below the table', exact: true }), 'the Insert button for the table');
      await panel.locator('dl.plan-facts').scrollIntoViewIfNeeded();
      await screenshot('plan-sensitivity');
    },
  },
  {
    name: 'plan-bad-input',
    files: [NOTES],
    async run({ page, workbench, workspace, screenshot }) {
      const file = path.join(workspace, NOTES);
      const original = fs.readFileSync(file, 'utf8');
      const editor = await workbench.open(NOTES);
      await workbench.goToLine(editor, 13);
      await workbench.runCommand(PLAN);
      await workbench.answer(PLAN_TITLE, 'From an effect size w');
      await answerBox(workbench, 'Effect size w', '0.3');
      await answerBox(workbench, 'Degrees of freedom of the test', '1');

      const input = await workbench.question(PLAN_TITLE);
      await workbench.visible(boxMessage(workbench, 'Significance level α'), 'the box asking for α');
      await input.fill('0.7');
      const refusal = boxMessage(workbench, 'The significance level must be above 0 and at most 0.5 (got 0.7); 0.05 is the usual choice.');
      await workbench.visible(refusal, 'the box to refuse α = 0.7 with the engine\'s message');
      // Enter does not accept a refused entry: the same box stays, and no later question comes.
      await page.keyboard.press('Enter');
      await page.waitForTimeout(500);
      await workbench.visible(refusal, 'the refusal to stay after Enter');
      assert.equal(await boxMessage(workbench, 'Target power').count(), 0, 'the power is not asked after a refused α');
      await screenshot('plan-bad-input');
      await input.fill('five percent');
      await workbench.visible(boxMessage(workbench, 'The significance level: "five percent" is not a number'), 'the box to refuse a word');

      await page.keyboard.press('Escape');
      await waitUntil(async () => (await page.locator(`${QUICK_INPUT}:visible`).count()) === 0, 'the input box to close on Escape', STEP_MS);
      assert.equal(await page.locator('iframe.webview').count(), 0, 'no plan panel opened');
      assert.equal(await page.locator('.tabs-container .tab.dirty').count(), 0, 'the notes are not modified in the editor');
      assert.equal(fs.readFileSync(file, 'utf8'), original, 'the notes are unchanged on disk');
    },
  },
];
