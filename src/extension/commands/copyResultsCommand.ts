import * as vscode from 'vscode';
import type { Command } from '../command';
import { COMMAND_ID } from '../commandIds';
import { loadEngine } from '../loadEngine';
import type { Tallywise } from '../tallywise';

/** Copies the whole result (statistics, tables, notes, write-up) as Markdown. */
export class CopyResultsCommand implements Command {
  readonly id = COMMAND_ID.copyResults;

  constructor(private readonly tallywise: Tallywise) {}

  async execute(): Promise<string | undefined> {
    const record = this.tallywise.panels.active()?.record ?? this.tallywise.lastRecord;
    if (!record) {
      void vscode.window.showInformationMessage(vscode.l10n.t('Tallywise: there are no results yet. Test a table first ("Tallywise: Check the count table here").'));
      return undefined;
    }
    const engine = loadEngine();
    const report = engine.resultsReport(engine.withMarkup(record.analysis, 'markdown'));
    await vscode.env.clipboard.writeText(report);
    void vscode.window.showInformationMessage(vscode.l10n.t('Tallywise: the results are on the clipboard as Markdown.'));
    return report;
  }
}
