import { element } from './dom';

/** The polite live region for busy and notice messages, so screen readers announce them. */
export function createStatusRegion(): HTMLElement {
  return element('div', undefined, { id: 'status', role: 'status', 'aria-live': 'polite', class: 'status' });
}

export function showStatus(region: HTMLElement, message: string, kind: 'busy' | 'notice' | 'idle'): void {
  region.textContent = message;
  region.setAttribute('class', `status status-${kind}`);
}
