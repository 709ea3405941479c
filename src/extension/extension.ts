// Wiring only: services, the command list, the CodeLens and the panel serializer.
import * as vscode from 'vscode';
import type { Command } from './command';
import { RESULTS_VIEW_TYPE } from './commandIds';
import { CheckTableAsCommand } from './commands/checkTableAsCommand';
import { CheckTableHereCommand } from './commands/checkTableHereCommand';
import { CopyResultsCommand } from './commands/copyResultsCommand';
import { InsertWriteUpCommand } from './commands/insertWriteUpCommand';
import { PanelStateCommand } from './commands/panelStateCommand';
import { PlanStudyCommand } from './commands/planStudyCommand';
import { TestFitCommand } from './commands/testFitCommand';
import { PanelSerializer } from './panelSerializer';
import { SETTING } from './settings';
import { Tallywise } from './tallywise';
import { TableCodeLens } from './tableCodeLens';

export function activate(context: vscode.ExtensionContext): void {
  const tallywise = new Tallywise(context);
  context.subscriptions.push(tallywise);
  const commands: Command[] = [
    new CheckTableHereCommand(tallywise),
    new CheckTableAsCommand(tallywise),
    new TestFitCommand(tallywise),
    new InsertWriteUpCommand(tallywise),
    new CopyResultsCommand(tallywise),
    new PanelStateCommand(tallywise),
    new PlanStudyCommand(tallywise),
  ];
  for (const command of commands) {
    context.subscriptions.push(vscode.commands.registerCommand(command.id, (...args: unknown[]) => command.execute(...args)));
  }
  const lens = new TableCodeLens(() => vscode.workspace.getConfiguration('tallywise').get(SETTING.codeLensEnabled) !== false);
  context.subscriptions.push(lens, vscode.languages.registerCodeLensProvider({ language: 'markdown' }, lens));
  context.subscriptions.push(vscode.window.registerWebviewPanelSerializer(RESULTS_VIEW_TYPE, new PanelSerializer(tallywise)));
}

export function deactivate(): void {
  // Everything is released through context.subscriptions.
}
