import * as vscode from 'vscode';
import { isPanelToHost } from '../protocol/messages';
import type { PlanView } from '../protocol/planView';
import { RESULTS_VIEW_TYPE } from './commandIds';
import { Disposable } from './dispose';
import { loadPanelPage, panelOptions } from './resultsPanel';
import type { Tallywise } from './tallywise';

/** What the plan view's buttons do; each returns the notice the panel shows afterwards. */
export interface PlanActions {
  insert(): Promise<string>;
  copy(): Promise<string>;
}

/**
 * The results panel showing a study plan. There is one at a time: the next plan updates it. It is
 * the same page and bundle as the analysis panel; the view arrives as a `showPlan` message.
 */
export class PlanPanel extends Disposable {
  private constructor(
    readonly webviewPanel: vscode.WebviewPanel,
    private readonly tallywise: Tallywise,
    private view: PlanView,
    private actions: PlanActions,
  ) {
    super();
    this._register(webviewPanel.onDidDispose(() => this.dispose()));
    this._register(webviewPanel);
    loadPanelPage(webviewPanel, tallywise.context.extensionUri, view.title);
    this._register(webviewPanel.webview.onDidReceiveMessage((message: unknown) => this.receive(message)));
  }

  /** Takes over a plan panel VS Code restored after a reload; insertion needs the plan command again (its document anchor is gone). */
  static restore(webviewPanel: vscode.WebviewPanel, tallywise: Tallywise, view: PlanView): PlanPanel {
    const unavailable = vscode.l10n.t('After a reload the paragraph can be copied; run the plan command again to insert it.');
    const restoredView: PlanView = { ...view, insertUnavailable: view.insertUnavailable ?? unavailable };
    return new PlanPanel(webviewPanel, tallywise, restoredView, {
      insert: () => Promise.resolve(unavailable),
      copy: async () => {
        await vscode.env.clipboard.writeText(view.paragraph);
        return vscode.l10n.t('The planning paragraph is on the clipboard.');
      },
    });
  }

  /** Opens a plan panel beside the editor. */
  static open(tallywise: Tallywise, view: PlanView, actions: PlanActions): PlanPanel {
    const webviewPanel = vscode.window.createWebviewPanel(
      RESULTS_VIEW_TYPE,
      view.title,
      { viewColumn: vscode.ViewColumn.Beside, preserveFocus: true },
      panelOptions(tallywise.context.extensionUri),
    );
    return new PlanPanel(webviewPanel, tallywise, view, actions);
  }

  get closed(): boolean {
    return this.isDisposed;
  }

  /** Shows another plan in this panel. */
  update(view: PlanView, actions: PlanActions): void {
    this.view = view;
    this.actions = actions;
    this.webviewPanel.title = view.title;
    this.post({ type: 'showPlan', view });
    this.webviewPanel.reveal(undefined, true);
  }

  private post(message: { type: 'showPlan'; view: PlanView } | { type: 'notice'; message: string }): void {
    if (!this.isDisposed) void this.webviewPanel.webview.postMessage(message);
  }

  private receive(message: unknown): void {
    if (!isPanelToHost(message) || (message.type !== 'ready' && message.type !== 'insertPlan' && message.type !== 'copyPlan')) {
      this.tallywise.log.warn('Ignored a message the plan panel should not send.');
      return;
    }
    if (message.type === 'ready') {
      this.post({ type: 'showPlan', view: this.view });
      return;
    }
    const action = message.type === 'insertPlan' ? this.actions.insert : this.actions.copy;
    void action.call(this.actions).then(
      (notice) => this.post({ type: 'notice', message: notice }),
      (error: unknown) => {
        const text = error instanceof Error ? error.message : String(error);
        this.tallywise.log.error(`Plan panel action ${message.type} failed: ${text}`);
        this.post({ type: 'notice', message: vscode.l10n.t('That did not work ({0}); nothing was changed.', text) });
      },
    );
  }
}
