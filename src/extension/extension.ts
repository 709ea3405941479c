// Wiring only: the first, small editor entry over the engine. The full panel, CodeLens and
// insertion workflow are built in src/extension as the extension issue lands.
import * as vscode from 'vscode';
import { resultsReport } from '../core/report/resultsReport';
import { documentFormat } from './documentFormat';
import { runAnalysisInWorker } from './runAnalysisInWorker';

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
    const request = {
      text: document.getText(),
      format: documentFormat(document.languageId, document.fileName),
      line: selection.active.line + 1,
      selection: selection.isEmpty ? undefined : { startLine: selection.start.line + 1, endLine: selection.end.line + 1 },
    };
    // Exact searches can take seconds: they run in a worker thread, with progress and a Cancel button.
    const result = await vscode.window.withProgress(
      { location: vscode.ProgressLocation.Notification, title: 'Tallywise: testing the table', cancellable: true },
      (progress, token) => {
        const controller = new AbortController();
        token.onCancellationRequested(() => controller.abort());
        let reported = 0;
        return runAnalysisInWorker(context.asAbsolutePath('dist/analysisWorker.js'), request, {
          signal: controller.signal,
          onProgress: (fraction) => {
            const percent = Math.round(fraction * 100);
            if (percent > reported) progress.report({ increment: percent - reported, message: `${percent}%` });
            reported = Math.max(reported, percent);
          },
        });
      },
    );
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
