import type { AnalyzeOptions } from '../core/analysis';
import type { DocumentFormat } from '../core/analyze';
import { isOneOf, listChoices, PAIRWISE_ADJUSTMENTS } from '../core/designs/designOptions';

/**
 * Tallywise's settings (package.json `contributes.configuration`, section "tallywise") mapped to
 * engine options. Pure: the caller passes a getter over `vscode.workspace.getConfiguration('tallywise')`,
 * so the mapping and its validation are tested in plain Node.
 */
export const SETTING = {
  significanceLevel: 'significanceLevel',
  confidenceLevel: 'confidenceLevel',
  decimalPlaces: 'decimalPlaces',
  continuityCorrection: 'continuityCorrection',
  pValueMethod: 'pValueMethod',
  pairwise: 'pairwiseComparisons',
  replicates: 'simulation.replicates',
  seed: 'simulation.seed',
  exactTimeLimit: 'exactSearch.timeLimitSeconds',
  writeUpStyle: 'writeUpStyle',
  codeLensEnabled: 'codeLens.enabled',
  monteCarloThreads: 'monteCarloThreads',
} as const;

/** Same bounds as the engine's resolveOptions, so a value the settings accept never fails there. */
const MAX_DECIMALS = 6;
const MAX_REPLICATES = 10_000_000;
const MAX_EXACT_SECONDS = 600;
/** Same bound as src/node/monteCarloThreadCount's MAX_MONTE_CARLO_THREADS (not imported: this file stays free of Node modules). */
const MAX_THREADS = 64;

export interface TallywiseSettings {
  /** Only the options the user set to a usable value; the engine fills the rest with its defaults. */
  options: Partial<AnalyzeOptions>;
  codeLensEnabled: boolean;
  /** Threads for Monte Carlo blocks; 0 means automatic (the cores, at most 4). */
  monteCarloThreads: number;
  /** One sentence per unusable setting: which one, what it holds, what is used instead. */
  problems: string[];
}

export type SettingsGetter = (key: string) => unknown;

/**
 * Reads and validates every Tallywise setting; an unusable value is left out (the default applies) and
 * reported, so a typo in settings.json never stops an analysis.
 *
 * @param get - returns a setting's value under "tallywise." (undefined when unset)
 * @returns engine options, the CodeLens switch and the problems found
 */
export function readSettings(get: SettingsGetter): TallywiseSettings {
  const options: Partial<AnalyzeOptions> = {};
  const problems: string[] = [];
  const complain = (key: string, value: unknown, expected: string) =>
    problems.push(`The setting tallywise.${key} is ${JSON.stringify(value)}; it must be ${expected}. The default is used instead.`);

  const alpha = get(SETTING.significanceLevel);
  if (alpha !== undefined) {
    if (typeof alpha === 'number' && alpha > 0 && alpha <= 0.5) options.alpha = alpha;
    else complain(SETTING.significanceLevel, alpha, 'a number above 0 and at most 0.5, such as 0.05');
  }
  const confidence = get(SETTING.confidenceLevel);
  if (confidence !== undefined) {
    if (typeof confidence === 'number' && confidence > 0.5 && confidence < 1) options.confidenceLevel = confidence;
    else complain(SETTING.confidenceLevel, confidence, 'a number between 0.5 and 1, such as 0.95');
  }
  const decimals = get(SETTING.decimalPlaces);
  if (decimals !== undefined) {
    if (isWholeNumber(decimals) && decimals >= 0 && decimals <= MAX_DECIMALS) options.decimals = decimals;
    else complain(SETTING.decimalPlaces, decimals, `a whole number from 0 to ${MAX_DECIMALS}`);
  }
  const continuity = get(SETTING.continuityCorrection);
  if (continuity !== undefined) {
    if (continuity === 'none' || continuity === 'yates') options.continuity = continuity;
    else complain(SETTING.continuityCorrection, continuity, '"none" or "yates"');
  }
  const method = get(SETTING.pValueMethod);
  if (method !== undefined) {
    if (method === 'auto' || method === 'exact' || method === 'monte-carlo' || method === 'asymptotic') options.pValueMethod = method;
    else complain(SETTING.pValueMethod, method, '"auto", "exact", "monte-carlo" or "asymptotic"');
  }
  const pairwise = get(SETTING.pairwise);
  if (pairwise !== undefined) {
    if (isOneOf(PAIRWISE_ADJUSTMENTS, pairwise)) options.pairwise = pairwise;
    else complain(SETTING.pairwise, pairwise, listChoices(PAIRWISE_ADJUSTMENTS, '"'));
  }
  const replicates = get(SETTING.replicates);
  if (replicates !== undefined) {
    if (isWholeNumber(replicates) && replicates >= 0 && replicates <= MAX_REPLICATES) options.replicates = replicates;
    else complain(SETTING.replicates, replicates, `a whole number from 0 (the default count) to ${MAX_REPLICATES.toLocaleString('en-US')}`);
  }
  const seed = get(SETTING.seed);
  if (seed !== undefined) {
    if (isWholeNumber(seed)) options.seed = seed;
    else complain(SETTING.seed, seed, 'a whole number');
  }
  const seconds = get(SETTING.exactTimeLimit);
  if (seconds !== undefined) {
    if (typeof seconds === 'number' && seconds > 0 && seconds <= MAX_EXACT_SECONDS) options.exactTimeMs = Math.round(seconds * 1000);
    else complain(SETTING.exactTimeLimit, seconds, `a number of seconds above 0 and at most ${MAX_EXACT_SECONDS}`);
  }
  const style = get(SETTING.writeUpStyle);
  if (style !== undefined) {
    if (style === 'paragraph') options.style = 'paragraph';
    else if (style === 'oneLine') options.style = 'line';
    else complain(SETTING.writeUpStyle, style, '"paragraph" or "oneLine"');
  }
  const lens = get(SETTING.codeLensEnabled);
  let codeLensEnabled = true;
  if (lens !== undefined) {
    if (typeof lens === 'boolean') codeLensEnabled = lens;
    else complain(SETTING.codeLensEnabled, lens, 'true or false');
  }
  const threads = get(SETTING.monteCarloThreads);
  let monteCarloThreads = 0;
  if (threads !== undefined) {
    if (isWholeNumber(threads) && threads >= 0 && threads <= MAX_THREADS) monteCarloThreads = threads;
    else complain(SETTING.monteCarloThreads, threads, `a whole number from 0 (automatic) to ${MAX_THREADS}`);
  }
  return { options, codeLensEnabled, monteCarloThreads, problems };
}

/** Markdown write-ups in Markdown files, plain text everywhere else. */
export function markupFor(format: DocumentFormat): AnalyzeOptions['markup'] {
  return format === 'markdown' ? 'markdown' : 'plain';
}

function isWholeNumber(value: unknown): value is number {
  return typeof value === 'number' && Number.isInteger(value);
}
