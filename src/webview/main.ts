// The results panel's front end. It displays the finished view the host sends; every label from
// the user's document goes in as text (textContent), never as HTML.
import { isHostToPanel, type PanelToHost, type PanelView } from '../protocol/messages';

declare function acquireVsCodeApi(): { postMessage(message: PanelToHost): void; getState(): unknown; setState(state: unknown): void };

const vscode = acquireVsCodeApi();

function element(tag: string, text?: string): HTMLElement {
  const node = document.createElement(tag);
  if (text !== undefined) node.textContent = text;
  return node;
}

function render(view: PanelView): void {
  const root = document.getElementById('root');
  if (!root) return;
  root.replaceChildren();
  root.append(element('h1', view.title), element('p', view.summary));
  const list = element('ul');
  for (const line of view.details) list.append(element('li', line));
  root.append(list, element('h2', 'Write-up'), element('p', view.writeUp));
  const insert = element('button', 'Insert below the table');
  insert.addEventListener('click', () => vscode.postMessage({ type: 'insertWriteUp' }));
  const copy = element('button', 'Copy');
  copy.addEventListener('click', () => vscode.postMessage({ type: 'copyWriteUp' }));
  root.append(insert, copy);
  vscode.setState(view);
}

window.addEventListener('message', (event: MessageEvent<unknown>) => {
  if (isHostToPanel(event.data)) render(event.data.view);
});

const saved = vscode.getState();
if (saved && typeof saved === 'object') render(saved as PanelView);
vscode.postMessage({ type: 'ready' });
