import { BAND_WIDTH, bandReference, type SortedPastPaths } from './sortedPastPaths';

/**
 * Merges sorted runs of values, each shifted by a constant, into one sorted list, summing the
 * terms (as band-relative terms, see SortedPastPaths) of values that agree within a tolerance. A node whose parents (or children) hand it
 * sorted lists gets its own sorted list this way, without hashing or sorting.
 *
 * ## Method
 * The runs are copied side by side into one buffer, then merged pairwise, as in the merge phase of a
 * bottom-up merge sort (⌈log₂ k⌉ sequential passes for k runs), ping-ponging between two buffers; the
 * last pass writes into the target. Every pass merges values within the tolerance of the last value
 * written (keeping that one), so the many equal values that reach a node by several paths (columns
 * with equal totals) are summed as soon as two runs meet and later passes move fewer entries. A value
 * can so move by at most ⌈log₂ k⌉ tolerances, still far below any tie tolerance.
 */
export class SortedRunMerger {
  private values: Float64Array = new Float64Array(1024);
  private terms: Float64Array = new Float64Array(1024);
  private otherValues: Float64Array = new Float64Array(1024);
  private otherTerms: Float64Array = new Float64Array(1024);
  /** Run r occupies [starts[r], ends[r]) of the current buffer (merged runs leave gaps). */
  private starts: Int32Array = new Int32Array(16);
  private ends: Int32Array = new Int32Array(16);
  private runs = 0;
  private filled = 0;

  /** Adds entries [from, to) of `source`, each value increased by `shift`. */
  addRun(source: SortedPastPaths, from: number, to: number, shift: number): void {
    if (to <= from) return;
    const length = to - from;
    this.reserve(this.filled + length);
    if (this.runs === this.starts.length) {
      this.starts = grownCopy(this.starts);
      this.ends = grownCopy(this.ends);
    }
    const { values, terms } = this;
    const past = source.past;
    const term = source.term;
    let at = this.filled;
    // A shifted value may land in another band: its term is rescaled by exp(shift − bands moved·width).
    // Values ascend, so the bands are recomputed only when a value or its shifted value reaches the
    // top of its band (BAND_WIDTH is a power of two: value / BAND_WIDTH is exact).
    let sourceTop = -Infinity;
    let shiftedTop = -Infinity;
    let factor = 1;
    for (let q = from; q < to; q++, at++) {
      const source = past[q];
      const value = source + shift;
      if (source >= sourceTop || value >= shiftedTop) {
        const sourceBand = Math.floor(source / BAND_WIDTH);
        const shiftedBand = Math.floor(value / BAND_WIDTH);
        sourceTop = (sourceBand + 1) * BAND_WIDTH;
        shiftedTop = (shiftedBand + 1) * BAND_WIDTH;
        factor = Math.exp(shift - (shiftedBand - sourceBand) * BAND_WIDTH);
      }
      values[at] = value;
      terms[at] = term[q] * factor;
    }
    this.starts[this.runs] = this.filled;
    this.ends[this.runs] = at;
    this.runs += 1;
    this.filled = at;
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
    const { starts, ends } = this;
    let runs = this.runs;
    while (runs > 2) {
      const { values, terms, otherValues, otherTerms } = this;
      let kept = 0;
      for (let run = 0; run < runs; run += 2) {
        const start = starts[run];
        let end: number;
        if (run + 1 === runs) {
          end = ends[run];
          otherValues.set(values.subarray(start, end), start);
          otherTerms.set(terms.subarray(start, end), start);
        } else {
          end = mergePair(values, terms, start, ends[run], values, terms, starts[run + 1], ends[run + 1], otherValues, otherTerms, start, tolerance);
        }
        starts[kept] = start;
        ends[kept++] = end;
      }
      runs = kept;
      this.values = otherValues;
      this.terms = otherTerms;
      this.otherValues = values;
      this.otherTerms = terms;
    }
    target.count = 0;
    target.ensureCapacity(this.filled);
    const { values, terms } = this;
    if (runs === 2) {
      target.count = mergePair(values, terms, starts[0], ends[0], values, terms, starts[1], ends[1], target.past, target.term, 0, tolerance);
    } else if (runs === 1) {
      target.count = mergePair(values, terms, starts[0], ends[0], values, terms, ends[0], ends[0], target.past, target.term, 0, tolerance);
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

function grownCopy(values: Int32Array): Int32Array {
  const grown = new Int32Array(2 * values.length);
  grown.set(values);
  return grown;
}

/**
 * Merges [leftStart, leftEnd) of `leftValues`/`leftTerms` and [rightStart, rightEnd) of `rightValues`/
 * `rightTerms` into `outValues`/`outTerms` from `out` on, summing into the last written entry every value within `tolerance` of it (its term moved
 * to that entry's band when the two straddle a band edge). Returns the end of what was written.
 */
function mergePair(
  leftValues: Float64Array, leftTerms: Float64Array, leftStart: number, leftEnd: number,
  rightValues: Float64Array, rightTerms: Float64Array, rightStart: number, rightEnd: number, outValues: Float64Array, outTerms: Float64Array, out: number, tolerance: number,
): number {
  const first = out;
  let left = leftStart;
  let right = rightStart;
  let lastValue = -Infinity;
  let lastTop = NaN;
  while (left < leftEnd || right < rightEnd) {
    let value: number;
    let term: number;
    if (right >= rightEnd || (left < leftEnd && leftValues[left] <= rightValues[right])) {
      value = leftValues[left];
      term = leftTerms[left++];
    } else {
      value = rightValues[right];
      term = rightTerms[right++];
    }
    if (out > first && value - lastValue <= tolerance) {
      // The top of the last value's band, found once per entry that others merge into.
      if (lastTop !== lastTop) lastTop = bandReference(lastValue);
      outTerms[out - 1] += value < lastTop ? term : term * Math.exp(bandReference(value) - lastTop);
    } else {
      outValues[out] = value;
      outTerms[out++] = term;
      lastValue = value;
      lastTop = NaN;
    }
  }
  return out;
}
