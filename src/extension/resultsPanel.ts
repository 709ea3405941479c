import * as vscode from 'vscode';
import { isPanelToHost, type HostToPanel, type PanelToHost, type PanelView } from '../protocol/messages';
import type { AnalysisRecord } from './analysisRecord';
import { RESULTS_VIEW_TYPE } from './commandIds';
import { createNonce } from './createNonce';
import { Disposable } from './dispose';
import { handlePanelMessage } from './panelActions';
import { panelHtml } from './panelHtml';
import type { Tallywise } from './tallywise';

/** The webview may load only the bundled script and the stylesheet. */
export function panelOptions(extensionUri: vscode.Uri): vscode.WebviewOptions & vscode.WebviewPanelOptions {
  return {
    enableScripts: true,
    localResourceRoots: [vscode.Uri.joinPath(extensionUri, 'dist'), vscode.Uri.joinPath(extensionUri, 'media')],
  };
}

/**
 * Loads the panel page (the same page and bundle for analyses and plans) into a webview panel: its
 * options, title, CSP nonce and resource URIs.
 *
 * @param initialView - an analysis view embedded in the page, so it shows before the first message
 */
export function loadPanelPage(webviewPanel: vscode.WebviewPanel, extensionUri: vscode.Uri, title: string, initialView?: PanelView): void {
  webviewPanel.webview.options = panelOptions(extensionUri);
  webviewPanel.title = title;
  webviewPanel.webview.html = panelHtml({
    cspSource: webviewPanel.webview.cspSource,
    nonce: createNonce(),
    scriptUri: webviewPanel.webview.asWebviewUri(vscode.Uri.joinPath(extensionUri, 'dist', 'webview.js')).toString(),
    styleUri: webviewPanel.webview.asWebviewUri(vscode.Uri.joinPath(extensionUri, 'media', 'panel.css')).toString(),
    initialView,
  });
}

/** One results panel: the view it shows and the analysis behind it (absent for a panel restored after a reload). */
export class ResultsPanel extends Disposable {
  record: AnalysisRecord | undefined;
  view: PanelView;

  constructor(
    readonly webviewPanel: vscode.WebviewPanel,
    private readonly tallywise: Tallywise,
    view: PanelView,
    record: AnalysisRecord | undefined,
    lifetime: { onActive(): void; onClosed(): void },
  ) {
    super();
    this._register(webviewPanel.onDidChangeViewState((event) => {
      if (event.webviewPanel.active) lifetime.onActive();
    }));
    this._register(webviewPanel.onDidDispose(() => {
      lifetime.onClosed();
      this.dispose();
    }));
    this._register(webviewPanel);
    this.view = view;
    this.record = record;
    loadPanelPage(webviewPanel, tallywise.context.extensionUri, view.title, view);
    this._register(webviewPanel.webview.onDidReceiveMessage((message: unknown) => this.receive(message)));
  }

  update(record: AnalysisRecord, view: PanelView): void {
    this.record = record;
    this.view = view;
    this.webviewPanel.title = view.title;
    this.post({ type: 'show', view });
  }

  post(message: HostToPanel): void {
    if (!this.isDisposed) void this.webviewPanel.webview.postMessage(message);
  }

  private receive(message: unknown): void {
    if (!isPanelToHost(message)) {
      this.tallywise.log.warn(`Ignored a message the panel should not send: ${safeDescription(message)}`);
      return;
    }
    if (message.type === 'ready') {
      this.post({ type: 'show', view: this.view });
      return;
    }
    void this.act(message);
  }

  private async act(message: Exclude<PanelToHost, { type: 'ready' }>): Promise<void> {
    try {
      await handlePanelMessage(this.tallywise, this, message);
    } catch (error) {
      const text = error instanceof Error ? error.message : String(error);
      this.tallywise.log.error(`Panel action ${message.type} failed: ${text}`);
      void vscode.window.showErrorMessage(vscode.l10n.t('Tallywise: {0} failed ({1}). Nothing was changed.', message.type, text));
    }
  }
}

/** All results panels, one per table key. */
export class ResultsPanels extends Disposable {
  private readonly panels = new Map<string, ResultsPanel>();
  private current: ResultsPanel | undefined;

  constructor(private readonly tallywise: Tallywise) {
    super();
  }

  get(key: string): ResultsPanel | undefined {
    return this.panels.get(key);
  }

  /** The panel last shown or focused. */
  active(): ResultsPanel | undefined {
    return this.current;
  }

  /** Shows a record: updates the panel of the same table, or opens one beside the editor. */
  show(record: AnalysisRecord, view: PanelView): ResultsPanel {
    const existing = this.panels.get(record.key);
    if (existing) {
      existing.update(record, view);
      existing.webviewPanel.reveal(undefined, true);
      this.current = existing;
      return existing;
    }
    const webviewPanel = vscode.window.createWebviewPanel(
      RESULTS_VIEW_TYPE,
      view.title,
      { viewColumn: vscode.ViewColumn.Beside, preserveFocus: true },
      panelOptions(this.tallywise.context.extensionUri),
    );
    return this.adopt(webviewPanel, view, record);
  }

  /** Takes over a panel VS Code restored after a reload, showing the view it had saved. */
  restore(webviewPanel: vscode.WebviewPanel, view: PanelView): ResultsPanel {
    this.panels.get(view.key)?.dispose();
    return this.adopt(webviewPanel, view, undefined);
  }

  private adopt(webviewPanel: vscode.WebviewPanel, view: PanelView, record: AnalysisRecord | undefined): ResultsPanel {
    const panel = new ResultsPanel(webviewPanel, this.tallywise, view, record, {
      onActive: () => {
        this.current = panel;
      },
      onClosed: () => {
        if (this.panels.get(view.key) === panel) this.panels.delete(view.key);
        if (this.current === panel) this.current = undefined;
      },
    });
    this.panels.set(view.key, panel);
    this.current = panel;
    return panel;
  }

  override dispose(): void {
    for (const panel of this.panels.values()) panel.dispose();
    this.panels.clear();
    super.dispose();
  }
}

function safeDescription(message: unknown): string {
  const type = typeof message === 'object' && message !== null && 'type' in message ? String((message as { type: unknown }).type) : typeof message;
  return type.slice(0, 80);
}
