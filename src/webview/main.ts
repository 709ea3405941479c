// The results panel's front end: it lays out the finished view the host sends and posts the
// user's choices back. Every label from the user's document goes in as text, never as HTML.
import { isHostToPanel, type PanelToHost, type PanelView } from '../protocol/messages';
import { isPlanView, type PlanView } from '../protocol/planView';
import { renderPanel } from './render/panel';
import { renderPlanView } from './render/planView';
import { createStatusRegion, showStatus } from './render/status';

declare function acquireVsCodeApi(): { postMessage(message: PanelToHost): void; getState(): unknown; setState(state: unknown): void };

const vscode = acquireVsCodeApi();
const post = (message: PanelToHost) => vscode.postMessage(message);
const root = document.getElementById('root') ?? document.body.appendChild(document.createElement('main'));
const status = createStatusRegion();
root.before(status);

function asView(candidate: unknown): PanelView | undefined {
  const message = { type: 'show', view: candidate };
  return isHostToPanel(message) && message.type === 'show' ? message.view : undefined;
}

function show(view: PanelView | PlanView): void {
  if (isPlanView(view)) renderPlanView(root, view, post);
  else renderPanel(root, view, post);
  root.removeAttribute('aria-busy');
  showStatus(status, '', 'idle');
  vscode.setState(view);
}

window.addEventListener('message', (event: MessageEvent<unknown>) => {
  const message = event.data;
  if (!isHostToPanel(message)) return;
  switch (message.type) {
    case 'show':
    case 'showPlan':
      show(message.view);
      break;
    case 'busy':
      root.setAttribute('aria-busy', 'true');
      showStatus(status, message.message, 'busy');
      break;
    case 'notice':
      root.removeAttribute('aria-busy');
      showStatus(status, message.message, 'notice');
      break;
  }
});

function initialView(): PanelView | PlanView | undefined {
  const state = vscode.getState();
  if (isPlanView(state)) return state;
  const saved = asView(state);
  if (saved) return saved;
  const embedded = root.dataset.initialView;
  if (!embedded) return undefined;
  try {
    return asView(JSON.parse(embedded));
  } catch {
    return undefined;
  }
}

const restored = initialView();
if (restored) show(restored);
post({ type: 'ready' });
