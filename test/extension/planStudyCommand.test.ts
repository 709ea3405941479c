import assert from 'node:assert/strict';
import * as path from 'node:path';
import { planStudy } from '../../src/core/plan/planStudy';
import { smallestDetectableDifference } from '../../src/core/plan/smallestDetectableDifference';
import { formatCount, formatFixed, formatPercent } from '../../src/core/report/formatNumber';
import { isHostToPanel } from '../../src/protocol/messages';
import type { PlanView } from '../../src/protocol/planView';
import { fakeDocument, fakeEditor, fakeExtensionContext, installFakeVscode, type FakeVscode, type FakeWebviewPanel } from './fakeVscode';

const root = path.resolve(__dirname, '..', '..', '..');

interface Case { kind: string; input: Record<string, number>; expected: unknown }
// Outside values: test/fixtures/scipy/plan.json (generate_plan.py, scipy's ncx2/chi2 with brentq).
// eslint-disable-next-line @typescript-eslint/no-require-imports -- fixture JSON read at test time.
const fixture = require(path.resolve(__dirname, '../../../test/fixtures/scipy/plan.json')) as { cases: Case[] };

// Invented ski-school notes: a pilot season's lesson outcomes for two booking channels.
const SKI_NOTES = [
  '# Ski school pilot',
  '',
  '| Channel | Passed | Repeated |',
  '|---|---|---|',
  '| Online | 42 | 18 |',
  '| Front desk | 30 | 30 |',
  '',
  'Next season: plan the comparison.',
].join('\n');

/** One input box as the command opened it, with validateInput's verdicts on the probe texts. */
interface Box { prompt: string; value?: string; verdicts: Map<string, string | undefined> }
interface InputBoxOptions { prompt: string; value?: string; validateInput?: (text: string) => string | undefined }
interface FakeWindow { showInputBox: (options: InputBoxOptions) => Promise<string | undefined> }

