import { chiSquarePower } from '../core/plan/chiSquarePower';
import { POWER_CURVE_POINTS, powerCurve } from '../core/plan/powerCurve';
import type { PlanResult, PowerPoint, SensitivityResult } from '../core/plan/types';
import { formatCount, formatFixed, formatPercent, formatSigned } from '../core/report/formatNumber';
import { writePlan } from '../core/report/writePlan';
import type { AxisTick, PlanFact, PlanView, PowerCurveData } from '../protocol/planView';

/** One plan panel at a time: the next plan replaces the last. */
export const PLAN_VIEW_KEY = 'plan';
/** About this many steps on the N axis (common practice for a readable axis). */
const X_TICK_TARGET = 5;
const Y_TICKS = [0, 0.2, 0.4, 0.6, 0.8, 1];
const W_DECIMALS = 3;
const PROPORTION_DECIMALS = 3;

/** What the view says about where the plan came from and what the panel may do with it. */
export interface PlanViewSource {
  /** Names of the groups (a table's rows), in the plan's order. */
  groupLabels?: string[];
  /** For a 2×2 sensitivity: the outcome (first column) whose proportion the difference is about. */
  outcomeLabel?: string;
  /** Where the plan came from, e.g. "the table on lines 3–6 of ski.md". */
  origin?: string;
  /** The Insert button's label, e.g. "Insert below the table". */
  insertLabel?: string;
  /** Why the paragraph cannot be inserted; the Insert button is left out. */
  insertUnavailable?: string;
}

/**
 * The finished plan view for the results panel: the sizes, the power reached, the assumptions, the
 * planning paragraph and the power curve as data, every string formatted here. A sensitivity result
 * gets the smallest detectable effect and the curve of power over N at that effect, which crosses
 * the target power at the table's own N.
 *
 * @param result - a plan from `planStudy`, or a sensitivity from `smallestDetectableEffect` / `smallestDetectableDifference`
 * @param source - labels and the insert choice
 * @returns the view; the panel adds no numbers or prose of its own
 */
export function buildPlanView(result: PlanResult | SensitivityResult, source: PlanViewSource = {}): PlanView {
  const sensitivity = result.design === 'sensitivity';
  return {
    kind: sensitivity ? 'sensitivity' : 'plan',
    key: PLAN_VIEW_KEY,
    title: sensitivity ? 'What this study could detect' : 'Sample size plan',
    headline: sensitivity ? sensitivityHeadline(result) : planHeadline(result, source),
    facts: [
      ...(source.origin ? [{ label: sensitivity ? 'Table' : 'Planned from', value: source.origin }] : []),
      ...(sensitivity ? sensitivityFacts(result, source) : planFacts(result, source)),
    ],
    assumptions: result.assumptions,
    notes: sensitivity ? sensitivityNotes(result, source) : planNotes(),
    curve: sensitivity ? sensitivityCurve(result) : planCurve(result),
    paragraph: writePlan(result),
    labels: {
      facts: sensitivity ? 'Sensitivity' : 'The plan',
      curve: 'Power by total sample size',
      assumptions: 'Assumptions',
      notes: 'What these figures do not show',
      paragraph: 'Planning paragraph',
      insert: source.insertLabel ?? 'Insert the paragraph',
      copy: 'Copy the paragraph',
    },
    ...(source.insertUnavailable !== undefined ? { insertUnavailable: source.insertUnavailable } : {}),
  };
}

function groupNames(count: number, source: PlanViewSource): string[] {
  return Array.from({ length: count }, (_, i) => source.groupLabels?.[i] ?? `group ${i + 1}`);
}

function planHeadline(plan: PlanResult, source: PlanViewSource): string {
  const names = groupNames(plan.perGroup.length, source);
  const groups = plan.perGroup.length > 1 ? ` (${plan.perGroup.map((size, i) => `${names[i]} ${formatCount(size)}`).join(', ')})` : '';
  return `The study needs N = ${formatCount(plan.n)} observations${groups}; at these sizes the power is ${formatPercent(plan.achievedPower, 1)} ` +
    `at α = ${trim(plan.alpha)} for an effect of w = ${formatFixed(plan.w, W_DECIMALS)}.`;
}

