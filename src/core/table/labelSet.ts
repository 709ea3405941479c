import type { SourceLocation } from '../types';

/** More distinct values than this in a chosen column means identifiers or measurements, not categories (project decision). */
export const MAX_CATEGORIES = 1000;

/** The label under which rows with an empty category value are counted. */
export const BLANK_LABEL = '(blank)';

/** Raw texts remembered per column; beyond this, new spellings take the slower path (project decision). */
const MAX_CACHED_TEXTS = 4 * MAX_CATEGORIES;

/** A field text already seen, mapped to its label's index, so repeated labels are found without slicing. */
interface CachedLabel {
  text: string;
  index: number;
}

/**
 * The distinct labels of one cross-tabulated column, interned to small indices in first-appearance order,
 * with a cache from the hash of a field's raw text to its index so that the scanner can recognise a label
 * in place without slicing it.
 */
export interface LabelSet {
  /** The column's header name, for messages. */
  name: string;
  index: Map<string, number>;
  labels: string[];
  blankRows: number;
  firstBlank?: SourceLocation;
  cache: Map<number, CachedLabel>;
}

export function newLabelSet(name: string): LabelSet {
  return { name, index: new Map(), labels: [], blankRows: 0, cache: new Map() };
}

/** A 32-bit hash of `text` from `start` to `end` (polynomial, base 31); collisions are resolved by `sameText`. */
export function hashText(text: string, start: number, end: number): number {
  let hash = end - start;
  for (let k = start; k < end; k++) hash = (Math.imul(hash, 31) + text.charCodeAt(k)) | 0;
  return hash;
}

/** Whether `text` equals `chunk` from `start` to `end`; a plain loop, as `startsWith` at an offset is slow in V8. */
function sameText(text: string, chunk: string, start: number, end: number): boolean {
  if (text.length !== end - start) return false;
  for (let k = 0; k < text.length; k++) {
    if (text.charCodeAt(k) !== chunk.charCodeAt(start + k)) return false;
  }
  return true;
}

/** The index of the label whose raw text is `chunk` from `start` to `end`, if seen before; else -1. */
export function findCachedLabel(set: LabelSet, chunk: string, start: number, end: number): number {
  const cached = set.cache.get(hashText(chunk, start, end));
  return cached !== undefined && sameText(cached.text, chunk, start, end) ? cached.index : -1;
}

/**
 * Interns a field's text (trimmed; empty counts under `(blank)`, remembered with where it first occurred).
 *
 * @returns the label's index, or -1 when it would be label number `MAX_CATEGORIES + 1`
 */
export function internLabel(set: LabelSet, raw: string, line: number, column: number): number {
  let label = raw.trim();
  if (label === '') {
    label = BLANK_LABEL;
    set.blankRows++;
    if (set.firstBlank === undefined) set.firstBlank = { line, column };
  }
  let index = set.index.get(label);
  if (index === undefined) {
    if (set.labels.length >= MAX_CATEGORIES) return -1;
    index = set.labels.length;
    set.labels.push(label);
    set.index.set(label, index);
  }
  if (label !== BLANK_LABEL && set.cache.size < MAX_CACHED_TEXTS) {
    const hash = hashText(raw, 0, raw.length);
    if (!set.cache.has(hash)) set.cache.set(hash, { text: raw, index });
  }
  return index;
}
