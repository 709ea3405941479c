import type { AnalyzeOptions } from '../analysis';
import type { TestResult } from '../stats/types';
import type { CountTable } from '../types';
import { writeGoodnessOfFit } from './writeGoodnessOfFit';
import { writeIndependence } from './writeIndependence';

/** The paragraph (or one line) that goes into the report beside the table. */
export function writeUp(result: TestResult, table: CountTable, options: AnalyzeOptions): string {
  return result.test === 'independence'
    ? writeIndependence(result, table, options)
    : writeGoodnessOfFit(result, table, options);
}
