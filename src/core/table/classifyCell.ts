import { stripInlineMarkup } from './stripInlineMarkup';

export type CellKind = 'empty' | 'number' | 'text';

/** Digits with the separators, sign and percent sign that people write in counts; ranges like `0-4` stay text. */
const NUMBER_LIKE = /^(?:[+\-\u2212]\s*)?(?:\d[\d.,'\u2019 \u00a0\u202f\u2009]*|[.,]\d+)%?$/;

/**
 * Sorts a cell into empty, number-like or text, to decide which rows and columns hold labels.
 * "Number-like" is generous (`1,20`, `-3`, `12%` count), so that a mistyped count is reported
 * as a bad count rather than taken for a label.
 *
 * @param text - the cell text as written (markup is stripped first)
 * @returns the kind of cell
 */
export function classifyCell(text: string): CellKind {
  const visible = stripInlineMarkup(text);
  if (visible === '') return 'empty';
  return NUMBER_LIKE.test(visible) ? 'number' : 'text';
}