describe('planStudyCommand', () => {
  let fake: FakeVscode;
  let context: ReturnType<typeof fakeExtensionContext>;
  let boxes: Box[];
  let answers: string[];
  /** Texts tried on every box's validateInput before it answers. */
  let probes: string[];
  let picked: string[][];
  const run = (...args: unknown[]) => fake.commands.get('tallywise.planStudy')!(...args) as Promise<boolean>;

  beforeEach(() => {
    fake = installFakeVscode();
    const extensionFile = require.resolve('../../src/extension/extension');
    const extensionFolder = path.dirname(extensionFile) + path.sep;
    for (const file of Object.keys(require.cache)) if (file.startsWith(extensionFolder)) delete require.cache[file];
    // eslint-disable-next-line @typescript-eslint/no-require-imports -- loaded after the fake 'vscode' is in place.
    const vscode = require('vscode') as { window: FakeWindow };
    boxes = [];
    answers = [];
    probes = [];
    picked = [];
    vscode.window.showInputBox = (options) => {
      const verdicts = new Map(probes.map((text) => [text, options.validateInput?.(text)] as const));
      boxes.push({ prompt: options.prompt, value: options.value, verdicts });
      return Promise.resolve(answers.shift());
    };
    // eslint-disable-next-line @typescript-eslint/no-require-imports -- loaded after the fake 'vscode' is in place.
    const extension = require(extensionFile) as { activate(context: unknown): void };
    context = fakeExtensionContext(root);
    extension.activate(context);
  });

  afterEach(() => {
    for (const subscription of context.subscriptions) subscription.dispose();
    fake.restore();
  });

  function choose(label: RegExp): void {
    fake.answers.quickPick = (items) => {
      picked.push(items.map((item) => item.label));
      return items.find((item) => label.test(item.label));
    };
  }

  /** The plan panel, after its page said it is ready: the view it was sent. */
  function shownPlan(): { panel: FakeWebviewPanel; view: PlanView } {
    const panel = fake.panels[fake.panels.length - 1];
    assert.ok(panel, 'a panel was opened');
    panel.send({ type: 'ready' });
    const message = panel.posted[panel.posted.length - 1];
    assert.ok(isHostToPanel(message) && message.type === 'showPlan', JSON.stringify(message).slice(0, 200));
    return { panel, view: message.view };
  }

  const fact = (view: PlanView, label: string) => view.facts.find((entry) => entry.label === label)?.value;

  /** Lets the panel's async button handler finish. */
  async function settle(): Promise<void> {
    for (let i = 0; i < 10; i++) await new Promise((resolve) => setImmediate(resolve));
  }

  function lastNotice(panel: FakeWebviewPanel): string {
    const notices = panel.posted.filter((message): message is { type: 'notice'; message: string } => isHostToPanel(message) && message.type === 'notice');
    return notices[notices.length - 1]?.message ?? '';
  }

  it('plans from w and df in four checked steps and shows the N that scipy finds in the panel', async () => {
    const outside = fixture.cases.find((entry) => entry.kind === 'effect-size-n' && entry.input.w === 0.3 && entry.input.df === 2 && entry.input.alpha === 0.05 && entry.input.power === 0.8)!;
    const document = fakeDocument(fake, '/notes/plan.md', 'markdown', 'Planning notes\n\nMore text.');
    fake.setActiveEditor(fakeEditor(document, 0));
    choose(/effect size w/);
    answers = ['0.3', '2', '0.05', '0.8'];
    assert.equal(await run(), true);
    assert.deepEqual(boxes.map((box) => box.prompt.split(' ').slice(0, 3).join(' ')), ['Effect size w', 'Degrees of freedom', 'Significance level α', 'Target power']);
    assert.equal(boxes[2].value, '0.05', 'alpha starts at the setting');
    const { view } = shownPlan();
    assert.equal(fact(view, 'Total sample size (N)'), formatCount(outside.expected as number));
    assert.equal(view.curve.planned.n, outside.expected);
    assert.equal(view.labels.insert, 'Insert below line 1');
    assert.equal(fake.panels.length, 1);
  });

  it('rejects bad answers with clear messages: alpha outside (0, 0.5], power outside (0, 1), w ≤ 0, text for numbers', async () => {
    const document = fakeDocument(fake, '/notes/plan.md', 'markdown', 'Notes');
    fake.setActiveEditor(fakeEditor(document, 0));
    choose(/effect size w/);
    probes = ['0', '-0.3', '0.6', '1', '1.2', 'abc', '80%', '0.3', '0.04', ''];
    answers = ['0.3', '1', '0.05', '0.8'];
    assert.equal(await run(), true);
    const [w, df, alpha, power] = boxes.map((box) => box.verdicts);
    assert.match(w.get('0')!, /effect size w must be a positive number \(got 0\)/);
    assert.match(w.get('-0.3')!, /effect size w must be a positive number/);
    assert.match(w.get('abc')!, /^The effect size w: "abc" is not a number/);
    assert.equal(w.get('0.3'), undefined);
    assert.match(df.get('0.3')!, /degrees of freedom must be a whole number of at least 1/);
    assert.equal(df.get('1'), undefined);
    assert.match(alpha.get('0')!, /significance level must be above 0 and at most 0\.5 \(got 0\)/);
    assert.match(alpha.get('0.6')!, /at most 0\.5 \(got 0\.6\)/);
    assert.equal(alpha.get('0.04'), undefined);
    assert.match(power.get('1')!, /power must be between 0 and 1, exclusive \(got 1\)/);
    assert.match(power.get('1.2')!, /power must be between 0 and 1/);
    assert.match(power.get('0.04')!, /must be above the significance level \(0\.05\)/);
    assert.equal(power.get('80%'), undefined, 'a percentage is read as 0.8');
    assert.match(power.get('')!, /^Enter a value, e\.g\. 0\.8\./);
    for (const verdicts of [w, df, alpha, power]) for (const message of verdicts.values()) assert.doesNotMatch(message ?? '', /NaN/);
  });

  it('plans two proportions with a typed 2:1 allocation, checking the ratio, and inserts below the cursor line from the panel', async () => {
    const document = fakeDocument(fake, '/notes/plan.md', 'markdown', 'Planning notes\n\nMore text.');
    fake.setActiveEditor(fakeEditor(document, 0));
    choose(/^Two proportions/);
    probes = ['1:1', '2:1', '2:0', '-1:1', '2:1:1', 'two:one', '1.5 : 1'];
    answers = ['0.04, 0.08', '2:1', '0.05', '0.8'];
    assert.equal(await run(), true);
    const allocation = boxes[1].verdicts;
    assert.equal(boxes[1].value, '1:1', 'equal groups unless the ratio is changed');
    assert.equal(allocation.get('2:1'), undefined);
    assert.equal(allocation.get('1.5 : 1'), undefined);
    assert.match(allocation.get('2:0')!, /Every part of the ratio must be a positive number: group 2 has 0/);
    assert.match(allocation.get('-1:1')!, /positive number: group 1 has -1/);
    assert.match(allocation.get('2:1:1')!, /Give 2 numbers, one per group \(group 1 : group 2\).*3 were given/);
    assert.match(allocation.get('two:one')!, /"two" \(for group 1\) is not a number/);
    const expected = planStudy({ design: 'two-proportions', p1: 0.04, p2: 0.08, allocationRatio: 0.5, alpha: 0.05, power: 0.8 });
    assert.ok(expected.ok);
    const { panel, view } = shownPlan();
    assert.equal(fact(view, 'Total sample size (N)'), formatCount(expected.value.n));
    assert.equal(fact(view, 'Per group'), `group 1: ${formatCount(expected.value.perGroup[0])}; group 2: ${formatCount(expected.value.perGroup[1])}`);
    assert.equal(fact(view, 'Allocation'), '2 : 1');
    assert.equal(fact(view, 'Power at these sizes'), formatPercent(expected.value.achievedPower, 1));
    assert.equal(document.text, 'Planning notes\n\nMore text.', 'nothing is inserted before the button is pressed');
    panel.send({ type: 'insertPlan' });
    await settle();
    const lines = document.text.split('\n');
    assert.equal(lines[0], 'Planning notes');
    assert.equal(lines[1], '');
    assert.equal(lines[2], view.paragraph);
    assert.equal(lines[3], '');
    assert.equal(lines[4], 'More text.');
    assert.equal(lines.length, 5);
    assert.equal(lastNotice(panel), 'Inserted the planning paragraph below line 1.');
    panel.send({ type: 'copyPlan' });
    await settle();
    assert.deepEqual(fake.clipboard, [view.paragraph]);
    assert.equal(lastNotice(panel), 'The planning paragraph is on the clipboard.');
  });

  it('plans from the table at the cursor with its row names, and inserts below the table even after lines were added above', async () => {
    const document = fakeDocument(fake, '/notes/ski.md', 'markdown', SKI_NOTES);
    fake.setActiveEditor(fakeEditor(document, 4));
    choose(/^From the table/);
    answers = ['1:1', '0.05', '0.9'];
    assert.equal(await run(), true);
    assert.match(boxes[0].prompt, /\(Online : Front desk\)/);
    const { panel, view } = shownPlan();
    assert.equal(fact(view, 'Planned from'), 'the table on lines 3–6 of ski.md');
    assert.match(view.headline, /\(Online \d+, Front desk \d+\)/);
    assert.equal(view.labels.insert, 'Insert below the table');
    document.text = `A note added later.\n${document.text}`;
    panel.send({ type: 'insertPlan' });
    await settle();
    const lines = document.text.split('\n');
    assert.equal(lines[6], '| Front desk | 30 | 30 |');
    assert.equal(lines[7], '');
    assert.match(lines[8], /^Assumptions: Group 1 has outcome proportions 0\.7, 0\.3\. Group 2 has outcome proportions 0\.5, 0\.5\./);
    assert.match(lines[8], /90% power/);
    assert.equal(lines[9], '');
    assert.equal(lines[10], 'Next season: plan the comparison.');
  });

  it('refuses to insert under a table that was edited since the plan, and says how to go on', async () => {
    const document = fakeDocument(fake, '/notes/ski.md', 'markdown', SKI_NOTES);
    fake.setActiveEditor(fakeEditor(document, 4));
    choose(/^From the table/);
    answers = ['1:1', '0.05', '0.8'];
    assert.equal(await run(), true);
    const { panel } = shownPlan();
    document.text = document.text.replace('| Online | 42 | 18 |', '| Online | 44 | 18 |');
    const before = document.text;
    panel.send({ type: 'insertPlan' });
    await settle();
    assert.equal(document.text, before);
    assert.match(lastNotice(panel), /^The table that was on lines 3–6 has changed since the plan was made.*Plan again, or copy the paragraph/);
  });

  it('offers the smallest detectable effect for a table at the cursor, and shows w and the 2×2 difference from the engine', async () => {
    const document = fakeDocument(fake, '/notes/ski.md', 'markdown', SKI_NOTES);
    fake.setActiveEditor(fakeEditor(document, 4));
    choose(/^Smallest effect this table could detect/);
    answers = ['0.05', '0.8'];
    assert.equal(await run(), true);
    assert.equal(picked[0].length, 4, 'the sensitivity choice is offered in a table');
    assert.deepEqual(boxes.map((box) => box.prompt.split(' ')[0]), ['Significance', 'Target']);
    const expected = smallestDetectableDifference(60, 60, 42 / 60, 0.05, 0.8);
    assert.ok(expected.ok);
    const { view } = shownPlan();
    assert.equal(view.kind, 'sensitivity');
    assert.equal(fact(view, 'Observations (N)'), '120');
    assert.equal(fact(view, 'Smallest detectable effect (w)'), formatFixed(expected.value.w, 3));
    const difference = fact(view, 'Smallest detectable difference') ?? '';
    assert.ok(difference.includes(formatFixed(expected.value.twoProportions!.lower!, 3)) && difference.includes(formatFixed(expected.value.twoProportions!.higher!, 3)), difference);
    assert.match(difference, /Passed in Front desk/);
    assert.doesNotMatch(JSON.stringify(view), /observed power is|NaN/);
    assert.equal(view.curve.planned.n, 120);
  });

  it('does not offer the sensitivity choice away from a table, and reuses one panel for the next plan', async () => {
    const document = fakeDocument(fake, '/notes/plan.md', 'markdown', 'Just prose.');
    fake.setActiveEditor(fakeEditor(document, 0));
    choose(/effect size w/);
    answers = ['0.5', '1', '0.05', '0.8', '0.1', '1', '0.05', '0.8'];
    assert.equal(await run(), true);
    assert.equal(picked[0].some((label) => /Smallest effect/.test(label)), false);
    shownPlan();
    assert.equal(await run(), true);
    assert.equal(fake.panels.length, 1);
    const panel = fake.panels[0];
    const last = panel.posted[panel.posted.length - 1];
    assert.ok(isHostToPanel(last) && last.type === 'showPlan');
    const outside = fixture.cases.find((entry) => entry.kind === 'effect-size-n' && entry.input.w === 0.1 && entry.input.df === 1 && entry.input.alpha === 0.05 && entry.input.power === 0.8)!;
    assert.equal(last.view.curve.planned.n, outside.expected);
  });

  it('offers only Copy when no notes are open, and says why', async () => {
    fake.setActiveEditor(undefined);
    choose(/^Two proportions/);
    answers = ['0.1, 0.2', '1:1', '0.05', '0.8'];
    assert.equal(await run(), true);
    const { panel, view } = shownPlan();
    assert.match(view.insertUnavailable ?? '', /No notes were open/);
    panel.send({ type: 'insertPlan' });
    await settle();
    assert.match(lastNotice(panel), /No notes were open/);
  });

  it('ends quietly when a step is dismissed, and reports a cursor outside any table for the table choice', async () => {
    const document = fakeDocument(fake, '/notes/plan.md', 'markdown', 'Just prose.');
    fake.setActiveEditor(fakeEditor(document, 0));
    choose(/^Two proportions/);
    answers = ['0.1, 0.2'];
    assert.equal(await run(), false);
    assert.equal(fake.panels.length, 0);
    choose(/^From the table/);
    assert.equal(await run(), false);
    assert.equal(fake.messages.length, 1);
    assert.equal(fake.messages[0].level, 'warning');
  });
});
