// Wiring only: the first, small editor entry over the engine. The full panel, CodeLens and
// insertion workflow are built in src/extension as the extension issue lands.
import * as vscode from 'vscode';
import { analyze } from '../core/analyze';
import { resultsReport } from '../core/report/resultsReport';
import { documentFormat } from './documentFormat';

const INSERT_ACTION = 'Insert write-up below the table';

export function activate(context: vscode.ExtensionContext): void {
  const output = vscode.window.createOutputChannel('Tallywise results');
  context.subscriptions.push(output);
  context.subscriptions.push(vscode.commands.registerCommand('tallywise.checkTableHere', async () => {
    const editor = vscode.window.activeTextEditor;
    if (!editor) {
      void vscode.window.showInformationMessage('Tallywise: open a notes file and put the cursor in a count table first.');
      return;
    }
    const document = editor.document;
    const versionAtAnalysis = document.version;
    const selection = editor.selection;
    const result = analyze({
      text: document.getText(),
      format: documentFormat(document.languageId, document.fileName),
      line: selection.active.line + 1,
      selection: selection.isEmpty ? undefined : { startLine: selection.start.line + 1, endLine: selection.end.line + 1 },
    });
    if (!result.ok) {
      void vscode.window.showWarningMessage(`Tallywise: ${result.issue.message}`);
      return;
    }
    const analysis = result.value;
    output.clear();
    output.appendLine(resultsReport(analysis));
    output.show(true);
    const choice = await vscode.window.showInformationMessage('Tallywise: results are in the output panel.', INSERT_ACTION);
    if (choice !== INSERT_ACTION) return;
    if (document.version !== versionAtAnalysis) {
      void vscode.window.showWarningMessage('Tallywise: the document changed since the analysis; run the command again before inserting.');
      return;
    }
    const afterTable = new vscode.Position(Math.min(analysis.table.endLine, document.lineCount), 0);
    await editor.edit((edit) => edit.insert(afterTable, `\n${analysis.writeUp}\n`));
  }));
}

export function deactivate(): void {
  // Nothing to release beyond context.subscriptions.
}
