/**
 * Messages between the extension host and the results panel. Both sides import this file
 * type-only (plus the guards); the host checks everything it receives with `isPanelToHost`
 * before acting on it, and the panel checks with `isHostToPanel`.
 *
 * The panel computes nothing and writes no prose: every string and number it shows arrives here,
 * already formatted by the host (src/extension/panelView.ts builds a PanelView from an Analysis).
 */
import { isPlanPanelToHost, isPlanView, type PlanPanelToHost, type PlanView } from './planView';
import { isDesignSections, type DesignSection, type ViewKind } from './designSections';

/** A table as display text: header cells, then rows whose first cell is the row label. */
export interface DisplayTable {
  caption: string;
  header: string[];
  rows: string[][];
  /** Optional per-cell numbers behind the text (same shape as rows without the label column), e.g. residuals for a heat map. */
  values?: number[][];
  /** Cells to mark (e.g. failing Cochran's rule, beyond the Bonferroni value), as [row, column] of the body without the label column. */
  marked?: [number, number][];
}

/** One bar of a proportions chart: a share with its Wilson interval, all in [0, 1]. */
export interface ProportionBar {
  group: string;
  category: string;
  share: number;
  lower: number;
  upper: number;
  /** Display text, e.g. "34.2% (28.1–40.9%)". */
  label: string;
}

/** Geometry-free chart data: the panel lays it out as SVG. */
export interface ChartData {
  /** Row proportions (share of each column within a row) and column proportions (within a column). */
  rowProportions: ProportionBar[];
  columnProportions: ProportionBar[];
  /** Mosaic: rows' widths ∝ row totals, heights ∝ row proportions. */
  mosaic: { group: string; width: number; segments: { category: string; height: number; residual: number; label: string }[] }[];
  rowTitle: string;
  columnTitle: string;
}

export interface PanelView {
  /** Absent in views saved before designs existed: read as independence or goodness of fit. */
  kind?: ViewKind;
  /** Identifies the analysed table (document URI + table start line) so re-running updates the same panel. */
  key: string;
  title: string;
  /** The one-line result: test, statistic, df, p, effect size. */
  summary: string;
  /** The validity check in plain language. */
  validity: string;
  validityOk: boolean;
  /** Statistics lines (G², Yates, intervals, exact p...). */
  details: string[];
  tables: {
    observed: DisplayTable;
    expected: DisplayTable;
    contributions: DisplayTable;
    /** Adjusted (independence) or standardized (goodness of fit) residuals, with `values` for the heat map. */
    residuals: DisplayTable;
  };
  /** Absent for goodness of fit with one category row (a single bar set is still drawn from rowProportions). */
  chart?: ChartData;
  /** When Cochran's rule fails: the proposed merge, its table and result, ready to show. */
  merge?: { description: string; table: DisplayTable; result: string };
  /** True when an exact or simulated p can be asked for (the rule fails and none leads yet). */
  canRunExact: boolean;
  /** What the design adds: McNemar details, the strata, which groups differ, tests for order. */
  designSections?: DesignSection[];
  writeUp: string;
  warnings: string[];
}

export type HostToPanel =
  | { type: 'show'; view: PanelView }
  | { type: 'showPlan'; view: PlanView }
  | { type: 'busy'; message: string }
  | { type: 'notice'; message: string };

export type PanelToHost =
  | { type: 'ready' }
  | { type: 'insertWriteUp'; withExpectedTable: boolean; withChartLink: boolean }
  | { type: 'copyWriteUp' }
  | { type: 'applyMerge' }
  | { type: 'runExact'; method: 'exact' | 'monte-carlo' }
  | { type: 'saveChart'; chart: 'proportions' | 'mosaic'; svg: string }
  | PlanPanelToHost;

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null;
}

/** Runtime guard for messages from the panel (annotation is not validation). */
export function isPanelToHost(value: unknown): value is PanelToHost {
  if (!isRecord(value)) return false;
  switch (value.type) {
    case 'ready':
    case 'copyWriteUp':
    case 'applyMerge':
      return true;
    case 'insertWriteUp':
      return typeof value.withExpectedTable === 'boolean' && typeof value.withChartLink === 'boolean';
    case 'runExact':
      return value.method === 'exact' || value.method === 'monte-carlo';
    case 'saveChart':
      return (value.chart === 'proportions' || value.chart === 'mosaic') && typeof value.svg === 'string' && value.svg.length < 5_000_000;
    default:
      return isPlanPanelToHost(value);
  }
}

/** Runtime guard the panel uses on what the host sends. */
export function isHostToPanel(value: unknown): value is HostToPanel {
  if (!isRecord(value)) return false;
  if (value.type === 'busy' || value.type === 'notice') return typeof value.message === 'string';
  if (value.type === 'showPlan') return isPlanView(value.view);
  if (value.type !== 'show' || !isRecord(value.view)) return false;
  const view = value.view;
  return typeof view.key === 'string' && typeof view.title === 'string' && typeof view.summary === 'string' &&
    typeof view.writeUp === 'string' && Array.isArray(view.details) && isRecord(view.tables) &&
    (view.designSections === undefined || isDesignSections(view.designSections));
}
