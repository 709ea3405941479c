import type { PowerCurveData } from '../../protocol/planView';
import { svgElement } from './dom';

const WIDTH = 560;
const HEIGHT = 300;
const MARGIN = { top: 16, right: 24, bottom: 48, left: 56 };
const MARKER_RADIUS = 5;
/** Ids that tie the SVG's accessible name and description to it (one plan chart per page). */
const TITLE_ID = 'power-curve-title';
const DESC_ID = 'power-curve-desc';

/**
 * The power curve as an SVG line chart: power (0–1) over total N, a level line at the target power
 * and a marker at the planned N. Only layout happens here; every label and tick comes from the host.
 */
export function renderPowerCurveChart(curve: PowerCurveData): SVGSVGElement {
  const plotWidth = WIDTH - MARGIN.left - MARGIN.right;
  const plotHeight = HEIGHT - MARGIN.top - MARGIN.bottom;
  const ns = [...curve.points.map((point) => point.n), curve.planned.n];
  const low = Math.min(...ns);
  const high = Math.max(...ns);
  const x = (n: number) => MARGIN.left + (plotWidth * (n - low)) / Math.max(high - low, 1);
  const y = (power: number) => MARGIN.top + plotHeight * (1 - Math.min(Math.max(power, 0), 1));
  const round = (value: number) => Math.round(value * 10) / 10;

  const svg = svgElement('svg', {
    xmlns: 'http://www.w3.org/2000/svg', width: WIDTH, height: HEIGHT, viewBox: `0 0 ${WIDTH} ${HEIGHT}`,
    role: 'img', 'aria-labelledby': `${TITLE_ID} ${DESC_ID}`, class: 'chart power-curve-chart',
  });
  svg.append(svgElement('title', { id: TITLE_ID }, curve.title), svgElement('desc', { id: DESC_ID }, curve.description));
  svg.append(svgElement('rect', { class: 'chart-background', x: 0, y: 0, width: WIDTH, height: HEIGHT }));
  for (const tick of curve.yTicks) {
    svg.append(svgElement('line', { class: 'gridline', x1: MARGIN.left, x2: MARGIN.left + plotWidth, y1: y(tick.value), y2: y(tick.value) }));
    svg.append(svgElement('text', { class: 'axis-label', x: MARGIN.left - 6, y: y(tick.value) + 4, 'text-anchor': 'end' }, tick.label));
  }
  const bottom = MARGIN.top + plotHeight;
  for (const tick of curve.xTicks) {
    svg.append(svgElement('line', { class: 'axis', x1: x(tick.value), x2: x(tick.value), y1: bottom, y2: bottom + 4 }));
    svg.append(svgElement('text', { class: 'axis-label x-tick', x: x(tick.value), y: bottom + 16, 'text-anchor': 'middle' }, tick.label));
  }
  svg.append(
    svgElement('line', { class: 'axis', x1: MARGIN.left, x2: MARGIN.left + plotWidth, y1: bottom, y2: bottom }),
    svgElement('line', { class: 'axis', x1: MARGIN.left, x2: MARGIN.left, y1: MARGIN.top, y2: bottom }),
    svgElement('text', { class: 'axis-title', x: MARGIN.left + plotWidth / 2, y: HEIGHT - 8, 'text-anchor': 'middle' }, curve.xTitle),
    svgElement('text', { class: 'axis-title', x: 14, y: MARGIN.top + plotHeight / 2, 'text-anchor': 'middle', transform: `rotate(-90 14 ${MARGIN.top + plotHeight / 2})` }, curve.yTitle),
  );

  const targetY = y(curve.target.power);
  svg.append(
    svgElement('line', { class: 'target-line', x1: MARGIN.left, x2: MARGIN.left + plotWidth, y1: targetY, y2: targetY }),
    svgElement('text', { class: 'target-label', x: MARGIN.left + plotWidth - 4, y: targetY - 6, 'text-anchor': 'end' }, curve.target.label),
  );
  const path = curve.points.map((point, i) => `${i === 0 ? 'M' : 'L'}${round(x(point.n))} ${round(y(point.power))}`).join('');
  svg.append(svgElement('path', { class: 'power-curve', d: path, fill: 'none' }));

  const plannedX = x(curve.planned.n);
  const plannedY = y(curve.planned.power);
  const marker = svgElement('circle', { class: 'planned-marker', cx: round(plannedX), cy: round(plannedY), r: MARKER_RADIUS });
  marker.append(svgElement('title', {}, curve.planned.label));
  const labelOnLeft = plannedX > MARGIN.left + plotWidth / 2;
  svg.append(
    svgElement('line', { class: 'planned-line', x1: plannedX, x2: plannedX, y1: plannedY, y2: bottom }),
    marker,
    svgElement('text', {
      class: 'planned-label', x: plannedX + (labelOnLeft ? -8 : 8), y: Math.min(plannedY + 18, bottom - 6), 'text-anchor': labelOnLeft ? 'end' : 'start',
    }, curve.planned.label),
  );
  return svg;
}
