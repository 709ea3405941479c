/** A numeric range label such as "0-4" or "10–19" (hyphen or en dash). */
const RANGE = /^\s*(-?\d+(?:[.,]\d+)?)\s*[-–]\s*(-?\d+(?:[.,]\d+)?)\s*$/;
/** An open-ended top label such as "5+", "≥5" or ">=5". */
const OPEN_ENDED = /^\s*(?:(.+?)\s*\+|(?:≥|>=)\s*(.+?))\s*$/;

/**
 * The label for categories joined by a merge: "3–4" or "4+" (from "4" and "5+") on an ordered scale,
 * "A + B" for unordered ones. Common practice for pooled classes; a single label is returned as is.
 *
 * Intuition: a merged ordered class is a range from its first to its last value; unordered
 * categories can only be listed.
 *
 * @param labels - the original labels of the merged categories, in order
 * @param ordered - whether they lie on a scale
 * @returns the merged label
 * @example mergedLabel(['4', '5+'], true) // "4+"
 */
export function mergedLabel(labels: string[], ordered: boolean): string {
  if (labels.length === 0) throw new RangeError('mergedLabel: no labels');
  if (labels.length === 1) return labels[0];
  if (!ordered) return labels.join(' + ');
  const first = labels[0].trim();
  const last = labels[labels.length - 1].trim();
  const start = RANGE.exec(first)?.[1] ?? first;
  const open = OPEN_ENDED.exec(last);
  if (open) return `${start}+`;
  const end = RANGE.exec(last)?.[2] ?? last;
  return `${start}–${end}`;
}
