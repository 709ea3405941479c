import assert from 'node:assert/strict';
import * as fs from 'node:fs';
import * as path from 'node:path';
import { fakeDocument, fakeEditor, fakeExtensionContext, installFakeVscode, type FakeVscode, type FakeWebviewPanel } from './fakeVscode';

// The extension's commands and panel wiring run against a recording stand-in for VS Code (plain Node; the real
// workbench is exercised by the end-to-end suite). Analyses run in the real worker, dist/analysisWorker.js.
const root = path.resolve(__dirname, '..', '..', '..');
const workerFile = path.join(root, 'dist', 'analysisWorker.js');

// Invented greenhouse notes.
const GREENHOUSE = [
  '# Greenhouse log',
  '',
  '| Bench | Thriving | Wilting | Lost |',
  '|---|---|---|---|',
  '| North | 48 | 12 | 6 |',
  '| South | 31 | 22 | 9 |',
  '| Glass roof | 55 | 8 | 5 |',
  '',
  'Checked on day 21.',
  '',
].join('\n');

// Invented bakery tally, one row (goodness of fit).
const BAKERY = '| Day | Mon | Tue | Wed | Thu | Fri |\n|---|---|---|---|---|---|\n| Returned | 22 | 17 | 25 | 31 | 45 |\n';

// Invented bus depot breakdowns; the Doors column is sparse, so a merge is proposed.
const DEPOT = '| Route | Engine | Doors | Tyres |\n|---|---|---|---|\n| Green | 10 | 1 | 12 |\n| Blue | 9 | 0 | 14 |\n| Black | 11 | 2 | 8 |\n';

async function until(condition: () => boolean, what: string, timeoutMs = 10_000): Promise<void> {
  const stopAt = Date.now() + timeoutMs;
  while (!condition()) {
    if (Date.now() > stopAt) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 5));
  }
}

const shows = (panel: FakeWebviewPanel) => panel.posted.filter((message) => (message as { type: string }).type === 'show') as { view: { key: string; writeUp: string; title: string } }[];

