import type { AnalyzeOptions } from '../analysis';
import type { ChosenPValue } from '../exact/choosePValue';
import type { TestResult } from '../stats/types';
import type { CountTable } from '../types';
import { writeGoodnessOfFit } from './writeGoodnessOfFit';
import { writeIndependence } from './writeIndependence';

/** The paragraph (or one line) that goes into the report beside the table. */
export function writeUp(result: TestResult, table: CountTable, options: AnalyzeOptions, exact?: ChosenPValue, exactNote?: string): string {
  return result.test === 'independence'
    ? writeIndependence(result, table, options, exact, exactNote)
    : writeGoodnessOfFit(result, table, options, exact, exactNote);
}
