/**
 * The plan view: a planned sample size, or what a finished study's table could detect (sensitivity),
 * with its power curve. Like the analysis view it is finished text: the host formats every string
 * (src/extension/planPanelView.ts) and the panel only lays it out and scales the curve to its drawing.
 */
import type { DisplayTable } from './messages';

/** One labelled figure of the plan, e.g. "Total sample size (N)" → "1,108". */
export interface PlanFact {
  label: string;
  value: string;
}

/** An axis tick: where it goes (in the data's own units) and its text. */
export interface AxisTick {
  value: number;
  label: string;
}

/** One point of the curve: a total sample size and the power there, in [0, 1]. */
export interface CurvePoint {
  n: number;
  power: number;
}

/** A power curve as data, not geometry: the panel scales it to its drawing. */
export interface PowerCurveData {
  /** Points in increasing N. */
  points: CurvePoint[];
  /** The planned N (or the table's N) and the power there, drawn as a marker. */
  planned: CurvePoint & { label: string };
  /** The target power, drawn as a level line. */
  target: { power: number; label: string };
  xTitle: string;
  yTitle: string;
  xTicks: AxisTick[];
  yTicks: AxisTick[];
  /** The chart's accessible name (SVG <title>) and description (<desc>). */
  title: string;
  description: string;
  /** The same points as a table, for reading without the chart. */
  table: DisplayTable;
  /** Label of the disclosure that shows the table. */
  tableToggle: string;
}

export interface PlanView {
  kind: 'plan' | 'sensitivity';
  key: string;
  title: string;
  /** One line: the total and the groups, or the smallest detectable effect. */
  headline: string;
  facts: PlanFact[];
  assumptions: string[];
  /** What the figures do not show, and cautions. */
  notes: string[];
  curve: PowerCurveData;
  /** The planning paragraph, as Insert and Copy put it in the notes. */
  paragraph: string;
  /** Section titles and button labels. */
  labels: { facts: string; curve: string; assumptions: string; notes: string; paragraph: string; insert: string; copy: string };
  /** Why the paragraph cannot be inserted (no document to put it in); absent when it can. */
  insertUnavailable?: string;
}

/** The plan view's buttons. */
export type PlanPanelToHost = { type: 'insertPlan' } | { type: 'copyPlan' };

/** A curve longer than this is not a power curve the host would send. */
const MAX_POINTS = 10_000;

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null;
}

const isString = (value: unknown): value is string => typeof value === 'string';
const isFiniteNumber = (value: unknown): value is number => typeof value === 'number' && Number.isFinite(value);
const isStringList = (value: unknown): value is string[] => Array.isArray(value) && value.every(isString);
const isPower = (value: unknown): boolean => isFiniteNumber(value) && value >= 0 && value <= 1;

function isPoint(value: unknown): boolean {
  return isRecord(value) && isFiniteNumber(value.n) && isPower(value.power);
}

function isTick(value: unknown): boolean {
  return isRecord(value) && isFiniteNumber(value.value) && isString(value.label);
}

function isDisplayTable(value: unknown): boolean {
  return isRecord(value) && isString(value.caption) && isStringList(value.header) &&
    Array.isArray(value.rows) && value.rows.every(isStringList);
}

function isCurve(value: unknown): boolean {
  if (!isRecord(value) || !Array.isArray(value.points) || value.points.length < 2 || value.points.length > MAX_POINTS) return false;
  const { planned, target } = value;
  return value.points.every(isPoint) && isPoint(planned) && isRecord(planned) && isString(planned.label) &&
    isRecord(target) && isPower(target.power) && isString(target.label) &&
    isString(value.xTitle) && isString(value.yTitle) && Array.isArray(value.xTicks) && value.xTicks.every(isTick) &&
    Array.isArray(value.yTicks) && value.yTicks.every(isTick) && isString(value.title) && isString(value.description) &&
    isDisplayTable(value.table) && isString(value.tableToggle);
}

/** Runtime guard for a plan view (the panel checks what it is sent, and what it restores). */
export function isPlanView(value: unknown): value is PlanView {
  if (!isRecord(value) || (value.kind !== 'plan' && value.kind !== 'sensitivity')) return false;
  const { labels } = value;
  return isString(value.key) && isString(value.title) && isString(value.headline) && isString(value.paragraph) &&
    Array.isArray(value.facts) && value.facts.every((fact) => isRecord(fact) && isString(fact.label) && isString(fact.value)) &&
    isStringList(value.assumptions) && isStringList(value.notes) && isCurve(value.curve) &&
    isRecord(labels) && ['facts', 'curve', 'assumptions', 'notes', 'paragraph', 'insert', 'copy'].every((name) => isString(labels[name])) &&
    (value.insertUnavailable === undefined || isString(value.insertUnavailable));
}

/** Runtime guard for the plan view's button messages. */
export function isPlanPanelToHost(value: unknown): value is PlanPanelToHost {
  return isRecord(value) && (value.type === 'insertPlan' || value.type === 'copyPlan');
}
