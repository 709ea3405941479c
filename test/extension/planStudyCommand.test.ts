import assert from 'node:assert/strict';
import * as path from 'node:path';
import { planParagraphInsertion } from '../../src/extension/planParagraphInsertion';
import { fakeDocument, fakeEditor, fakeExtensionContext, installFakeVscode, type FakeVscode } from './fakeVscode';

const root = path.resolve(__dirname, '..', '..', '..');

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

interface FakeWindow { showInformationMessage: (text: string, ...items: string[]) => Promise<string | undefined> }
interface FakeWorkspace { applyEdit: (edit: unknown) => Promise<boolean> }

describe('planStudyCommand', () => {
  let fake: FakeVscode;
  let context: ReturnType<typeof fakeExtensionContext>;
  let offered: string[][];
  let edits: number;
  const run = (...args: unknown[]) => fake.commands.get('tallywise.planStudy')!(...args) as Promise<boolean>;

  beforeEach(() => {
    fake = installFakeVscode();
    const extensionFile = require.resolve('../../src/extension/extension');
    const extensionFolder = path.dirname(extensionFile) + path.sep;
    for (const file of Object.keys(require.cache)) if (file.startsWith(extensionFolder)) delete require.cache[file];
    // eslint-disable-next-line @typescript-eslint/no-require-imports -- loaded after the fake 'vscode' is in place.
    const vscode = require('vscode') as { window: FakeWindow; workspace: FakeWorkspace };
    offered = [];
    edits = 0;
    const applyEdit = vscode.workspace.applyEdit;
    vscode.workspace.applyEdit = (edit) => { edits += 1; return applyEdit(edit); };
    vscode.window.showInformationMessage = (text, ...items) => {
      fake.messages.push({ level: 'info', text });
      offered.push(items);
      return Promise.resolve(items.find((item) => item === 'Insert the paragraph'));
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

  /** Answers successive input boxes in order. */
  function answerInputs(answers: string[]): void {
    const queue = [...answers];
    Object.defineProperty(fake.answers, 'inputBox', { get: () => queue.shift(), configurable: true });
  }

  it('plans from two proportions, validating each box, and inserts the paragraph below the cursor in one edit', async () => {
    const document = fakeDocument(fake, '/notes/plan.md', 'markdown', 'Planning notes\n\nMore text.');
    fake.setActiveEditor(fakeEditor(document, 0));
    fake.answers.quickPick = (items) => items[2];
    // Verdicts are recorded for the last box opened: the target power.
    fake.probeInputs = ['0.8', '1', '0.01', 'many'];
    answerInputs(['0.04, 0.08', '0.8']);
    assert.equal(await run(), true);
    assert.equal(fake.inputVerdicts[0], undefined);
    assert.match(fake.inputVerdicts[1] as string, /power must be between 0 and 1/);
    assert.match(fake.inputVerdicts[2] as string, /must be above the significance level/);
    assert.equal(typeof fake.inputVerdicts[3], 'string');
    assert.equal(edits, 1);
    assert.match(fake.messages[0].text, /^Tallywise: plan N = 1108 \(554, 554 per group\)/);
    assert.deepEqual(offered[0], ['Insert the paragraph', 'Copy the paragraph']);
    const lines = document.text.split('\n');
    assert.equal(lines[0], 'Planning notes');
    assert.equal(lines[1], '');
    assert.match(lines[2], /^Assumptions: Group 1 has outcome proportions 0\.04, 0\.96\./);
    assert.equal(lines[3], '');
    assert.equal(lines[4], 'More text.');
    assert.equal(lines.length, 5);
  });

  it('rejects bad answers in the input boxes with the core messages', async () => {
    const document = fakeDocument(fake, '/notes/plan.md', 'markdown', 'Notes');
    fake.setActiveEditor(fakeEditor(document, 0));
    fake.answers.quickPick = (items) => items[1];
    fake.probeInputs = ['0.3', '0', '-2', 'abc', ''];
    answerInputs([]);
    assert.equal(await run(), false, 'dismissing the first box ends the command');
    assert.equal(fake.inputVerdicts[0], undefined);
    for (const verdict of fake.inputVerdicts.slice(1)) assert.equal(typeof verdict, 'string');
    assert.match(fake.inputVerdicts[1] as string, /effect size w must be a positive number/);
    assert.equal(edits, 0);
  });

  it('plans from the table at the cursor and inserts below the table, not inside it', async () => {
    const document = fakeDocument(fake, '/notes/ski.md', 'markdown', SKI_NOTES);
    fake.setActiveEditor(fakeEditor(document, 4));
    fake.answers.quickPick = (items) => items[0];
    answerInputs(['0.9']);
    assert.equal(await run(), true);
    const lines = document.text.split('\n');
    assert.equal(lines[5], '| Front desk | 30 | 30 |');
    assert.equal(lines[6], '');
    assert.match(lines[7], /^Assumptions: Group 1 has outcome proportions 0\.7, 0\.3\. Group 2 has outcome proportions 0\.5, 0\.5\./);
    assert.match(lines[7], /90% power/);
    assert.equal(lines[8], '');
    assert.equal(lines[9], 'Next season: plan the comparison.');
    assert.equal(edits, 1);
  });
});

describe('planParagraphInsertion', () => {
  it('keeps one blank line on each side and the document line endings', () => {
    assert.deepEqual(planParagraphInsertion('a\r\nb', 0, 'P'), { line: 1, character: 0, text: '\r\nP\r\n\r\n' });
    assert.deepEqual(planParagraphInsertion('a\n\nb', 0, 'P'), { line: 1, character: 0, text: '\nP\n' });
    assert.deepEqual(planParagraphInsertion('a', 0, 'P'), { line: 0, character: 1, text: '\n\nP\n' });
  });
});
