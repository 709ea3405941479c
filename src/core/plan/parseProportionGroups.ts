import { fail, ok } from '../types';
import type { Result } from '../types';

/**
 * Reads anticipated proportions as typed: groups separated by ";" (or "|"), values within a group by
 * "," (or spaces), each a decimal or a percentage: "0.04,0.96; 0.08,0.92" or "4%, 96%; 8%, 92%".
 * Whether each group sums to 1 is checked by the planner, which says what it sums to.
 *
 * @param text - the typed proportions
 * @returns one array of proportions per group, or a 'bad-expected' issue naming the bad entry
 */
export function parseProportionGroups(text: string): Result<number[][]> {
  const groups = text.split(/[;|]/).map((group) => group.trim());
  if (groups.every((group) => group === '')) return fail({ code: 'bad-expected', message: 'Enter proportions such as 0.3,0.7 (groups separated by ";").' });
  const parsed: number[][] = [];
  for (const [index, group] of groups.entries()) {
    if (group === '') return fail({ code: 'bad-expected', message: `Group ${index + 1} is empty; give its proportions, separated by commas.` });
    const values: number[] = [];
    for (const entry of group.split(/[,\s]+/).filter((part) => part !== '')) {
      const percent = entry.endsWith('%');
      const value = Number(percent ? entry.slice(0, -1) : entry);
      if (!Number.isFinite(value) || !/^[+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?%?$/i.test(entry)) {
        return fail({ code: 'bad-expected', message: `"${entry}" (group ${index + 1}) is not a proportion; write a number between 0 and 1, or a percentage such as 4%.` });
      }
      values.push(percent ? value / 100 : value);
    }
    parsed.push(values);
  }
  return ok(parsed);
}
