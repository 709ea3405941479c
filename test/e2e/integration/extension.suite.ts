import assert from 'node:assert/strict';
import * as fs from 'node:fs';
import { parse } from 'csv-parse/sync';
import { jStat } from 'jstat';
import * as vscode from 'vscode';
import {
  assertRelativelyClose, checkTableHere, EXTENSION_ID, openAt, panelState, pearsonFromDefinition, until, workspaceFile,
} from './tallyHelpers';

// Runs inside the real VS Code extension host with the packaged extension and the bundled examples in the
// workspace. Expected n, df and X² are computed here from the definition on the counts copied from the
// example files (the data is the input, the numbers are worked out independently); p is checked against
// jStat's chi-square distribution (reference library run live).

/** jStat's cdf is accurate to about 1e-10 absolute here; p values in the examples are above 1e-8. */
const P_TOLERANCE = 1e-5;
/** X² is a short sum of doubles. */
const STATISTIC_TOLERANCE = 1e-9;

interface ExampleTable {
  file: string;
  /** 1-based cursor line and the table's first line (its header). */
  cursorLine: number;
  tableStartLine: number;
  test: 'independence' | 'goodness-of-fit';
  observed: number[][];
  /** Cochran's rule fails: an exact p leads and a merge is proposed. */
  sparse?: boolean;
}

const EXAMPLES: ExampleTable[] = [
  { file: 'ski-school-notes.md', cursorLine: 8, tableStartLine: 6, test: 'independence', observed: [[88, 9, 6], [71, 18, 9], [95, 7, 4], [64, 21, 20]] },
  { file: 'ski-school-notes.md', cursorLine: 18, tableStartLine: 16, test: 'independence', observed: [[23, 87], [41, 79]] },
  { file: 'ski-school-notes.md', cursorLine: 25, tableStartLine: 23, test: 'goodness-of-fit', observed: [[38, 41, 35, 52, 67]] },
  { file: 'greenhouse-blooms.md', cursorLine: 7, tableStartLine: 5, test: 'independence', observed: [[9, 5, 2, 1], [3, 4, 6, 5], [11, 3, 1, 0]], sparse: true },
  { file: 'greenhouse-blooms.md', cursorLine: 16, tableStartLine: 14, test: 'goodness-of-fit', observed: [[52, 109, 47]] },
  { file: 'bakery-orders.txt', cursorLine: 5, tableStartLine: 4, test: 'independence', observed: [[34, 51, 22], [58, 47, 19], [112, 63, 15]] },
];

function checkAgainstDefinition(state: Awaited<ReturnType<typeof panelState>>, example: Pick<ExampleTable, 'test' | 'observed' | 'sparse'>): void {
  const expected = pearsonFromDefinition(example.observed);
  const result = state.lastResult!;
  assert.equal(result.test, example.test);
  assert.equal(result.n, expected.n, 'n is the sum of the counts');
  assert.equal(result.df, expected.df, 'df is (r−1)(c−1), or k−1 for one row');
  assertRelativelyClose(result.statistic, expected.statistic, STATISTIC_TOLERANCE, 'Pearson X²');
  assert.ok(state.panel, 'the results panel is open');
  assert.match(state.panel.view.summary, new RegExp(`χ²\\(${expected.df}, N = ${expected.n}\\)`), 'the panel summary states df and N');
  if (example.sparse) {
    assert.ok(state.lastExactMethod, 'an exact or Monte Carlo p leads when Cochran\'s rule fails');
    assert.ok(state.panel.view.merge, 'a merge is proposed when Cochran\'s rule fails');
  } else {
    assertRelativelyClose(state.lastP!, 1 - jStat.chisquare.cdf(expected.statistic, expected.df), P_TOLERANCE, 'p against jStat');
  }
}

/** The document's lines with `inserted` placed after 1-based line `afterLine`. */
function withLinesAfter(text: string, afterLine: number, inserted: string[]): string {
  const lines = text.split('\n');
  return [...lines.slice(0, afterLine), ...inserted, ...lines.slice(afterLine)].join('\n');
}

async function revert(editor: vscode.TextEditor): Promise<void> {
  await vscode.window.showTextDocument(editor.document, { viewColumn: vscode.ViewColumn.One, preserveFocus: false });
  await vscode.commands.executeCommand('workbench.action.files.revert');
  await until(() => !editor.document.isDirty, 'revert to drop the test\'s edits');
}

