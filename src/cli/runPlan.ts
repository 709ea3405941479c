import * as fs from 'node:fs';
import { parseProportionGroups } from '../core/plan/parseProportionGroups';
import { planStudy, type PlanRequest } from '../core/plan/planStudy';
import { smallestDetectableDifference } from '../core/plan/smallestDetectableDifference';
import { smallestDetectableEffect } from '../core/plan/smallestDetectableEffect';
import type { PlanResult, SensitivityResult } from '../core/plan/types';
import { writePlan } from '../core/report/writePlan';
import { locateTable } from '../core/table/locateTable';
import { readCountTable } from '../core/table/readCountTable';
import { fail, ok, type Result } from '../core/types';
import type { PlanCommand, PlanSource } from './parseCommandLine';
import { formatForFile } from './runAnalyze';

/** A plan or a sensitivity, with what the CLI prints for it. */
export interface PlanOutput {
  result: PlanResult | SensitivityResult;
  text: string;
  json: Record<string, unknown>;
}

/** Runs `tallywise plan`: builds the request, asks the core, and renders text and JSON. */
export function runPlan(command: PlanCommand): Result<PlanOutput> {
  const settings = { alpha: command.alpha, power: command.power };
  const result = command.source.from === 'sensitivity' ? sensitivity(command.source, settings) : plan(command.source, settings);
  if (!result.ok) return result;
  return ok({ result: result.value, text: render(result.value), json: toPlanJson(result.value) });
}

function plan(source: Exclude<PlanSource, { from: 'sensitivity' }>, settings: { alpha?: number; power?: number }): Result<PlanResult> {
  const request = planRequest(source);
  if (!request.ok) return request;
  return planStudy({ ...request.value, ...settings });
}

function planRequest(source: Exclude<PlanSource, { from: 'sensitivity' }>): Result<PlanRequest> {
  switch (source.from) {
    case 'effect-size':
      return ok({ design: 'effect-size', w: source.w, df: source.df });
    case 'groups': {
      const groups = parseProportionGroups(source.groups);
      return groups.ok ? ok({ design: 'independence', groups: groups.value, allocation: source.allocation }) : groups;
    }
    case 'fit': {
      const anticipated = parseOneList(source.anticipated, '--anticipated');
      if (!anticipated.ok) return anticipated;
      const nullProportions = parseOneList(source.nullProportions, '--null');
      return nullProportions.ok ? ok({ design: 'goodness-of-fit', anticipated: anticipated.value, nullProportions: nullProportions.value }) : nullProportions;
    }
    case 'two-proportions': {
      const { p1, p2, difference, ratio, oddsRatio, allocation } = source;
      const allocationRatio = allocation ? allocation[1] / allocation[0] : undefined;
      if (allocation && !(allocation[0] > 0 && allocation[1] > 0)) return fail({ code: 'bad-option', message: `Allocation weights must be positive (got ${allocation.join(',')}).` });
      return ok({ design: 'two-proportions', p1, p2, difference, ratio, oddsRatio, allocationRatio });
    }
    case 'table':
      return tableRequest(source);
  }
}

