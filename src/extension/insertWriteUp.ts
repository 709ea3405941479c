import * as vscode from 'vscode';
import type { AnalysisRecord } from './analysisRecord';
import { composeInsertion, type InsertionChoices } from './composeInsertion';
import { planInsertion } from './planInsertion';

/**
 * Inserts a record's write-up under its table, in one edit (one undo removes it). Where it goes is
 * decided by `planInsertion` from the document as it is now; a moved table is followed, a changed one
 * refused with a message.
 *
 * @returns true when the document was changed
 */
export async function insertWriteUp(record: AnalysisRecord, choices: InsertionChoices): Promise<boolean> {
  const uri = vscode.Uri.parse(record.snapshot.uri);
  const document = await vscode.workspace.openTextDocument(uri);
  const content = composeInsertion(record.analysis, record.charts, choices);
  const plan = planInsertion(document.getText(), record.snapshot, content.text);
  if (!plan.ok) {
    void vscode.window.showWarningMessage(`Tallywise: ${plan.message}`);
    return false;
  }
  const edit = new vscode.WorkspaceEdit();
  edit.insert(uri, new vscode.Position(plan.line, plan.character), plan.text);
  if (!(await vscode.workspace.applyEdit(edit))) {
    void vscode.window.showWarningMessage(vscode.l10n.t('Tallywise: the editor did not accept the insertion; nothing was changed.'));
    return false;
  }
  if (plan.relocated) {
    const length = record.snapshot.endLine - record.snapshot.startLine;
    record.snapshot.endLine = plan.tableEndLine;
    record.snapshot.startLine = plan.tableEndLine - length;
  }
  record.snapshot.version = document.version;
  const note = content.missingChart ? vscode.l10n.t(' No chart is saved yet, so no chart link was added: save a chart from the panel first.') : '';
  void vscode.window.showInformationMessage(vscode.l10n.t('Tallywise: inserted the write-up below the table (line {0}).', plan.tableEndLine) + note);
  return true;
}
