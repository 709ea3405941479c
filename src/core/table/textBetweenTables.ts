import { stripInlineMarkup } from './stripInlineMarkup';

/**
 * Reading the lines around tables in a note, for stratified 2×2×K input: whether two tables stand close
 * enough to be strata of one design, and the name a table is given by the line above it.
 */

/** At most this many lines of running text between two strata (project decision: one short paragraph). */
export const MAX_TEXT_LINES_BETWEEN_STRATA = 3;

/** At most this many characters of running text between two strata (project decision: one short paragraph). */
export const MAX_TEXT_CHARACTERS_BETWEEN_STRATA = 300;

/** A line longer than this is a sentence, not a stratum's name (project decision). */
export const MAX_STRATUM_LABEL_LENGTH = 80;

type LineKind = 'blank' | 'heading' | 'underline' | 'text' | 'other';

const ATX_HEADING = /^ {0,3}#{1,6}(?:[ \t]|$)/;
const SETEXT_UNDERLINE = /^ {0,3}(?:=+|-+)[ \t]*$/;
/** Block quotes, list items, fences, HTML, table rows and indented code: not a heading or a line of text. */
const OTHER_BLOCK = /^(?: {0,3}(?:>|[-+*][ \t]|\d{1,9}[.)][ \t]|```|~~~|<|\|)| {4}|\t)/;

function kindOf(lines: readonly string[], index: number): LineKind {
  const line = lines[index];
  if (/^\s*$/.test(line)) return 'blank';
  if (ATX_HEADING.test(line)) return 'heading';
  if (SETEXT_UNDERLINE.test(line) && index > 0 && kindOf(lines, index - 1) === 'text') return 'underline';
  if (OTHER_BLOCK.test(line) || SETEXT_UNDERLINE.test(line)) return 'other';
  return 'text';
}

/**
 * Whether the lines strictly between two tables let them stand as neighbouring strata: only blank lines,
 * headings, and at most one short paragraph of text.
 *
 * @param lines - the document's lines (line N is element N - 1)
 * @param afterLine - the first table's last line (1-based)
 * @param beforeLine - the second table's first line (1-based)
 */
export function joinsStrata(lines: readonly string[], afterLine: number, beforeLine: number): boolean {
  let paragraphs = 0;
  let textLines = 0;
  let characters = 0;
  let inParagraph = false;
  for (let index = afterLine; index < beforeLine - 1; index++) {
    const kind = kindOf(lines, index);
    if (kind === 'other') return false;
    if (kind === 'text' && !(index + 1 < beforeLine - 1 && kindOf(lines, index + 1) === 'underline')) {
      if (!inParagraph) paragraphs++;
      inParagraph = true;
      textLines++;
      characters += lines[index].trim().length;
    } else {
      inParagraph = false;
    }
  }
  return paragraphs <= 1 && textLines <= MAX_TEXT_LINES_BETWEEN_STRATA && characters <= MAX_TEXT_CHARACTERS_BETWEEN_STRATA;
}

/** A heading's or line's visible words: `## **Route A:**` -> `Route A`. */
export function cleanLabel(line: string): string {
  const withoutHashes = line.replace(/^ {0,3}#{1,6}(?=[ \t]|$)/, '').replace(/[ \t]+#+[ \t]*$/, '');
  return stripInlineMarkup(withoutHashes).replace(/\s*:\s*$/, '').trim();
}

/**
 * The name given to a table by the nearest heading or short line of text above it (not reaching above
 * `topLine`): a heading (ATX or setext), or a paragraph of one line of at most `MAX_STRATUM_LABEL_LENGTH`
 * characters. Markup, `#` and a trailing colon are stripped.
 *
 * @param lines - the document's lines
 * @param tableStartLine - the table's first line (1-based)
 * @param topLine - the first line that may hold the name (1-based), e.g. the line after the previous table
 * @returns the name, or '' when the nearest line above is no name (a long paragraph, a list, another table)
 */
export function labelAbove(lines: readonly string[], tableStartLine: number, topLine: number): string {
  let index = tableStartLine - 2;
  while (index >= topLine - 1 && kindOf(lines, index) === 'blank') index--;
  if (index < topLine - 1) return '';
  const kind = kindOf(lines, index);
  if (kind === 'heading') return cleanLabel(lines[index]);
  if (kind === 'underline') return index - 1 >= topLine - 1 ? cleanLabel(lines[index - 1]) : '';
  if (kind !== 'text') return '';
  const startsParagraph = index === topLine - 1 || kindOf(lines, index - 1) !== 'text';
  const label = cleanLabel(lines[index]);
  return startsParagraph && label.length <= MAX_STRATUM_LABEL_LENGTH ? label : '';
}
