import type { NodePastTable } from './nodePastTable';

/**
 * Values are grouped in bands of this width (log units); a value v is stored as the term
 * weight·exp(v − reference(v)), where reference(v) is the top of its band, so the terms lie in
 * [weight·e^−256, weight]: sums need no exp per entry, and even the product of two terms (≥ e^−512)
 * stays far above the smallest double (≈ e^−708).
 */
export const BAND_WIDTH = 256;

/** The top of the band holding `value`. */
export function bandReference(value: number): number {
  return BAND_WIDTH * (Math.floor(value / BAND_WIDTH) + 1);
}

/** The stored term of a value with the given weight. */
export function termOf(value: number, weight: number): number {
  return weight * Math.exp(value - bandReference(value));
}

/**
 * Past values (or completion values) of one node sorted ascending, each with its weight (a path
 * count) expressed as a term relative to its band, and prefix sums of weight·exp(value), so that
 * "all values up to v" costs one binary search and one lookup.
 */
export class SortedPastPaths {
  count = 0;
  past: Float64Array;
  /** weight[q]·exp(past[q]) = term[q]·exp(bandReference(past[q])). */
  term: Float64Array;
  /** Path counts, kept only by `load` (the r × c network moves them on to child nodes). */
  weight: Float64Array;
  /** Σ_{q' ≤ q} weight[q']·exp(past[q']) = prefixScaled[q]·exp(prefixReference[q]). */
  prefixScaled: Float64Array;
  prefixReference: Float64Array;
  /**
   * For completion lists: log of the total weight·exp(value) of completions that were folded in
   * because they count for every past value that can still reach the node (−Infinity if none).
   */
  alwaysLogMass = -Infinity;

  constructor(capacity = 64) {
    this.past = new Float64Array(capacity);
    this.term = new Float64Array(capacity);
    this.weight = new Float64Array(0);
    this.prefixScaled = new Float64Array(capacity);
    this.prefixReference = new Float64Array(capacity);
  }

  /** Loads and sorts the entries of `table`. */
  load(table: NodePastTable, bucketScale: number): void {
    const count = table.count;
    this.count = 0;
    this.reserve(count);
    if (this.weight.length < this.past.length) this.weight = new Float64Array(this.past.length);
    let filled = 0;
    const weights = table.weights;
    for (let slot = 0; slot < weights.length; slot++) if (weights[slot] !== 0) this.past[filled++] = table.pasts[slot];
    this.past.subarray(0, count).sort();
    for (let q = 0; q < count; q++) {
      const value = this.past[q];
      const weight = table.weightOf(value, bucketScale);
      this.weight[q] = weight;
      this.term[q] = termOf(value, weight);
    }
    this.count = count;
    this.computePrefix();
  }

  /** Makes room for `capacity` entries, keeping the first `count` (the prefix sums are recomputed later). */
  ensureCapacity(capacity: number): void {
    this.reserve(capacity);
  }

  /**
   * Appends a value (≥ every value held) with its term, merging it into the last one when within
   * `tolerance` (then the term is moved to the last value's band if the two straddle a band edge).
   */
  push(value: number, term: number, tolerance: number): void {
    const count = this.count;
    if (count > 0 && value - this.past[count - 1] <= tolerance) {
      const last = this.past[count - 1];
      const shift = bandReference(value) - bandReference(last);
      this.term[count - 1] += shift === 0 ? term : term * Math.exp(shift);
      return;
    }
    if (count === this.past.length) this.reserve(2 * count + 16);
    this.past[count] = value;
    this.term[count] = term;
    this.count = count + 1;
  }

  /** Fills the prefix sums; call once the values and terms are in place. */
  computePrefix(): void {
    let reference = this.count > 0 ? bandReference(this.past[0]) : 0;
    let scaled = 0;
    for (let q = 0; q < this.count; q++) {
      const band = bandReference(this.past[q]);
      if (band !== reference) {
        scaled *= Math.exp(reference - band);
        reference = band;
      }
      scaled += this.term[q];
      this.prefixScaled[q] = scaled;
      this.prefixReference[q] = reference;
    }
  }

  /** log Σ_{q' ≤ q} weight[q']·exp(past[q']). */
  logPrefixMass(q: number): number {
    return Math.log(this.prefixScaled[q]) + this.prefixReference[q];
  }

  /** How many values are ≤ limit. */
  countAtMost(limit: number): number {
    const past = this.past;
    let low = 0;
    let high = this.count;
    if (high === 0 || past[0] > limit) return 0;
    if (past[high - 1] <= limit) return high;
    while (low < high) {
      const middle = (low + high) >>> 1;
      if (past[middle] <= limit) low = middle + 1;
      else high = middle;
    }
    return low;
  }

  /** Shrinks the arrays to the entries held (for lists that are kept). */
  trim(): this {
    if (this.past.length === this.count) return this;
    this.past = this.past.slice(0, this.count);
    this.term = this.term.slice(0, this.count);
    this.prefixScaled = this.prefixScaled.slice(0, this.count);
    this.prefixReference = this.prefixReference.slice(0, this.count);
    if (this.weight.length > 0) this.weight = this.weight.slice(0, this.count);
    return this;
  }

  bytes(): number {
    return (this.past.length * 4 + this.weight.length) * 8;
  }

  private reserve(capacity: number): void {
    if (this.past.length >= capacity) return;
    const grown = Math.max(capacity, 2 * this.past.length);
    const count = this.count;
    this.past = copy(this.past, grown, count);
    this.term = copy(this.term, grown, count);
    if (this.weight.length > 0) this.weight = copy(this.weight, grown, count);
    this.prefixScaled = new Float64Array(grown);
    this.prefixReference = new Float64Array(grown);
  }
}

function copy(values: Float64Array, capacity: number, count: number): Float64Array {
  const grown = new Float64Array(capacity);
  grown.set(values.subarray(0, count));
  return grown;
}
