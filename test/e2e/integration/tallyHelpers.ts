import assert from 'node:assert/strict';
import * as vscode from 'vscode';

// Helpers for the suites that run inside the real extension host.

export const EXTENSION_ID = 'tallywise.tallywise';
export const WAIT_MS = 15_000;

/** What `tallywise.test.panelState` returns (the fields the suites read). */
export interface PanelState {
  panel: { key: string; view: { summary: string; title: string; writeUp: string; merge?: { description: string }; tables: { observed: unknown } }; hasAnalysis: boolean } | undefined;
  lastSnapshot: { uri: string; startLine: number; endLine: number; format: string; crossTabulated: boolean } | undefined;
  lastWriteUp: string | undefined;
  lastP: number | undefined;
  lastExactMethod: string | undefined;
  lastResult: { test: string; n: number; df: number; statistic: number } | undefined;
}

export async function until(condition: () => boolean | Promise<boolean>, what: string, timeoutMs = WAIT_MS): Promise<void> {
  const stopAt = Date.now() + timeoutMs;
  while (!(await condition())) {
    if (Date.now() > stopAt) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

export function workspaceFile(name: string): vscode.Uri {
  const folder = vscode.workspace.workspaceFolders?.[0];
  assert.ok(folder, 'the test host was opened on a folder');
  return vscode.Uri.joinPath(folder.uri, name);
}

/** Opens a workspace file in the first column with the cursor on a 1-based line. */
export async function openAt(name: string, line: number): Promise<vscode.TextEditor> {
  const document = await vscode.workspace.openTextDocument(workspaceFile(name));
  const editor = await vscode.window.showTextDocument(document, { viewColumn: vscode.ViewColumn.One, preview: false });
  const position = new vscode.Position(line - 1, 0);
  editor.selection = new vscode.Selection(position, position);
  return editor;
}

export async function panelState(): Promise<PanelState> {
  return (await vscode.commands.executeCommand('tallywise.test.panelState')) as PanelState;
}

/**
 * Runs "Check the count table here" at the editor's cursor (the command resolves once the panel shows the
 * analysis) and returns the state, checking it describes the table starting on `tableStartLine` of `name`.
 */
export async function checkTableHere(name: string, tableStartLine: number): Promise<PanelState> {
  await vscode.commands.executeCommand('tallywise.checkTableHere');
  const state = await panelState();
  assert.ok(state.lastResult && state.lastSnapshot, 'an analysis was recorded');
  assert.equal(state.lastSnapshot.uri, workspaceFile(name).toString(), 'the analysis is of the file under the cursor');
  assert.equal(state.lastSnapshot.startLine, tableStartLine, 'the analysis is of the table under the cursor');
  return state;
}

/**
 * Pearson's X² = Σ (O − E)² / E with E = row total × column total / N for a table, or E = N / k for one
 * row of k counts tested against equal shares (the definition; Pearson 1900).
 */
export function pearsonFromDefinition(observed: number[][]): { n: number; df: number; statistic: number } {
  const n = observed.flat().reduce((sum, count) => sum + count, 0);
  if (observed.length === 1) {
    const row = observed[0];
    const expected = n / row.length;
    return { n, df: row.length - 1, statistic: row.reduce((sum, count) => sum + (count - expected) ** 2 / expected, 0) };
  }
  const rowTotals = observed.map((row) => row.reduce((sum, count) => sum + count, 0));
  const columnTotals = observed[0].map((_, column) => observed.reduce((sum, row) => sum + row[column], 0));
  let statistic = 0;
  observed.forEach((row, r) => row.forEach((count, c) => {
    const expected = (rowTotals[r] * columnTotals[c]) / n;
    statistic += (count - expected) ** 2 / expected;
  }));
  return { n, df: (observed.length - 1) * (observed[0].length - 1), statistic };
}

/** |actual − expected| ≤ tolerance × |expected|, with the numbers in the message. */
export function assertRelativelyClose(actual: number, expected: number, tolerance: number, what: string): void {
  const difference = Math.abs(actual - expected);
  assert.ok(difference <= tolerance * Math.abs(expected), `${what}: actual ${actual}, expected ${expected}, difference ${difference}, relative tolerance ${tolerance}`);
}
