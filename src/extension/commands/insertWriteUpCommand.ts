import * as vscode from 'vscode';
import type { Command } from '../command';
import { COMMAND_ID } from '../commandIds';
import { insertWriteUp } from '../insertWriteUp';
import type { Tallywise } from '../tallywise';

/** Inserts the last analysis's write-up below its table. */
export class InsertWriteUpCommand implements Command {
  readonly id = COMMAND_ID.insertWriteUp;

  constructor(private readonly tallywise: Tallywise) {}

  async execute(): Promise<boolean> {
    const record = this.tallywise.panels.active()?.record ?? this.tallywise.lastRecord;
    if (!record) {
      void vscode.window.showInformationMessage(vscode.l10n.t('Tallywise: there is no write-up yet. Test a table first ("Tallywise: Check the count table here").'));
      return false;
    }
    return insertWriteUp(record, { withExpectedTable: false, withChartLink: false });
  }
}
