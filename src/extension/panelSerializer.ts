import type * as vscode from 'vscode';
import { PlanPanel } from './planPanel';
import { savedPlanView, savedView } from './savedView';
import type { Tallywise } from './tallywise';

/** Brings results panels back after a reload, from the view the webview saved with setState. */
export class PanelSerializer implements vscode.WebviewPanelSerializer {
  constructor(private readonly tallywise: Tallywise) {}

  async deserializeWebviewPanel(webviewPanel: vscode.WebviewPanel, state: unknown): Promise<void> {
    const plan = savedPlanView(state);
    if (plan) {
      PlanPanel.restore(webviewPanel, this.tallywise, plan);
      return;
    }
    const view = savedView(state);
    if (!view) {
      this.tallywise.log.info('A results panel had no saved view to restore; it was closed.');
      webviewPanel.dispose();
      return;
    }
    this.tallywise.panels.restore(webviewPanel, view);
  }
}