function planFacts(plan: PlanResult, source: PlanViewSource): PlanFact[] {
  const names = groupNames(plan.perGroup.length, source);
  const facts: PlanFact[] = [{ label: 'Total sample size (N)', value: formatCount(plan.n) }];
  if (plan.perGroup.length > 1) {
    facts.push(
      { label: 'Per group', value: plan.perGroup.map((size, i) => `${names[i]}: ${formatCount(size)}`).join('; ') },
      { label: 'Allocation', value: allocationText(plan.allocation) },
    );
  }
  facts.push(
    { label: 'Power at these sizes', value: formatPercent(plan.achievedPower, 1) },
    { label: 'Target power', value: percent(plan.power) },
    { label: 'Significance level (α)', value: trim(plan.alpha) },
    { label: 'Degrees of freedom (df)', value: String(plan.df) },
    { label: 'Effect size (w)', value: formatFixed(plan.w, W_DECIMALS) },
  );
  const pair = plan.twoProportions;
  if (pair) {
    const fleiss = pair.normalApproximation;
    facts.push(
      { label: 'Proportions', value: `${trim(pair.p1)} in ${names[0]}, ${trim(pair.p2)} in ${names[1]}` },
      {
        label: 'Normal approximation (Fleiss, Levin & Paik)',
        value: `${fleiss.perGroup.map(formatCount).join(' and ')} per group; ${fleiss.correctedPerGroup.map(formatCount).join(' and ')} with the continuity correction`,
      },
    );
  }
  facts.push(
    { label: 'Critical value of χ²', value: formatFixed(plan.criticalValue, 3) },
    { label: 'Noncentrality (λ = N·w²)', value: formatFixed(plan.lambda, 2) },
  );
  return facts;
}

function planNotes(): string[] {
  return [
    'Everything rests on the anticipated values: if the true effect is smaller, more observations are needed.',
    'Power comes from the noncentral chi-square distribution (λ = N·w², Cohen 1988, ch. 7). Group sizes are rounded up, so the power reached is never below the target.',
    'The plan assumes independent observations, each counted once; it says nothing about cause.',
  ];
}

function sensitivityHeadline(result: SensitivityResult): string {
  return `With N = ${formatCount(result.n)} observations, a chi-square test with ${result.df} df at α = ${trim(result.alpha)} ` +
    `detects an effect of w = ${formatFixed(result.w, W_DECIMALS)} or larger with ${percent(result.power)} power.`;
}

function sensitivityFacts(result: SensitivityResult, source: PlanViewSource): PlanFact[] {
  const facts: PlanFact[] = [{ label: 'Observations (N)', value: formatCount(result.n) }];
  const pair = result.twoProportions;
  const names = groupNames(2, source);
  if (pair) facts.push({ label: 'Groups', value: `${names[0]}: ${formatCount(pair.n1)}; ${names[1]}: ${formatCount(pair.n2)}` });
  facts.push({ label: 'Smallest detectable effect (w)', value: formatFixed(result.w, W_DECIMALS) });
  if (pair) facts.push({ label: 'Smallest detectable difference', value: differenceText(pair, names, source.outcomeLabel) });
  facts.push(
    { label: 'Target power', value: percent(result.power) },
    { label: 'Significance level (α)', value: trim(result.alpha) },
    { label: 'Degrees of freedom (df)', value: String(result.df) },
    { label: 'Critical value of χ²', value: formatFixed(result.criticalValue, 3) },
    { label: 'Noncentrality needed (λ)', value: formatFixed(result.lambda, 2) },
  );
  return facts;
}

function differenceText(pair: NonNullable<SensitivityResult['twoProportions']>, names: string[], outcome: string | undefined): string {
  const sides: string[] = [];
  if (pair.lower !== undefined) sides.push(`${formatFixed(pair.lower, PROPORTION_DECIMALS)} or below (${formatSigned(pair.lower - pair.baseline, PROPORTION_DECIMALS)})`);
  if (pair.higher !== undefined) sides.push(`${formatFixed(pair.higher, PROPORTION_DECIMALS)} or above (${formatSigned(pair.higher - pair.baseline, PROPORTION_DECIMALS)})`);
  const what = outcome ? `the proportion of ${outcome}` : 'the proportion';
  if (sides.length === 0) return `no proportion in ${names[1]} between 0 and 1 reaches the power against ${formatFixed(pair.baseline, PROPORTION_DECIMALS)} in ${names[0]}`;
  return `${what} in ${names[1]} at ${sides.join(' or ')}, against ${formatFixed(pair.baseline, PROPORTION_DECIMALS)} in ${names[0]}`;
}

