import type { PanelView } from '../protocol/messages';
import { escapeHtml } from './escapeHtml';

export interface PanelHtmlOptions {
  /** The webview's `cspSource` (where the bundled script and stylesheet come from). */
  cspSource: string;
  /** A fresh nonce from createNonce(); only the script carrying it may run. */
  nonce: string;
  scriptUri: string;
  styleUri: string;
  /** The view to show at once (restoring a panel); otherwise the host sends it as the first message. */
  initialView?: PanelView;
}

/**
 * The results panel's page: a strict Content-Security-Policy (no inline style, only the nonce'd
 * script, nothing remote), the stylesheet, an empty root the script fills, and the initial view as
 * escaped JSON in a data- attribute, so document labels can never become markup.
 * @param options where the bundle lives, the nonce and the optional initial view
 * @returns the HTML document for `webview.html`
 */
export function panelHtml(options: PanelHtmlOptions): string {
  const { cspSource, nonce, scriptUri, styleUri, initialView } = options;
  const csp = `default-src 'none'; style-src ${cspSource}; img-src ${cspSource} data:; script-src 'nonce-${nonce}'`;
  const initial = initialView ? ` data-initial-view="${escapeHtml(JSON.stringify(initialView))}"` : '';
  return [
    '<!DOCTYPE html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="UTF-8">',
    `<meta http-equiv="Content-Security-Policy" content="${escapeHtml(csp)}">`,
    '<meta name="viewport" content="width=device-width, initial-scale=1.0">',
    `<link rel="stylesheet" href="${escapeHtml(styleUri)}">`,
    '<title>Tallywise results</title>',
    '</head>',
    '<body>',
    `<main id="root"${initial}><p class="placeholder">Waiting for the results…</p></main>`,
    `<script nonce="${escapeHtml(nonce)}" src="${escapeHtml(scriptUri)}"></script>`,
    '</body>',
    '</html>',
  ].join('\n');
}
