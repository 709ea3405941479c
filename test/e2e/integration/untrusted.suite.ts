import assert from 'node:assert/strict';
import * as vscode from 'vscode';
import { checkTableHere, EXTENSION_ID, openAt, pearsonFromDefinition } from './tallyHelpers';

// Runs in a host started with workspace trust enabled and the folder never trusted (Restricted Mode).
// The manifest declares untrustedWorkspaces: supported, so everything must work there too.

describe('Tallywise in an untrusted workspace', function () {
  it('runs in Restricted Mode: the folder is not trusted and the extension is active', async () => {
    assert.equal(vscode.workspace.isTrusted, false, 'the host was started with workspace trust on and the folder untrusted');
    const extension = vscode.extensions.getExtension(EXTENSION_ID);
    assert.ok(extension, `${EXTENSION_ID} is installed`);
    await extension.activate();
    assert.ok(extension.isActive);
  });

  it('analyses a table and inserts the write-up below it', async () => {
    const editor = await openAt('ski-school-notes.md', 8);
    const before = editor.document.getText();
    const state = await checkTableHere('ski-school-notes.md', 6);
    const expected = pearsonFromDefinition([[88, 9, 6], [71, 18, 9], [95, 7, 4], [64, 21, 20]]);
    assert.equal(state.lastResult?.n, expected.n);
    assert.equal(state.lastResult?.df, expected.df);
    assert.equal(await vscode.commands.executeCommand('tallywise.insertWriteUp'), true);
    const lines = before.split('\n');
    assert.equal(editor.document.getText(), [...lines.slice(0, 12), '', state.lastWriteUp!.trim(), ...lines.slice(12)].join('\n'));
  });
});
