import { DEFAULT_REPORT_OPTIONS, type AnalyzeOptions } from './analysis';
import { DEFAULT_TEST_OPTIONS } from './stats/types';
import { fail, ok, type Result } from './types';

export const DEFAULT_ANALYZE_OPTIONS: AnalyzeOptions = { ...DEFAULT_TEST_OPTIONS, ...DEFAULT_REPORT_OPTIONS };

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
  return ok(options);
}
