import type { DisplayTable } from '../../protocol/messages';
import { renderTable } from './table';

/**
 * Colour steps of |residual| for the heat map: below 1, 1–2, 2–3, 3–4, 4 and beyond.
 * Steps of one unit on the standard normal scale of adjusted residuals (common practice for shading).
 */
const STEP_LIMITS = [1, 2, 3, 4];

/** The intensity class of one residual: `heat-pos-2`, `heat-neg-4`, or `heat-0` near zero. */
export function heatClass(value: number): string {
  if (!Number.isFinite(value)) return 'heat-0';
  const step = STEP_LIMITS.filter((limit) => Math.abs(value) >= limit).length;
  if (step === 0) return 'heat-0';
  return `heat-${value > 0 ? 'pos' : 'neg'}-${step}`;
}

/** "▲" above expected, "▼" below: the direction reads without colour. */
function directionMarker(value: number): string {
  if (!Number.isFinite(value) || value === 0) return '';
  return value > 0 ? '▲ ' : '▼ ';
}

/**
 * The residuals table as a heat map: each cell keeps its signed value, gets a direction marker
 * and a colour class by intensity (theme colours, set in panel.css); flagged cells are bold.
 */
export function renderHeatMap(table: DisplayTable): HTMLTableElement {
  const values = table.values ?? [];
  return renderTable(table, 'heat-map', {
    classes: (r, c) => ['heat', heatClass(values[r]?.[c] ?? 0)],
    prefix: (r, c) => directionMarker(values[r]?.[c] ?? 0),
  });
}
