import type { Analysis, AnalyzeOptions } from '../analysis';
import { followUpSentences } from './writeFollowUps';
import { writeGoodnessOfFit } from './writeGoodnessOfFit';
import { writeIndependence } from './writeIndependence';
import { writePaired } from './writePaired';
import { writeStratified } from './writeStratified';

/** What a write-up is made from: an analysis before (or apart from) its formatted text. */
export type WriteUpInput = Pick<Analysis, 'kind' | 'result' | 'table' | 'exact' | 'exactNote' | 'followUps' | 'paired' | 'stratified'>;

/** The paragraph (or one line) that goes into the report beside the table. */
export function writeUp(analysis: WriteUpInput, options: AnalyzeOptions): string {
  const { result, table, exact, exactNote } = analysis;
  if (analysis.kind === 'paired' && analysis.paired) return writePaired(analysis.paired, table, options);
  if (analysis.kind === 'stratified' && analysis.stratified && result.test === 'independence') {
    return writeStratified(analysis.stratified, table, result, options);
  }
  if (result.test !== 'independence') return writeGoodnessOfFit(result, table, options, exact, exactNote);
  return writeIndependence(result, table, options, exact, exactNote, (significant) => followUpSentences(analysis.followUps, significant, options));
}
