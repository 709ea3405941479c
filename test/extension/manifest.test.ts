import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import * as path from 'node:path';
import { COMMAND_ID, RESULTS_VIEW_TYPE } from '../../src/extension/commandIds';
import { SETTING } from '../../src/extension/settings';
import { fakeExtensionContext, installFakeVscode } from './fakeVscode';

const root = path.resolve(__dirname, '..', '..', '..');
// eslint-disable-next-line @typescript-eslint/no-require-imports -- the manifest is JSON read at test time.
const manifest = require(path.join(root, 'package.json')) as {
  activationEvents: string[];
  main: string;
  capabilities: { untrustedWorkspaces: { supported: boolean }; virtualWorkspaces: boolean };
  contributes: {
    commands: { command: string; title: string; category: string }[];
    menus: Record<string, { command: string; when?: string }[]>;
    configuration: { properties: Record<string, { markdownDescription?: string; description?: string }> };
  };
};

describe('manifest', () => {
  it('contributes exactly the commands the extension defines', () => {
    const contributed = manifest.contributes.commands.map((command) => command.command).sort();
    assert.deepEqual(contributed, Object.values(COMMAND_ID).sort());
  });

  it('puts every contributed command in the Tallywise category', () => {
    for (const command of manifest.contributes.commands) assert.equal(command.category, 'Tallywise', command.command);
  });

  it('activates on specific events only, never "*", including every command and the panel', () => {
    assert.ok(!manifest.activationEvents.includes('*'));
    assert.ok(manifest.activationEvents.every((event) => /^(onLanguage|onCommand|onWebviewPanel):/.test(event)), manifest.activationEvents.join(', '));
    for (const id of Object.values(COMMAND_ID)) assert.ok(manifest.activationEvents.includes(`onCommand:${id}`), id);
    assert.ok(manifest.activationEvents.includes(`onWebviewPanel:${RESULTS_VIEW_TYPE}`));
    assert.ok(manifest.activationEvents.includes('onLanguage:markdown') && manifest.activationEvents.includes('onLanguage:csv'));
  });

  it('hides the test hook from the command palette', () => {
    const entry = manifest.contributes.menus.commandPalette.find((item) => item.command === COMMAND_ID.panelState);
    assert.equal(entry?.when, 'false');
  });

  it('offers the table commands in the editor context menu for Markdown, CSV, TSV and plain text', () => {
    const entries = manifest.contributes.menus['editor/context'];
    for (const id of [COMMAND_ID.checkTableHere, COMMAND_ID.testFit]) {
      const when = entries.find((item) => item.command === id)?.when ?? '';
      for (const condition of ['editorLangId == markdown', 'editorLangId == csv', 'editorLangId == tsv', 'editorLangId == plaintext', 'resourceExtname == .csv', 'resourceExtname == .tsv']) {
        assert.ok(when.includes(condition), `${id}: ${condition}`);
      }
    }
  });

  it('declares a described setting for every key settings.ts reads, and no other', () => {
    const properties = manifest.contributes.configuration.properties;
    assert.deepEqual(Object.keys(properties).sort(), Object.values(SETTING).map((key) => `tallywise.${key}`).sort());
    for (const [key, property] of Object.entries(properties)) assert.ok((property.markdownDescription ?? property.description ?? '').length > 20, key);
  });

  it('works in untrusted and virtual workspaces', () => {
    assert.equal(manifest.capabilities.untrustedWorkspaces.supported, true);
    assert.equal(manifest.capabilities.virtualWorkspaces, true);
  });

  it('registers every contributed command, the Markdown CodeLens and the panel serializer on activation', () => {
    const fake = installFakeVscode();
    try {
      const extensionFile = require.resolve('../../src/extension/extension');
      const extensionFolder = path.dirname(extensionFile) + path.sep;
      for (const file of Object.keys(require.cache)) if (file.startsWith(extensionFolder)) delete require.cache[file];
      // eslint-disable-next-line @typescript-eslint/no-require-imports -- loaded after the fake 'vscode' is in place.
      const extension = require(extensionFile) as { activate(context: unknown): void };
      const context = fakeExtensionContext(root);
      extension.activate(context);
      assert.deepEqual([...fake.registeredCommands].sort(), manifest.contributes.commands.map((command) => command.command).sort());
      assert.deepEqual(fake.codeLensSelectors, [{ language: 'markdown' }]);
      assert.deepEqual(fake.serializers, [RESULTS_VIEW_TYPE]);
      assert.ok(context.subscriptions.length >= manifest.contributes.commands.length + 2);
      for (const subscription of context.subscriptions) subscription.dispose();
    } finally {
      fake.restore();
    }
  });

  it('activates without loading the engine (checked in a fresh Node process)', () => {
    // A fresh process, because other suites in this run have already loaded the engine.
    const script = `
      const { installFakeVscode, fakeExtensionContext } = require(${JSON.stringify(require.resolve('./fakeVscode'))});
      installFakeVscode();
      require(${JSON.stringify(require.resolve('../../src/extension/extension'))}).activate(fakeExtensionContext(${JSON.stringify(root)}));
      const loaded = Object.keys(require.cache).filter((file) => /[\\/]core[\\/](analyze|stats|exact)/.test(file));
      process.stdout.write(JSON.stringify(loaded));`;
    const loaded = JSON.parse(execFileSync(process.execPath, ['-e', script], { encoding: 'utf8' })) as string[];
    assert.deepEqual(loaded, []);
  });
});
