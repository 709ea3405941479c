import * as vscode from 'vscode';
import type { Command } from '../command';
import { COMMAND_ID } from '../commandIds';
import type { Tallywise } from '../tallywise';

/** Tests the table at the cursor or selection (or the line a CodeLens gives) and shows the results panel. */
export class CheckTableHereCommand implements Command {
  readonly id = COMMAND_ID.checkTableHere;

  constructor(private readonly tallywise: Tallywise) {}

  async execute(...args: unknown[]): Promise<void> {
    const target = await this.tallywise.targetOrHint(args, vscode.l10n.t('Tallywise: open a notes or CSV file and put the cursor in a table of counts first.'));
    if (!target) return;
    await this.tallywise.analyzeTarget(target);
  }
}
