import * as vscode from 'vscode';
import { COMMAND_ID } from './commandIds';
import { countTablesForLens } from './countTablesForLens';
import { Disposable } from './dispose';
import { SETTING } from './settings';

/** "Test this table" above each Markdown table of counts; off with tallywise.codeLens.enabled. */
export class TableCodeLens extends Disposable implements vscode.CodeLensProvider {
  private readonly changed = this._register(new vscode.EventEmitter<void>());
  readonly onDidChangeCodeLenses = this.changed.event;

  constructor(private readonly isEnabled: () => boolean) {
    super();
    this._register(vscode.workspace.onDidChangeConfiguration((event) => {
      if (event.affectsConfiguration(`tallywise.${SETTING.codeLensEnabled}`)) this.changed.fire();
    }));
  }

  provideCodeLenses(document: vscode.TextDocument): vscode.CodeLens[] {
    if (!this.isEnabled()) return [];
    return countTablesForLens(document.getText()).map((table) => {
      const line = table.startLine - 1;
      return new vscode.CodeLens(new vscode.Range(line, 0, line, 0), {
        title: vscode.l10n.t('Test this table'),
        tooltip: vscode.l10n.t('Tallywise: test the counts in this table and show the results'),
        command: COMMAND_ID.checkTableHere,
        arguments: [document.uri, line],
      });
    });
  }
}
