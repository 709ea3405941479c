import type { ProportionBar } from '../../protocol/messages';
import { svgElement } from './dom';

const PLOT_HEIGHT = 200;
const MARGIN = { top: 12, right: 12, bottom: 40, left: 48 };
const BAR_WIDTH = 18;
const BAR_GAP = 4;
const GROUP_GAP = 20;
const CAP_HALF_WIDTH = 4;
const LEGEND_ROW = 18;
/** Colour classes cycle through the theme's chart colours (panel.css defines series-0 … series-5). */
const SERIES_COUNT = 6;
const TICKS = [0, 0.25, 0.5, 0.75, 1];
/** Minimum room per group so its label fits under narrow groups. */
const MIN_GROUP_WIDTH = 96;
/** Rough width of one character at the chart's 11px font, for sizing labels without measuring text. */
const CHARACTER_WIDTH = 6.5;
const MAX_LEGEND_CHARACTERS = 48;

function distinct(values: string[]): string[] {
  return [...new Set(values)];
}

function shortened(label: string, characters: number): string {
  return label.length > characters ? `${label.slice(0, Math.max(characters - 1, 1))}…` : label;
}

/**
 * Grouped bars of proportions, one bar per share, with the Wilson interval as a whisker and the
 * display label as each bar's tooltip (an SVG <title>, read by screen readers too).
 */
export function renderProportionsChart(bars: ProportionBar[], description: string): SVGSVGElement {
  const groups = distinct(bars.map((b) => b.group));
  const categories = distinct(bars.map((b) => b.category));
  const barsWidth = categories.length * (BAR_WIDTH + BAR_GAP) - BAR_GAP;
  const groupWidth = Math.max(barsWidth, MIN_GROUP_WIDTH);
  const plotWidth = groups.length * (groupWidth + GROUP_GAP);
  const legendTop = MARGIN.top + PLOT_HEIGHT + MARGIN.bottom;
  const longestLegend = Math.min(Math.max(0, ...categories.map((c) => c.length)), MAX_LEGEND_CHARACTERS);
  const width = Math.max(MARGIN.left + plotWidth + MARGIN.right, MARGIN.left + 18 + longestLegend * CHARACTER_WIDTH + MARGIN.right);
  const groupCharacters = Math.floor(groupWidth / CHARACTER_WIDTH);
  const height = legendTop + categories.length * LEGEND_ROW + 8;
  const y = (share: number) => MARGIN.top + PLOT_HEIGHT * (1 - Math.min(Math.max(share, 0), 1));

  const svg = svgElement('svg', { xmlns: 'http://www.w3.org/2000/svg', width, height, viewBox: `0 0 ${width} ${height}`, role: 'img', class: 'chart proportions-chart' });
  svg.append(svgElement('title', {}, description));
  svg.append(svgElement('rect', { class: 'chart-background', x: 0, y: 0, width, height }));
  for (const tick of TICKS) {
    svg.append(svgElement('line', { class: 'gridline', x1: MARGIN.left, x2: MARGIN.left + plotWidth, y1: y(tick), y2: y(tick) }));
    svg.append(svgElement('text', { class: 'axis-label', x: MARGIN.left - 6, y: y(tick) + 4, 'text-anchor': 'end' }, `${tick * 100}%`));
  }
  groups.forEach((group, g) => {
    const groupLeft = MARGIN.left + GROUP_GAP / 2 + g * (groupWidth + GROUP_GAP);
    const label = svgElement('text', { class: 'axis-label group-label', x: groupLeft + groupWidth / 2, y: MARGIN.top + PLOT_HEIGHT + 18, 'text-anchor': 'middle' }, shortened(group, groupCharacters));
    label.append(svgElement('title', {}, group));
    svg.append(label);
    for (const item of bars.filter((b) => b.group === group)) {
      const c = categories.indexOf(item.category);
      const x = groupLeft + (groupWidth - barsWidth) / 2 + c * (BAR_WIDTH + BAR_GAP);
      const rect = svgElement('rect', { class: `bar series-${c % SERIES_COUNT}`, x, y: y(item.share), width: BAR_WIDTH, height: y(0) - y(item.share) });
      rect.append(svgElement('title', {}, `${item.group}, ${item.category}: ${item.label}`));
      svg.append(rect);
      const middle = x + BAR_WIDTH / 2;
      const top = y(item.upper);
      const bottom = y(item.lower);
      svg.append(svgElement('path', {
        class: 'whisker',
        d: `M${middle} ${bottom}V${top}M${middle - CAP_HALF_WIDTH} ${top}H${middle + CAP_HALF_WIDTH}M${middle - CAP_HALF_WIDTH} ${bottom}H${middle + CAP_HALF_WIDTH}`,
      }));
    }
  });
  svg.append(svgElement('line', { class: 'axis', x1: MARGIN.left, x2: MARGIN.left + plotWidth, y1: y(0), y2: y(0) }));
  categories.forEach((category, c) => {
    const top = legendTop + c * LEGEND_ROW;
    svg.append(svgElement('rect', { class: `legend-swatch series-${c % SERIES_COUNT}`, x: MARGIN.left, y: top, width: 12, height: 12 }));
    const legend = svgElement('text', { class: 'legend-label', x: MARGIN.left + 18, y: top + 10 }, shortened(category, MAX_LEGEND_CHARACTERS));
    legend.append(svgElement('title', {}, category));
    svg.append(legend);
  });
  return svg;
}
