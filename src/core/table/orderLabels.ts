import { BLANK_LABEL } from './labelSet';

const PLAIN_NUMBER_LABEL = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)$/;
const RANGE_LABEL = /^(\d+(?:\.\d+)?)\s*(?:-|\u2013|to)\s*\d+(?:\.\d+)?$/;
const OPEN_ABOVE_LABEL = /^(?:(?:>=?|\u2265)\s*(\d+(?:\.\d+)?)|(\d+(?:\.\d+)?)\s*\+)$/;
const OPEN_BELOW_LABEL = /^(?:<=?|\u2264)\s*(\d+(?:\.\d+)?)$/;
const LABEL_COLLATOR = new Intl.Collator('en', { numeric: true, sensitivity: 'variant' });

/** Sort key of a label that reads as a number or a numeric range, with a rank so `<5` < `5` < `5+`. */
function numericLabelKey(label: string): [number, number] | undefined {
  if (PLAIN_NUMBER_LABEL.test(label)) return [Number(label), 1];
  let match = RANGE_LABEL.exec(label);
  if (match) return [Number(match[1]), 1];
  match = OPEN_BELOW_LABEL.exec(label);
  if (match) return [Number(match[1]), 0];
  match = OPEN_ABOVE_LABEL.exec(label);
  if (match) return [Number(match[1] ?? match[2]), 2];
  return undefined;
}

/**
 * The display order of a cross-tabulated variable's labels, so the table never depends on the order of the rows:
 * numerically when every label reads as a number or a numeric range (`3`, `0-4`, `<5`, `65+`), otherwise
 * alphabetically (English collation, digits compared as numbers). `(blank)` always goes last.
 *
 * @param labels - the labels in first-appearance order
 * @returns indices into `labels` in display order, and whether that order is numeric
 * @example orderLabels(['10', '2', '(blank)']) // { order: [1, 0, 2], ordered: true }
 */
export function orderLabels(labels: readonly string[]): { order: number[]; ordered: boolean } {
  const keys = labels.map(numericLabelKey);
  const present = labels.map((_, index) => index).filter((index) => labels[index] !== BLANK_LABEL);
  const ordered = present.length > 0 && present.every((index) => keys[index] !== undefined);
  const byText = (a: number, b: number): number =>
    LABEL_COLLATOR.compare(labels[a], labels[b]) || (labels[a] < labels[b] ? -1 : labels[a] > labels[b] ? 1 : 0);
  const byKey = (a: number, b: number): number => {
    const [keyA, rankA] = keys[a] as [number, number];
    const [keyB, rankB] = keys[b] as [number, number];
    return keyA - keyB || rankA - rankB || byText(a, b);
  };
  const order = present.sort(ordered ? byKey : byText);
  const blank = labels.indexOf(BLANK_LABEL);
  if (blank >= 0) order.push(blank);
  return { order, ordered };
}
