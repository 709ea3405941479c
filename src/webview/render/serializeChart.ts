/** Presentation properties copied from the theme onto a saved chart, so it keeps its colours outside the editor. */
const COPIED_PROPERTIES = ['fill', 'fill-opacity', 'stroke', 'stroke-width', 'font-size', 'font-family', 'font-weight', 'opacity'];

/**
 * The chart as a standalone SVG document: a copy whose colours, taken from the current theme's
 * computed styles, are written as presentation attributes (the panel's classes mean nothing elsewhere).
 */
export function serializeChart(svg: SVGSVGElement): string {
  const copy = svg.cloneNode(true) as SVGSVGElement;
  const originals = [svg, ...Array.from(svg.querySelectorAll('*'))];
  const copies = [copy, ...Array.from(copy.querySelectorAll('*'))];
  originals.forEach((original, i) => {
    const target = copies[i];
    if (!target || original.tagName === 'title') return;
    const computed = getComputedStyle(original);
    for (const property of COPIED_PROPERTIES) {
      const value = computed.getPropertyValue(property);
      if (value) target.setAttribute(property, value);
    }
    target.removeAttribute('class');
  });
  return new XMLSerializer().serializeToString(copy);
}
