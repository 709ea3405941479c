import type { ChartData, PanelToHost } from '../../protocol/messages';
import { button, element, section } from './dom';
import { renderMosaicChart } from './mosaicChart';
import { renderProportionsChart } from './proportionsChart';
import { serializeChart } from './serializeChart';

type Post = (message: PanelToHost) => void;

function saveButton(chart: 'proportions' | 'mosaic', figure: HTMLElement, post: Post): HTMLButtonElement {
  return button('Save as SVG', () => {
    const svg = figure.querySelector('svg');
    if (svg) post({ type: 'saveChart', chart, svg: serializeChart(svg) });
  }, { class: 'secondary', 'data-action': `save-${chart}` });
}

/** Proportions chart with a toggle between shares within rows and within columns. */
function proportionsSection(chart: ChartData, post: Post): HTMLElement {
  const node = section('Proportions with 95% Wilson intervals', 'proportions');
  const caption = element('figcaption');
  const figure = element('figure', undefined, { class: 'chart-figure', 'data-chart': 'proportions' });
  let withinColumns = false;
  const draw = () => {
    const bars = withinColumns ? chart.columnProportions : chart.rowProportions;
    const text = chart.columnProportions.length === 0
      ? `Share of each category among all observations.`
      : withinColumns
        ? `Share of each row category within each column (${chart.columnTitle}).`
        : `Share of each column category within each row (${chart.rowTitle}).`;
    caption.textContent = text;
    figure.replaceChildren(renderProportionsChart(bars, text), caption);
  };
  const controls = element('div', undefined, { class: 'button-row' });
  if (chart.columnProportions.length > 0) {
    const toggle = button('Shares within columns', () => {
      withinColumns = !withinColumns;
      toggle.setAttribute('aria-pressed', String(withinColumns));
      draw();
    }, { 'aria-pressed': 'false', class: 'secondary toggle', 'data-action': 'toggle-proportions' });
    controls.append(toggle);
  }
  controls.append(saveButton('proportions', figure, post));
  draw();
  node.append(controls, figure);
  return node;
}

function mosaicSection(chart: ChartData, post: Post): HTMLElement {
  const node = section('Mosaic plot', 'mosaic');
  const text = `Each strip is one row, as wide as its share of all observations; tiles are the column shares within it, shaded by adjusted residual (warm above expected, cool below).`;
  const figure = element('figure', undefined, { class: 'chart-figure', 'data-chart': 'mosaic' });
  figure.append(renderMosaicChart(chart.mosaic, text), element('figcaption', text));
  const controls = element('div', undefined, { class: 'button-row' });
  controls.append(saveButton('mosaic', figure, post));
  node.append(controls, figure);
  return node;
}

/** The chart sections: proportions always, the mosaic when the host sends one. */
export function renderCharts(chart: ChartData, post: Post): HTMLElement[] {
  const sections = [proportionsSection(chart, post)];
  if (chart.mosaic.length > 0) sections.push(mosaicSection(chart, post));
  return sections;
}
