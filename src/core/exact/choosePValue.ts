import type { TestResult } from '../stats/types';
import { exactMultinomial } from './exactMultinomial';
import { fisherExact2x2 } from './fisherExact2x2';
import { monteCarloDefaultReplicates } from './monteCarloDefaultReplicates';
import { monteCarloGoodnessOfFit } from './monteCarloGoodnessOfFit';
import { monteCarloIndependence } from './monteCarloIndependence';
import { freemanHaltonExact } from './network/freemanHaltonExact';
import type { MonteCarloBlockHook } from './monteCarloJobSpec';
import type { MonteCarloComputed } from './monteCarloOptions';
import { DEFAULT_BUDGET, type Budget, type Computed, type ExactPValue } from './types';
import type { Issue } from '../types';

/** Which p-value leads the result. 'auto' uses the exact test when Cochran's rule fails. */
export type PValueMethod = 'auto' | 'exact' | 'monte-carlo' | 'asymptotic';

export interface PValueOptions {
  pValueMethod: PValueMethod;
  /** Monte Carlo replicates; 0 means the default that pins p near .05 to about ±.002. */
  replicates: number;
  seed: number;
  /** Time limit for an exact search before it hands over to Monte Carlo. */
  exactTimeMs: number;
}

/** A fixed, reported default seed, so two runs of the same table agree (any integer works). */
export const DEFAULT_SEED = 20261201;

export const DEFAULT_PVALUE_OPTIONS: PValueOptions = {
  pValueMethod: 'auto',
  replicates: 0,
  seed: DEFAULT_SEED,
  exactTimeMs: DEFAULT_BUDGET.timeMs,
};

/** The exact or simulated p that leads the result, and why it was used. */
export interface ChosenPValue extends ExactPValue {
  /** One sentence for the write-up, e.g. "Because 3 of 8 cells had expected counts below 5, ...". */
  reason: string;
  /** Set when an exact search stopped at its time or memory limit and Monte Carlo took over. */
  exactStoppedBy?: 'time' | 'memory';
  /** Fisher 2×2 only: the one-sided p-values. */
  pLess?: number;
  pGreater?: number;
}

export type PValueChoice =
  | { kind: 'asymptotic'; reason?: string }
  | { kind: 'computed'; value: ChosenPValue }
  | { kind: 'cancelled' }
  /** The block hook (a worker pool) failed; the issue says what to do. */
  | { kind: 'failed'; issue: Issue };

/**
 * Runtime hooks for long searches: cancellation and progress (from a worker, the CLI's terminal),
 * and optionally `runBlocks`, which simulates Monte Carlo blocks elsewhere (a Node worker pool,
 * src/node/monteCarloPool.ts); without it the blocks run in this thread. The p is the same either way.
 */
export type SearchControl = Pick<Budget, 'isCancelled' | 'onProgress'> & { runBlocks?: MonteCarloBlockHook };

const METHOD_NAMES: Record<ExactPValue['method'], string> = {
  'fisher-2x2': "Fisher's exact test",
  'freeman-halton-network': 'the Freeman–Halton exact test',
  'exact-multinomial': 'the exact multinomial test',
  'monte-carlo-patefield': 'a Monte Carlo test with both margins fixed (Patefield 1981)',
  'monte-carlo-multinomial': 'a Monte Carlo multinomial test',
};

export function describePValueMethod(method: ExactPValue['method']): string {
  return METHOD_NAMES[method];
}

function sparseReason(result: TestResult): string {
  const v = result.validity;
  return `${v.cellsBelow5} of ${v.cellCount} ${result.test === 'independence' ? 'cells' : 'categories'} had expected counts below 5`;
}

/**
 * Decide which p-value leads and compute it: the asymptotic one when Cochran's rule holds (or when
 * asked), otherwise the exact test, handing over to Monte Carlo when the exact search would pass its
 * time or memory budget. Fitted distributions have no exact alternative here (their parameters were
 * estimated), so they stay asymptotic with the merge proposal as the remedy.
 */
export function choosePValue(
  result: TestResult,
  observed: number[][],
  options: PValueOptions,
  control: SearchControl = {},
): PValueChoice {
  const method = options.pValueMethod;
  if (method === 'asymptotic') return { kind: 'asymptotic' };
  if (method === 'auto' && result.validity.ok) return { kind: 'asymptotic' };
  const fitted = result.test === 'goodness-of-fit' && (result.hypothesis.kind === 'poisson' || result.hypothesis.kind === 'binomial');
  if (fitted) {
    return { kind: 'asymptotic', reason: 'No exact test is offered for a fitted distribution, because its parameter was estimated from the same counts; merging the sparse tail categories is the remedy.' };
  }
  const why = method === 'auto' ? `Because ${sparseReason(result)}` : 'As requested';
  const { runBlocks, ...hooks } = control;
  const budget: Partial<Budget> = { ...hooks, timeMs: options.exactTimeMs };
  const replicates = options.replicates > 0 ? options.replicates : monteCarloDefaultReplicates();
  // A simulation of a bounded number of replicates always ends, so only cancellation stops it.
  const simulationBudget: Partial<Budget> = { ...hooks, timeMs: Number.POSITIVE_INFINITY };
  const simulate = (stoppedBy?: 'time' | 'memory'): PValueChoice => {
    const simulation = { replicates, seed: options.seed, budget: simulationBudget, runBlocks };
    const simulated: MonteCarloComputed<ExactPValue> = result.test === 'independence'
      ? monteCarloIndependence(observed, simulation)
      : monteCarloGoodnessOfFit(observed.flat(), result.expectedProportions, simulation);
    if (!simulated.ok && simulated.reason === 'failed') return { kind: 'failed', issue: { code: 'unreadable', message: simulated.message } };
    if (!simulated.ok) return { kind: 'cancelled' };
    const handover = stoppedBy ? `, and because the exact search would pass its ${stoppedBy === 'time' ? 'time' : 'memory'} limit` : '';
    return {
      kind: 'computed',
      value: {
        ...simulated.value,
        exactStoppedBy: stoppedBy,
        reason: `${why}${handover}, the p-value is from ${METHOD_NAMES[simulated.value.method]} with ${simulated.value.replicates?.toLocaleString('en-US')} replicates (seed ${simulated.value.seed}).`,
      },
    };
  };
  if (method === 'monte-carlo') return simulate();

  if (result.test === 'independence' && result.rows === 2 && result.columns === 2) {
    const [[a, b], [c, d]] = observed;
    const fisher = fisherExact2x2([[a, b], [c, d]], { oddsRatio: false });
    return {
      kind: 'computed',
      value: { ...fisher, reason: `${why}, the p-value is from ${METHOD_NAMES['fisher-2x2']}.` },
    };
  }
  const exact: Computed<ExactPValue> = result.test === 'independence'
    ? freemanHaltonExact(observed, budget)
    : exactMultinomial(observed.flat(), result.expectedProportions, budget);
  if (exact.ok) {
    return { kind: 'computed', value: { ...exact.value, reason: `${why}, the p-value is from ${METHOD_NAMES[exact.value.method]}.` } };
  }
  if (exact.reason === 'cancelled') return { kind: 'cancelled' };
  return simulate(exact.reason);
}