describe('Tallywise in the real extension host', function () {
  it('is installed, activates, and registers every command its manifest contributes', async () => {
    const extension = vscode.extensions.getExtension(EXTENSION_ID);
    assert.ok(extension, `${EXTENSION_ID} is installed`);
    await extension.activate();
    assert.ok(extension.isActive);
    const contributed = (extension.packageJSON as { contributes: { commands: { command: string }[] } }).contributes.commands.map((entry) => entry.command);
    assert.ok(contributed.length >= 5);
    const registered = new Set(await vscode.commands.getCommands(true));
    for (const id of contributed) assert.ok(registered.has(id), `command ${id} is registered`);
  });

  for (const example of EXAMPLES) {
    it(`analyses ${example.file} at line ${example.cursorLine}: ${example.test}, n and df as the counts give`, async () => {
      await openAt(example.file, example.cursorLine);
      const state = await checkTableHere(example.file, example.tableStartLine);
      checkAgainstDefinition(state, example);
    });
  }

  it('cross-tabulates the raw bus-depot CSV after the column choice (first pair: depot × engine_type)', async () => {
    await openAt('bus-depot-breakdowns.csv', 1);
    let finished = false;
    const running = Promise.resolve(vscode.commands.executeCommand('tallywise.checkTableHere')).finally(() => {
      finished = true;
    });
    // The command waits in a quick pick; accept its first item as soon as it is open.
    await until(async () => {
      if (!finished) await vscode.commands.executeCommand('workbench.action.acceptSelectedQuickOpenItem');
      return finished;
    }, 'the column quick pick to be answered and the analysis to finish');
    await running;
    const state = await panelState();
    assert.ok(state.lastSnapshot?.crossTabulated, 'the table was cross-tabulated from the observations');
    assert.ok(state.panel?.key.endsWith(':depot×engine_type'), `panel key ${state.panel?.key}`);
    const rows = parse(fs.readFileSync(workspaceFile('bus-depot-breakdowns.csv').fsPath, 'utf8'), { columns: true }) as Record<string, string>[];
    const depots = [...new Set(rows.map((row) => row.depot))];
    const engines = [...new Set(rows.map((row) => row.engine_type))];
    const observed = depots.map((depot) => engines.map((engine) => rows.filter((row) => row.depot === depot && row.engine_type === engine).length));
    checkAgainstDefinition(state, { test: 'independence', observed });
  });

  it('inserts exactly the write-up paragraph after the table, and one undo removes it', async () => {
    const editor = await openAt('ski-school-notes.md', 9);
    const before = editor.document.getText();
    const state = await checkTableHere('ski-school-notes.md', 6);
    assert.equal(await vscode.commands.executeCommand('tallywise.insertWriteUp'), true);
    // Line 12 ends the table and line 13 is blank: a blank line, the paragraph, then the existing blank line.
    assert.equal(editor.document.getText(), withLinesAfter(before, 12, ['', state.lastWriteUp!.trim()]));
    await vscode.window.showTextDocument(editor.document, { viewColumn: vscode.ViewColumn.One, preserveFocus: false });
    await vscode.commands.executeCommand('undo');
    await until(() => editor.document.getText() === before, 'undo to restore the text as it was before the insertion');
    assert.equal(editor.document.isDirty, false, 'after undo the document is back at its saved state');
  });

  it('follows a table that moved between the analysis and the insertion', async () => {
    const editor = await openAt('ski-school-notes.md', 18);
    const state = await checkTableHere('ski-school-notes.md', 16);
    assert.ok(await editor.edit((edit) => edit.insert(new vscode.Position(0, 0), 'Added later.\n\n')));
    const moved = editor.document.getText();
    assert.equal(await vscode.commands.executeCommand('tallywise.insertWriteUp'), true);
    // The helmet table ended on line 19; two lines were added above it.
    assert.equal(editor.document.getText(), withLinesAfter(moved, 21, ['', state.lastWriteUp!.trim()]));
    await revert(editor);
  });

  it('refuses to insert when the analysed table changed, and changes nothing', async () => {
    const editor = await openAt('ski-school-notes.md', 18);
    await checkTableHere('ski-school-notes.md', 16);
    const cell = editor.document.lineAt(17).text.indexOf('23');
    assert.ok(cell > 0);
    assert.ok(await editor.edit((edit) => edit.replace(new vscode.Range(17, cell, 17, cell + 2), '24')));
    const changed = editor.document.getText();
    assert.equal(await vscode.commands.executeCommand('tallywise.insertWriteUp'), false);
    assert.equal(editor.document.getText(), changed);
    await revert(editor);
  });

  it('leaves the last analysis alone when the cursor is not in a table', async () => {
    const previous = await panelState();
    await openAt('ski-school-notes.md', 1);
    await vscode.commands.executeCommand('tallywise.checkTableHere');
    const state = await panelState();
    assert.deepEqual(state.lastSnapshot, previous.lastSnapshot);
  });
});
