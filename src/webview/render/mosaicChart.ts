import type { ChartData } from '../../protocol/messages';
import { svgElement } from './dom';
import { heatClass } from './heatMap';

const PLOT_WIDTH = 420;
const PLOT_HEIGHT = 240;
const MARGIN = { top: 12, right: 140, bottom: 40, left: 12 };
const STRIP_GAP = 3;
const SEGMENT_GAP = 1;
const MAX_LABEL_CHARACTERS = 16;

function shortened(label: string): string {
  return label.length > MAX_LABEL_CHARACTERS ? `${label.slice(0, MAX_LABEL_CHARACTERS - 1)}…` : label;
}

/**
 * A mosaic plot: one strip per row, as wide as the row's share of N, cut into tiles as tall as the
 * column shares within the row; tiles are shaded by their adjusted residual with the heat map's classes.
 */
export function renderMosaicChart(mosaic: ChartData['mosaic'], description: string): SVGSVGElement {
  const width = MARGIN.left + PLOT_WIDTH + MARGIN.right;
  const height = MARGIN.top + PLOT_HEIGHT + MARGIN.bottom;
  const svg = svgElement('svg', { xmlns: 'http://www.w3.org/2000/svg', width, height, viewBox: `0 0 ${width} ${height}`, role: 'img', class: 'chart mosaic-chart' });
  svg.append(svgElement('title', {}, description));
  svg.append(svgElement('rect', { class: 'chart-background', x: 0, y: 0, width, height }));
  const usable = PLOT_WIDTH - STRIP_GAP * Math.max(mosaic.length - 1, 0);
  let left = MARGIN.left;
  mosaic.forEach((strip, s) => {
    const stripWidth = usable * strip.width;
    let top = MARGIN.top;
    for (const segment of strip.segments) {
      const tileHeight = PLOT_HEIGHT * segment.height;
      const tile = svgElement('rect', {
        class: `tile ${heatClass(segment.residual)}`,
        x: left,
        y: top,
        width: Math.max(stripWidth, 0),
        height: Math.max(tileHeight - SEGMENT_GAP, 0),
      });
      tile.append(svgElement('title', {}, segment.label));
      svg.append(tile);
      if (s === mosaic.length - 1) {
        svg.append(svgElement('text', { class: 'legend-label', x: left + stripWidth + 6, y: top + tileHeight / 2 + 4 }, shortened(segment.category)));
      }
      top += tileHeight;
    }
    const label = svgElement('text', { class: 'axis-label group-label', x: left + stripWidth / 2, y: MARGIN.top + PLOT_HEIGHT + 18, 'text-anchor': 'middle' }, shortened(strip.group));
    label.append(svgElement('title', {}, strip.group));
    svg.append(label);
    left += stripWidth + STRIP_GAP;
  });
  return svg;
}