describe('extension workflow', function () {
  let fake: FakeVscode;
  let context: ReturnType<typeof fakeExtensionContext>;
  const run = (id: string, ...args: unknown[]) => fake.commands.get(id)!(...args);

  before(function () {
    if (!fs.existsSync(workerFile)) this.skip();
  });

  beforeEach(() => {
    fake = installFakeVscode();
    const extensionFile = require.resolve('../../src/extension/extension');
    // Each test gets a fresh fake, so the extension's modules are loaded afresh against it.
    const extensionFolder = path.dirname(extensionFile) + path.sep;
    for (const file of Object.keys(require.cache)) if (file.startsWith(extensionFolder)) delete require.cache[file];
    // eslint-disable-next-line @typescript-eslint/no-require-imports -- loaded after the fake 'vscode' is in place.
    const extension = require(extensionFile) as { activate(context: unknown): void };
    context = fakeExtensionContext(root);
    extension.activate(context);
  });

  afterEach(() => {
    for (const subscription of context.subscriptions) subscription.dispose();
    fake.restore();
  });

  it('opens one panel with a nonce-guarded page, answers "ready" with the view, and reuses the panel for the same table', async () => {
    const document = fakeDocument(fake, '/notes/greenhouse.md', 'markdown', GREENHOUSE);
    fake.setActiveEditor(fakeEditor(document, 4));
    await run('tallywise.checkTableHere');
    assert.equal(fake.panels.length, 1);
    const panel = fake.panels[0];
    assert.equal(panel.viewType, 'tallywise.results');
    assert.match(panel.webview.html, /script-src &#39;nonce-[0-9a-f]{32}&#39;/);
    assert.match(panel.webview.html, /data-initial-view=/);
    panel.send({ type: 'ready' });
    assert.equal(shows(panel).length, 1);
    assert.equal(shows(panel)[0].view.key, 'file:/notes/greenhouse.md#3');
    await run('tallywise.checkTableHere', document.uri, 6);
    assert.equal(fake.panels.length, 1, 're-running the same table must update its panel');
    assert.equal(shows(panel).length, 2);
    const html = panel.webview.html;
    panel.send({ type: 'insertWriteUp', withExpectedTable: 'yes' });
    panel.send({ type: 'runCode', code: 'x' });
    await new Promise((resolve) => setTimeout(resolve, 20));
    assert.equal(document.text, GREENHOUSE, 'messages failing the guard change nothing');
    assert.equal(panel.webview.html, html);
  });

  it('inserts the write-up under the table in one edit when the panel asks, and links a saved chart', async () => {
    const document = fakeDocument(fake, '/notes/greenhouse.md', 'markdown', GREENHOUSE);
    fake.setActiveEditor(fakeEditor(document, 4));
    await run('tallywise.checkTableHere');
    const panel = fake.panels[0];
    fake.setActiveEditor(undefined); // the panel has focus
    panel.send({ type: 'saveChart', chart: 'mosaic', svg: '<svg xmlns="http://www.w3.org/2000/svg"><rect width="2" height="2"/></svg>' });
    await until(() => fake.writtenFiles.size === 1, 'the chart file');
    assert.deepEqual([...fake.writtenFiles.keys()], ['file:/notes/greenhouse-3-mosaic.svg']);
    panel.send({ type: 'insertWriteUp', withExpectedTable: true, withChartLink: true });
    await until(() => document.version === 2, 'the insertion');
    const state = (await run('tallywise.test.panelState')) as { lastWriteUp: string; lastSnapshot: { startLine: number; endLine: number } };
    assert.deepEqual([state.lastSnapshot.startLine, state.lastSnapshot.endLine], [3, 7]);
    const lines = document.text.split('\n');
    assert.equal(lines[7], '', 'a blank line after the table');
    assert.equal(lines.slice(8).join('\n').startsWith(state.lastWriteUp.trim()), true);
    assert.match(document.text, /\n\n!\[Mosaic chart of the table\]\(greenhouse-3-mosaic\.svg\)\n\nChecked on day 21\.\n$/);
  });

  it('refuses to insert once the table was edited, and says to re-run', async () => {
    const document = fakeDocument(fake, '/notes/greenhouse.md', 'markdown', GREENHOUSE);
    fake.setActiveEditor(fakeEditor(document, 4));
    await run('tallywise.checkTableHere');
    document.text = document.text.replace('| North | 48 |', '| North | 49 |');
    document.version += 1;
    assert.equal(await run('tallywise.insertWriteUp'), false);
    assert.match(fake.messages.at(-1)!.text, /changed since it was analysed/);
    assert.match(document.text, /\| North \| 49 \|/);
  });

  it('gives the engine\'s message and opens nothing when the cursor is outside every table', async () => {
    const document = fakeDocument(fake, '/notes/greenhouse.md', 'markdown', GREENHOUSE);
    fake.setActiveEditor(fakeEditor(document, 0));
    await run('tallywise.checkTableHere');
    assert.equal(fake.panels.length, 0);
    assert.equal(fake.messages.length, 1);
    assert.equal(fake.messages[0].level, 'warning');
    assert.match(fake.messages[0].text, /^Tallywise: .*table/);
  });

  it('checks the expected pattern as it is typed and tests the row against it', async () => {
    const document = fakeDocument(fake, '/notes/bakery.md', 'markdown', BAKERY);
    fake.setActiveEditor(fakeEditor(document, 2));
    fake.probeInputs = ['1:1', '2:1:1:1:1', ''];
    fake.answers.inputBox = '2:1:1:1:1';
    await run('tallywise.testFit');
    assert.equal(typeof fake.inputVerdicts[0], 'string', 'a two-part ratio for five days is refused');
    assert.equal(fake.inputVerdicts[1], undefined);
    assert.equal(typeof fake.inputVerdicts[2], 'string');
    assert.equal(fake.panels.length, 1);
    const state = (await run('tallywise.test.panelState')) as { lastWriteUp: string };
    assert.match(state.lastWriteUp, /2:1:1:1:1/);
  });

  it('copies the whole result as Markdown', async () => {
    const document = fakeDocument(fake, '/notes/greenhouse.md', 'markdown', GREENHOUSE);
    fake.setActiveEditor(fakeEditor(document, 4));
    await run('tallywise.checkTableHere');
    const report = await run('tallywise.copyResults');
    assert.equal(fake.clipboard.at(-1), report);
    assert.match(String(report), /Write-up:/);
    assert.match(String(report), /\| --- \|/);
  });

  it('re-analyses the merged table in the same panel when the panel asks', async () => {
    const document = fakeDocument(fake, '/notes/depot.md', 'markdown', DEPOT);
    fake.setActiveEditor(fakeEditor(document, 3));
    await run('tallywise.checkTableHere');
    const panel = fake.panels[0];
    panel.send({ type: 'ready' });
    const before = shows(panel).length;
    panel.send({ type: 'applyMerge' });
    await until(() => shows(panel).length > before, 'the merged view');
    assert.equal(fake.panels.length, 1);
    assert.notEqual(shows(panel).at(-1)!.view.writeUp, shows(panel)[0].view.writeUp);
  });

  it('asks which two columns to cross-tabulate in a raw CSV log, and does nothing when dismissed', async () => {
    const lines = ['date,instructor,level'];
    const instructors = ['Ines', 'Tomas', 'Mara'];
    for (let day = 0; day < 40; day++) lines.push(`2026-02-${String((day % 28) + 1).padStart(2, '0')},${instructors[day % 3]},${day % 5 < 2 ? 'novice' : 'expert'}`);
    const document = fakeDocument(fake, '/logs/ski.csv', 'csv', lines.join('\n') + '\n');
    fake.setActiveEditor(fakeEditor(document, 0));
    await run('tallywise.checkTableHere');
    assert.equal(fake.panels.length, 0);
    fake.answers.quickPick = (items) => items[0];
    await run('tallywise.checkTableHere');
    assert.equal(fake.panels.length, 1);
    const state = (await run('tallywise.test.panelState')) as { panel: { key: string }; lastSnapshot: { crossTabulated: boolean } };
    assert.equal(state.panel.key, 'file:/logs/ski.csv#1:instructor×level');
    assert.equal(state.lastSnapshot.crossTabulated, true);
  });

  it('tests a whole CSV file of counts and offers no insertion into it', async () => {
    const document = fakeDocument(fake, '/logs/lifts.csv', 'csv', 'lift,up,down\nA,40,38\nB,35,41\nC,52,30\n');
    fake.setActiveEditor(fakeEditor(document, 0));
    await run('tallywise.checkTableHere');
    assert.equal(fake.panels.length, 1);
    const state = (await run('tallywise.test.panelState')) as { lastSnapshot: { startLine: number; endLine: number; format: string }; lastWriteUp: string };
    assert.deepEqual([state.lastSnapshot.startLine, state.lastSnapshot.endLine, state.lastSnapshot.format], [1, 4, 'delimited']);
    assert.doesNotMatch(state.lastWriteUp, /\*/, 'plain text outside Markdown');
    assert.equal(await run('tallywise.insertWriteUp'), false);
    assert.match(fake.messages.at(-1)!.text, /Copy write-up/);
    assert.equal(document.version, 1);
  });

  it('re-runs the table with a simulated p in the worker when the panel asks', async () => {
    const document = fakeDocument(fake, '/notes/depot.md', 'markdown', DEPOT);
    fake.setActiveEditor(fakeEditor(document, 3));
    await run('tallywise.checkTableHere');
    const panel = fake.panels[0];
    panel.send({ type: 'runExact', method: 'monte-carlo' });
    await until(() => (fake.commands.get('tallywise.test.panelState')!() as { lastExactMethod?: string }).lastExactMethod === 'monte-carlo-patefield', 'the Monte Carlo result');
    assert.equal(fake.panels.length, 1);
    assert.ok(panel.posted.some((message) => (message as { type: string }).type === 'busy'));
  });

  it('restores a panel from its saved view after a reload, and asks for a re-run before acting on it', async () => {
    const document = fakeDocument(fake, '/notes/greenhouse.md', 'markdown', GREENHOUSE);
    fake.setActiveEditor(fakeEditor(document, 4));
    await run('tallywise.checkTableHere');
    const savedView = JSON.parse(decodeInitialView(fake.panels[0].webview.html)) as { key: string };
    assert.equal(savedView.key, 'file:/notes/greenhouse.md#3');
    // A reload: VS Code makes a bare panel and hands it, with the webview's saved state, to the serializer.
    // eslint-disable-next-line @typescript-eslint/no-require-imports -- the fake 'vscode' module, installed for this test.
    const vscodeModule = require('vscode') as { window: { createWebviewPanel(viewType: string, title: string): FakeWebviewPanel } };
    const restored = vscodeModule.window.createWebviewPanel('tallywise.results', 'restored');
    await fake.serializerObjects[0].deserializeWebviewPanel(restored, { view: savedView });
    assert.equal(fake.panels.length, 2);
    assert.match(restored.webview.html, /data-initial-view=/);
    const state = (await run('tallywise.test.panelState')) as { panel: { key: string; hasAnalysis: boolean } };
    assert.deepEqual(state.panel, { ...state.panel, key: 'file:/notes/greenhouse.md#3', hasAnalysis: false });
    restored.send({ type: 'insertWriteUp', withExpectedTable: false, withChartLink: false });
    await until(() => restored.posted.some((message) => (message as { type: string }).type === 'notice'), 'the notice');
    assert.equal(document.text, GREENHOUSE);
    const empty = vscodeModule.window.createWebviewPanel('tallywise.results', 'empty');
    await fake.serializerObjects[0].deserializeWebviewPanel(empty, { something: 'else' });
    assert.equal(empty.disposed, true);
  });
});

describe('extension bundle', () => {
  it('runs a command from dist/extension.js, loading the engine chunk dist/engine.js only then', async function () {
    const bundle = path.join(root, 'dist', 'extension.js');
    const engineChunk = path.join(root, 'dist', 'engine.js');
    if (!fs.existsSync(bundle) || !fs.existsSync(engineChunk) || !fs.existsSync(workerFile)) this.skip();
    const fake = installFakeVscode();
    const context = fakeExtensionContext(root);
    try {
      delete require.cache[bundle];
      delete require.cache[engineChunk];
      // eslint-disable-next-line @typescript-eslint/no-require-imports -- the built bundle, loaded after the fake 'vscode'.
      (require(bundle) as { activate(context: unknown): void }).activate(context);
      assert.equal(require.cache[engineChunk], undefined, 'activation must not load the engine chunk');
      const document = fakeDocument(fake, '/notes/greenhouse.md', 'markdown', GREENHOUSE);
      fake.setActiveEditor(fakeEditor(document, 4));
      await fake.commands.get('tallywise.checkTableHere')!();
      assert.ok(require.cache[engineChunk], 'the command loads the engine chunk');
      assert.equal(fake.panels.length, 1);
      assert.deepEqual(fake.messages, []);
    } finally {
      for (const subscription of context.subscriptions) subscription.dispose();
      fake.restore();
    }
  });
});

function decodeInitialView(html: string): string {
  const match = /data-initial-view="([^"]*)"/.exec(html);
  return (match?.[1] ?? '{}').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&');
}
