// Building blocks for the panel's DOM. Every text goes in through textContent or setAttribute,
// never as HTML, so labels from the user's document stay text.

const SVG_NS = 'http://www.w3.org/2000/svg';

type Attributes = Record<string, string | number>;

/** An HTML element with optional text and attributes. */
export function element<K extends keyof HTMLElementTagNameMap>(tag: K, text?: string, attributes: Attributes = {}): HTMLElementTagNameMap[K] {
  const node = document.createElement(tag);
  if (text !== undefined) node.textContent = text;
  for (const [name, value] of Object.entries(attributes)) node.setAttribute(name, String(value));
  return node;
}

/** An SVG element with presentation attributes (allowed by the CSP, unlike inline style). */
export function svgElement<K extends keyof SVGElementTagNameMap>(tag: K, attributes: Attributes = {}, text?: string): SVGElementTagNameMap[K] {
  const node = document.createElementNS(SVG_NS, tag);
  for (const [name, value] of Object.entries(attributes)) node.setAttribute(name, String(value));
  if (text !== undefined) node.textContent = text;
  return node;
}

/** A real button, reachable by keyboard, that runs `action` when pressed. */
export function button(label: string, action: () => void, attributes: Attributes = {}): HTMLButtonElement {
  const node = element('button', label, { type: 'button', ...attributes });
  node.addEventListener('click', action);
  return node;
}

/** A titled section of the panel. */
export function section(title: string, id: string): HTMLElement {
  const node = element('section', undefined, { 'aria-labelledby': `${id}-heading`, class: 'panel-section' });
  node.append(element('h2', title, { id: `${id}-heading` }));
  return node;
}