/** The anticipated table in a document: rows are groups, columns outcomes (counts become row proportions). */
function tableRequest(source: Extract<PlanSource, { from: 'table' }>): Result<PlanRequest> {
  let text: string;
  try {
    text = fs.readFileSync(source.file, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    return fail({ code: 'unreadable', message: `Cannot read ${source.file}: ${code === 'ENOENT' ? 'no such file' : (error as Error).message}.` });
  }
  const located = locateTable(text, { format: source.format ?? formatForFile(source.file), line: source.line, tableIndex: source.tableIndex });
  if (!located.ok) return located;
  const table = readCountTable(located.value.grid);
  if (!table.ok) {
    const hint = table.issue.code === 'percentages-not-counts' || table.issue.code === 'non-integer-count'
      ? ' To plan from proportions, type them with --groups instead.' : '';
    return fail({ ...table.issue, message: table.issue.message + hint });
  }
  const observed = table.value.observed;
  const single = observed.length === 1 ? observed[0] : observed[0].length === 1 ? observed.map((row) => row[0]) : undefined;
  if (single) {
    if (source.nullProportions === undefined) {
      return fail({ code: 'bad-option', message: 'This table has one row (or column) of counts: give the null proportions with --null to plan a goodness-of-fit test.' });
    }
    const nullProportions = parseOneList(source.nullProportions, '--null');
    if (!nullProportions.ok) return nullProportions;
    const total = single.reduce((a, b) => a + b, 0);
    return ok({ design: 'goodness-of-fit', anticipated: single.map((count) => count / total), nullProportions: nullProportions.value });
  }
  const groups = observed.map((row) => {
    const total = row.reduce((a, b) => a + b, 0);
    return row.map((count) => count / total);
  });
  return ok({ design: 'independence', groups, allocation: source.allocation });
}

function parseOneList(text: string, flag: string): Result<number[]> {
  const parsed = parseProportionGroups(text);
  if (!parsed.ok) return parsed;
  if (parsed.value.length !== 1) return fail({ code: 'bad-expected', message: `${flag} takes one list of proportions, like 0.25,0.5,0.25 (got ${parsed.value.length} groups).` });
  return ok(parsed.value[0]);
}

function sensitivity(source: Extract<PlanSource, { from: 'sensitivity' }>, settings: { alpha?: number; power?: number }): Result<SensitivityResult> {
  if (source.sizes.length === 2) return smallestDetectableDifference(source.sizes[0], source.sizes[1], source.p1 as number, settings.alpha, settings.power);
  return smallestDetectableEffect(source.sizes[0], source.df as number, settings.alpha, settings.power);
}

/** The documented `plan --json` fields: `power` is the achieved power, `targetPower` the one asked for. */
export function toPlanJson(result: PlanResult | SensitivityResult): Record<string, unknown> {
  const writeUp = writePlan(result);
  if (result.design === 'sensitivity') {
    const { power, ...rest } = result;
    return { ...rest, targetPower: power, writeUp };
  }
  const { power, achievedPower, ...rest } = result;
  return { ...rest, power: achievedPower, targetPower: power, writeUp };
}

function render(result: PlanResult | SensitivityResult): string {
  const lines: string[] = [];
  if (result.design === 'sensitivity') {
    lines.push(`Smallest detectable effect: w = ${result.w.toFixed(4)} (N = ${result.n}, df = ${result.df}, alpha = ${result.alpha}, power = ${result.power})`);
    const pair = result.twoProportions;
    if (pair) lines.push(`Second proportion detectable: ${pair.lower !== undefined ? `≤ ${pair.lower.toFixed(4)}` : 'none below'} or ${pair.higher !== undefined ? `≥ ${pair.higher.toFixed(4)}` : 'none above'} (baseline ${pair.baseline})`);
  } else {
    lines.push(`Sample size: N = ${result.n}${result.perGroup.length > 1 ? ` (per group ${result.perGroup.join(', ')})` : ''}`);
    lines.push(`Power at these sizes: ${result.achievedPower.toFixed(4)} (target ${result.power}); w = ${result.w.toFixed(4)}, df = ${result.df}, alpha = ${result.alpha}`);
    lines.push(`Critical value ${result.criticalValue.toFixed(4)}, noncentrality ${result.lambda.toFixed(4)}`);
    const fleiss = result.twoProportions?.normalApproximation;
    if (fleiss) lines.push(`Normal approximation (Fleiss, Levin & Paik 2003, eq. 4.14): ${fleiss.perGroup.join(', ')} per group; with continuity correction (4.15): ${fleiss.correctedPerGroup.join(', ')}`);
    const marks = [0.5, 0.8, 0.9, 0.95].map((target) => result.curve.find((point) => point.power >= target)).filter((point) => point !== undefined);
    if (marks.length > 0) lines.push(`Power curve: ${marks.map((point) => `N ${point.n} → ${point.power.toFixed(2)}`).join(', ')} (100 points with --json)`);
  }
  lines.push('', `Write-up: ${writePlan(result)}`);
  return lines.join('\n');
}
