import { isHostToPanel, type PanelView } from '../protocol/messages';

/**
 * The view a restored panel saved with `setState`: either the view itself or `{ view }`. Checked with
 * the protocol's guard, because the state comes back from the webview.
 *
 * @param state - what `deserializeWebviewPanel` received
 * @returns the view, or undefined when the state holds none
 */
export function savedView(state: unknown): PanelView | undefined {
  if (typeof state !== 'object' || state === null) return undefined;
  const candidate = 'view' in state ? (state as { view: unknown }).view : state;
  const message = { type: 'show', view: candidate };
  return isHostToPanel(message) && message.type === 'show' ? message.view : undefined;
}
