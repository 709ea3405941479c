/** The delimiters tried on a header line, in the order that breaks ties. */
export const CANDIDATE_DELIMITERS = [',', '\t', ';', '|'];

const QUOTE = 34;

/**
 * Picks the field delimiter of raw data from its header line: the candidate that occurs most often
 * outside double quotes (ties go to the earlier in `CANDIDATE_DELIMITERS`; none found gives a comma).
 *
 * @param headerLine - the first non-blank line of the text, without its line break
 * @returns one of `,` tab `;` `|`
 * @example detectDelimiter('van;shift;late') // ';'
 */
export function detectDelimiter(headerLine: string): string {
  let best = CANDIDATE_DELIMITERS[0];
  let bestCount = 0;
  for (const candidate of CANDIDATE_DELIMITERS) {
    const code = candidate.charCodeAt(0);
    let count = 0;
    let inQuotes = false;
    for (let i = 0; i < headerLine.length; i++) {
      const c = headerLine.charCodeAt(i);
      if (c === QUOTE) inQuotes = !inQuotes;
      else if (c === code && !inQuotes) count++;
    }
    if (count > bestCount) {
      best = candidate;
      bestCount = count;
    }
  }
  return best;
}
