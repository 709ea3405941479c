import { analyze } from '../src/core/analyze';
import type { StratumTable } from '../src/core/designs/cochranMantelHaenszel';
import { exactStratifiedTest, MAX_EXACT_SUPPORT } from '../src/core/designs/exactStratifiedTest';
import { medianMs, type Figure } from './timing';

/** Invented: a courier firm's damaged parcels by packing line in K depots, as Markdown tables in a row. */
function strataNote(strata: number): string {
  const parts: string[] = [];
  for (let k = 0; k < strata; k++) {
    parts.push(`## Depot ${k + 1}`, '', '| Line | Damaged | Intact |', '|---|---|---|', `| Line A | ${5 + (k % 4)} | ${90 + k} |`, `| Line B | ${3 + (k % 3)} | ${95 + 2 * k} |`, '');
  }
  return parts.join('\n');
}

/**
 * Timings of the design analyses. No issue sets a target for them; they are printed so a slow
 * change shows. The exact stratified test is timed at its largest allowed support, its worst case.
 */
export function benchDesigns(): Figure[] {
  const note = strataNote(20);
  const stratified = () => analyze({ text: note, format: 'markdown', line: 3, options: { design: 'stratified' } });
  // Each stratum's a ranges over 0…2q, so two strata of q per cell use the whole support.
  const q = MAX_EXACT_SUPPORT / 4;
  const widest: StratumTable[] = [[[q, q], [q, q]], [[q, q], [q, q]]];
  const many: StratumTable[] = Array.from({ length: 50 }, (_, k) => [[1 + (k % 3), 20], [k % 2, 25]] as StratumTable);
  const ski = '| Instructor | Completed | Left early | No-show |\n|---|---|---|---|\n| A | 88 | 9 | 6 |\n| B | 71 | 18 | 9 |\n| C | 95 | 7 | 4 |\n| D | 64 | 21 | 20 |\n| E | 70 | 15 | 11 |\n| F | 80 | 12 | 9 |\n';
  const pairwise = () => analyze({ text: ski, format: 'markdown', line: 1 });
  return [
    { name: 'stratified analysis from 20 Markdown 2×2 tables (find, CMH, write-up)', value: medianMs(stratified), unit: 'ms' },
    { name: `exact stratified test, 2 strata at the support limit (${MAX_EXACT_SUPPORT})`, value: medianMs(() => { if (!exactStratifiedTest(widest)) throw new Error('over the support limit'); }, 1500), unit: 'ms' },
    { name: 'exact stratified test, 50 small strata', value: medianMs(() => exactStratifiedTest(many)), unit: 'ms' },
    { name: 'r×c analysis with pairwise comparisons, 6×3 (15 pairs)', value: medianMs(pairwise), unit: 'ms' },
  ];
}
