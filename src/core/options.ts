import { DEFAULT_REPORT_OPTIONS, type AnalyzeOptions } from './analysis';
import { DEFAULT_DESIGN_OPTIONS, designOptionProblem } from './designs/designOptions';
import { DEFAULT_PVALUE_OPTIONS } from './exact/choosePValue';
import { DEFAULT_TEST_OPTIONS } from './stats/types';
import { fail, ok, type Result } from './types';

export const DEFAULT_ANALYZE_OPTIONS: AnalyzeOptions = { ...DEFAULT_TEST_OPTIONS, ...DEFAULT_REPORT_OPTIONS, ...DEFAULT_PVALUE_OPTIONS, ...DEFAULT_DESIGN_OPTIONS };

/** Most Monte Carlo replicates one run may ask for (about a minute of simulation at 10×10). */
const MAX_REPLICATES = 10_000_000;
/** Longest exact search anyone should wait for in an editor. */
const MAX_EXACT_TIME_MS = 600_000;

/** Most decimals a report prints; more would be false precision for counts. */
const MAX_DECIMALS = 6;

/** Fills defaults and rejects values no analysis can use, with a message naming the option. */
export function resolveOptions(partial: Partial<AnalyzeOptions> | undefined): Result<AnalyzeOptions> {
  const options = { ...DEFAULT_ANALYZE_OPTIONS, ...partial };
  const bad = (message: string) => fail<AnalyzeOptions>({ code: 'bad-option', message });
  if (!(options.alpha > 0 && options.alpha <= 0.5)) {
    return bad(`The significance level must be above 0 and at most 0.5 (got ${options.alpha}); 0.05 is usual.`);
  }
  if (!(options.confidenceLevel > 0.5 && options.confidenceLevel < 1)) {
    return bad(`The confidence level must be between 0.5 and 1 (got ${options.confidenceLevel}); 0.95 is usual.`);
  }
  if (!Number.isInteger(options.decimals) || options.decimals < 0 || options.decimals > MAX_DECIMALS) {
    return bad(`Decimal places must be a whole number from 0 to ${MAX_DECIMALS} (got ${options.decimals}).`);
  }
  if (options.continuity !== 'none' && options.continuity !== 'yates') {
    return bad(`The continuity correction must be "none" or "yates" (got "${String(options.continuity)}").`);
  }
  if (!['auto', 'exact', 'monte-carlo', 'asymptotic'].includes(options.pValueMethod)) {
    return bad(`The p-value method must be auto, exact, monte-carlo or asymptotic (got "${String(options.pValueMethod)}").`);
  }
  if (!Number.isInteger(options.replicates) || options.replicates < 0 || options.replicates > MAX_REPLICATES) {
    return bad(`Monte Carlo replicates must be a whole number from 1 to ${MAX_REPLICATES.toLocaleString('en-US')}, or 0 for the default (got ${options.replicates}).`);
  }
  if (!Number.isInteger(options.seed)) return bad(`The seed must be a whole number (got ${options.seed}).`);
  if (!(options.exactTimeMs > 0 && options.exactTimeMs <= MAX_EXACT_TIME_MS)) {
    return bad(`The exact-search time limit must be above 0 and at most ${MAX_EXACT_TIME_MS / 1000} s (got ${options.exactTimeMs} ms).`);
  }
  const designProblem = designOptionProblem(options);
  if (designProblem) return bad(designProblem);
  return ok(options);
}
