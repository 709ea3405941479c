import { BAND_WIDTH, bandReference, type SortedPastPaths } from './sortedPastPaths';

/**
 * Merges sorted runs of values, each shifted by a constant, into one sorted list, summing the
 * terms (as band-relative terms, see SortedPastPaths) of values that agree within a tolerance. A node whose parents (or children) hand it
 * sorted lists gets its own sorted list this way, without hashing or sorting.
 *
 * ## Method
 * The runs are copied side by side into one buffer, then merged pairwise, as in the merge phase of a
 * bottom-up merge sort (⌈log₂ k⌉ sequential passes for k runs), ping-ponging between two buffers; the
 * last pass writes into the target, merging equal values.
 */
export class SortedRunMerger {
  private values: Float64Array = new Float64Array(1024);
  private terms: Float64Array = new Float64Array(1024);
  private otherValues: Float64Array = new Float64Array(1024);
  private otherTerms: Float64Array = new Float64Array(1024);
  private boundaries = new Int32Array(17);
  private runs = 0;
  private filled = 0;

  /** Adds entries [from, to) of `source`, each value increased by `shift`. */
  addRun(source: SortedPastPaths, from: number, to: number, shift: number): void {
    if (to <= from) return;
    const length = to - from;
    this.reserve(this.filled + length);
    if (this.runs + 2 > this.boundaries.length) {
      const grown = new Int32Array(2 * this.boundaries.length);
      grown.set(this.boundaries);
      this.boundaries = grown;
    }
    const { values, terms } = this;
    const past = source.past;
    const term = source.term;
    let at = this.filled;
    // A shifted value may land in another band: its term is rescaled by exp(shift − bands moved·width).
    let bandsMoved = 0;
    let factor = Math.exp(shift);
    for (let q = from; q < to; q++, at++) {
      const value = past[q] + shift;
      const moved = Math.floor(value / BAND_WIDTH) - Math.floor(past[q] / BAND_WIDTH);
      if (moved !== bandsMoved) {
        bandsMoved = moved;
        factor = Math.exp(shift - moved * BAND_WIDTH);
      }
      values[at] = value;
      terms[at] = term[q] * factor;
    }
    this.boundaries[this.runs] = this.filled;
    this.runs += 1;
    this.filled = at;
    this.boundaries[this.runs] = at;
  }

  /** Bytes held by the merge buffers. */
  bytes(): number {
    return this.values.length * 32;
  }

  /** Total entries in the runs added so far. */
  pending(): number {
    return this.filled;
  }

  /** Writes the merged runs into `target` (emptied first) and forgets the runs. */
  mergeInto(target: SortedPastPaths, tolerance: number): void {
    const boundaries = this.boundaries;
    let runs = this.runs;
    while (runs > 2) {
      const { values, terms, otherValues, otherTerms } = this;
      let kept = 0;
      for (let run = 0; run < runs; run += 2) {
        const start = boundaries[run];
        if (run + 1 === runs) {
          otherValues.set(values.subarray(start, boundaries[run + 1]), start);
          otherTerms.set(terms.subarray(start, boundaries[run + 1]), start);
        } else {
          mergePair(values, terms, start, boundaries[run + 1], boundaries[run + 2], otherValues, otherTerms, start);
        }
        boundaries[kept++] = start;
      }
      boundaries[kept] = this.filled;
      runs = kept;
      this.values = otherValues;
      this.terms = otherTerms;
      this.otherValues = values;
      this.otherTerms = terms;
    }
    target.count = 0;
    target.ensureCapacity(this.filled);
    if (runs === 2) {
      mergePairInto(this.values, this.terms, boundaries[0], boundaries[1], boundaries[2], target, tolerance);
    } else if (runs === 1) {
      mergePairInto(this.values, this.terms, 0, this.filled, this.filled, target, tolerance);
    }
    target.computePrefix();
    this.runs = 0;
    this.filled = 0;
  }

  private reserve(size: number): void {
    if (this.values.length >= size) return;
    const capacity = Math.max(size, 2 * this.values.length);
    const grow = (old: Float64Array): Float64Array => {
      const grown = new Float64Array(capacity);
      grown.set(old.subarray(0, this.filled));
      return grown;
    };
    this.values = grow(this.values);
    this.terms = grow(this.terms);
    this.otherValues = new Float64Array(capacity);
    this.otherTerms = new Float64Array(capacity);
  }
}

function mergePair(
  values: Float64Array, terms: Float64Array, start: number, middle: number, end: number,
  outValues: Float64Array, outTerms: Float64Array, out: number,
): void {
  let left = start;
  let right = middle;
  while (left < middle && right < end) {
    if (values[right] < values[left]) {
      outValues[out] = values[right];
      outTerms[out++] = terms[right++];
    } else {
      outValues[out] = values[left];
      outTerms[out++] = terms[left++];
    }
  }
  while (left < middle) {
    outValues[out] = values[left];
    outTerms[out++] = terms[left++];
  }
  while (right < end) {
    outValues[out] = values[right];
    outTerms[out++] = terms[right++];
  }
}

function mergePairInto(
  values: Float64Array, terms: Float64Array, start: number, middle: number, end: number,
  target: SortedPastPaths, tolerance: number,
): void {
  const outValues = target.past;
  const outTerms = target.term;
  let count = target.count;
  let left = start;
  let right = middle;
  while (left < middle || right < end) {
    let value: number;
    let term: number;
    if (right >= end || (left < middle && values[left] <= values[right])) {
      value = values[left];
      term = terms[left++];
    } else {
      value = values[right];
      term = terms[right++];
    }
    if (count > 0 && value - outValues[count - 1] <= tolerance) {
      const shift = bandReference(value) - bandReference(outValues[count - 1]);
      outTerms[count - 1] += shift === 0 ? term : term * Math.exp(shift);
    } else {
      outValues[count] = value;
      outTerms[count++] = term;
    }
  }
  target.count = count;
}
