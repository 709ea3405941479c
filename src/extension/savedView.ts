import { isHostToPanel, type PanelView } from '../protocol/messages';
import { isPlanView, type PlanView } from '../protocol/planView';

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

/**
 * The plan view a restored panel saved (the plan panel shares the page, so its state has the same
 * two shapes), checked with the plan view's guard.
 */
export function savedPlanView(state: unknown): PlanView | undefined {
  if (typeof state !== 'object' || state === null) return undefined;
  const candidate = 'view' in state ? (state as { view: unknown }).view : state;
  return isPlanView(candidate) ? candidate : undefined;
}