function sensitivityNotes(result: SensitivityResult, source: PlanViewSource): string[] {
  const notes = [
    'This is what a study of this size could detect, not the power of the result it found: "observed power" only restates the p-value, so Tallywise does not give it.',
  ];
  if (result.twoProportions) {
    notes.push(`The baseline is the proportion observed in ${groupNames(1, source)[0]}; the difference is about the population, not these data.`);
  }
  notes.push('Observations are taken to be independent, each counted once.');
  return notes;
}

function planCurve(plan: PlanResult): PowerCurveData {
  return curveData(plan.curve, { n: plan.n, power: plan.achievedPower }, plan.power, 'planned');
}

function sensitivityCurve(result: SensitivityResult): PowerCurveData {
  const from = result.df + 1;
  const points = powerCurve(result.w, result.df, result.alpha, from, Math.max(2 * result.n, from + POWER_CURVE_POINTS - 1));
  const here = { n: result.n, power: chiSquarePower(result.n * result.w * result.w, result.df, result.alpha, result.criticalValue) };
  return curveData(points, here, result.power, 'table');
}

function curveData(points: PowerPoint[], planned: PowerPoint, target: number, kind: 'planned' | 'table'): PowerCurveData {
  const first = points[0];
  const last = points[points.length - 1];
  const what = kind === 'planned' ? 'The planned' : "The table's";
  const markerLabel = `${what} N = ${formatCount(planned.n)}: power ${formatPercent(planned.power, 1)}`;
  return {
    points: points.map(({ n, power }) => ({ n, power })),
    planned: { ...planned, label: markerLabel },
    target: { power: target, label: `Target ${percent(target)}` },
    xTitle: 'Total sample size (N)',
    yTitle: 'Power',
    xTicks: countTicks(Math.min(first.n, planned.n), Math.max(last.n, planned.n)),
    yTicks: Y_TICKS.map((value): AxisTick => ({ value, label: formatPercent(value) })),
    title: kind === 'planned' ? 'Power of the test by total sample size' : 'Power by total sample size at the smallest detectable effect',
    description: `Power rises from ${formatPercent(first.power, 1)} at N = ${formatCount(first.n)} to ${formatPercent(last.power, 1)} at N = ${formatCount(last.n)}. ` +
      `${markerLabel}; the level line marks the target power of ${percent(target)}.`,
    table: {
      caption: `Power by total sample size (${kind === 'planned' ? 'planned' : "the table's"} N = ${formatCount(planned.n)})`,
      header: ['Total N', 'Power'],
      rows: points.map(({ n, power }) => [formatCount(n), formatPercent(power, 1)]),
    },
    tableToggle: 'Show the curve as a table',
  };
}

/** Whole-number ticks at a 1, 2 or 5 × 10^k step, about `X_TICK_TARGET` of them within [from, to]. */
function countTicks(from: number, to: number): AxisTick[] {
  const raw = Math.max(to - from, 1) / X_TICK_TARGET;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const scaled = raw / magnitude;
  const step = Math.max(1, (scaled < 1.5 ? 1 : scaled < 3 ? 2 : scaled < 7 ? 5 : 10) * magnitude);
  const ticks: AxisTick[] = [];
  for (let value = Math.ceil(from / step) * step; value <= to; value += step) ticks.push({ value, label: formatCount(value) });
  return ticks;
}

/** "1 : 2" from shares, relative to the smallest; "equal groups" when they are. */
function allocationText(shares: readonly number[]): string {
  const smallest = Math.min(...shares);
  if (shares.every((share) => Math.abs(share - smallest) < 1e-12)) return 'equal groups';
  return shares.map((share) => trim(share / smallest)).join(' : ');
}

function percent(share: number): string {
  return formatPercent(share, Number.isInteger(Math.round(share * 1000) / 10) ? 0 : 1);
}

function trim(value: number): string {
  return Number(value.toPrecision(4)).toString();
}
