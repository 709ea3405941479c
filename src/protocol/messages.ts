/**
 * Messages between the extension host and the results panel. Both sides import this file
 * type-only; the host checks everything it receives with `isPanelToHost` before acting on it.
 */

/** What the panel shows: finished text made by the host; the panel computes nothing. */
export interface PanelView {
  title: string;
  summary: string;
  details: string[];
  writeUp: string;
}

export type HostToPanel = { type: 'show'; view: PanelView };

export type PanelToHost =
  | { type: 'ready' }
  | { type: 'insertWriteUp' }
  | { type: 'copyWriteUp' };

const PANEL_MESSAGE_TYPES: ReadonlySet<string> = new Set(['ready', 'insertWriteUp', 'copyWriteUp']);

/** Runtime guard for messages from the panel (annotation is not validation). */
export function isPanelToHost(value: unknown): value is PanelToHost {
  return typeof value === 'object' && value !== null && PANEL_MESSAGE_TYPES.has((value as { type?: unknown }).type as string);
}

/** Runtime guard the panel uses on what the host sends. */
export function isHostToPanel(value: unknown): value is HostToPanel {
  if (typeof value !== 'object' || value === null) return false;
  const message = value as { type?: unknown; view?: Partial<PanelView> };
  return message.type === 'show' && typeof message.view?.title === 'string' && typeof message.view.summary === 'string' &&
    Array.isArray(message.view.details) && typeof message.view.writeUp === 'string';
}
