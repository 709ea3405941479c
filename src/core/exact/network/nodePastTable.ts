/** A new table has room for this many past values before it doubles (load factor ≤ 1/2). */
const INITIAL_SLOTS = 8;
/** Bytes per slot: bucket, past value and weight (3 × 8). */
export const BYTES_PER_SLOT = 24;

/**
 * The distinct past-path values that reach one node of the network, each with the number of paths
 * (weighted by multiplicity) that share it. FEXACT (Mehta & Patel 1986, ACM TOMS 12, 154–161) keeps
 * past values in hash tables for the same reason: the work then grows with the distinct values at a
 * node, not with the paths. One small open-addressing table per node keeps the inserts of one edge,
 * which all go to the same child, in cache.
 *
 * Values are rounded to buckets of width 1/bucketScale; two values in one bucket differ by less than
 * that, far below the tie tolerance, and are kept as one: the first value seen, with the weights
 * summed after shifting them to that value.
 */
export class NodePastTable {
  count = 0;
  buckets: Float64Array;
  pasts: Float64Array;
  /** Path counts (0 marks an empty slot). Linear, not log: the counts stay far below 1e308. */
  weights: Float64Array;
  private mask: number;
  /** Fibonacci hashing keeps the top bits: slot = (h · 2654435769 mod 2^32) >>> shift. */
  private shift: number;

  constructor() {
    this.buckets = new Float64Array(INITIAL_SLOTS);
    this.pasts = new Float64Array(INITIAL_SLOTS);
    this.weights = new Float64Array(INITIAL_SLOTS);
    this.mask = INITIAL_SLOTS - 1;
    this.shift = 32 - Math.log2(INITIAL_SLOTS);
  }

  bytes(): number {
    return this.weights.length * BYTES_PER_SLOT;
  }

  /** Bytes the table will hold after up to `more` new values (it doubles when half full). */
  bytesAfter(more: number): number {
    let slots = this.weights.length;
    while (2 * (this.count + more) > slots - 1) slots *= 2;
    return slots * BYTES_PER_SLOT;
  }

  /** Adds past values [from, to) of a sorted list, each shifted by `shift`, with weights times `factor`. */
  addShifted(pasts: Float64Array, weights: Float64Array, from: number, to: number, shift: number, factor: number, bucketScale: number): void {
    let q = from;
    while (q < to) {
      // Room for every remaining value without growing: then the loop below needs no checks.
      if (2 * (this.count + (to - q)) > this.mask) {
        this.add(pasts[q] + shift, weights[q] * factor, bucketScale);
        q++;
        continue;
      }
      const { buckets, weights: stored, mask, shift: hashShift } = this;
      const values = this.pasts;
      let count = this.count;
      for (; q < to; q++) {
        const past = pasts[q] + shift;
        const weight = weights[q] * factor;
        const bucket = Math.round(past * bucketScale);
        let slot = Math.imul((bucket >>> 0) ^ Math.imul((bucket / 4294967296) | 0, 0x85ebca6b), 0x9e3779b1) >>> hashShift;
        for (;;) {
          const held = stored[slot];
          if (held === 0) {
            buckets[slot] = bucket;
            values[slot] = past;
            stored[slot] = weight;
            count++;
            break;
          }
          if (buckets[slot] === bucket) {
            stored[slot] = held + weight * (1 + past - values[slot]);
            break;
          }
          slot = (slot + 1) & mask;
        }
      }
      this.count = count;
    }
  }

  add(past: number, weight: number, bucketScale: number): void {
    const bucket = Math.round(past * bucketScale);
    const mask = this.mask;
    let slot = this.slotOf(bucket);
    for (;;) {
      if (this.weights[slot] === 0) break;
      if (this.buckets[slot] === bucket) {
        // First-order shift to the stored value: the values differ by less than the bucket width.
        this.weights[slot] += weight * (1 + past - this.pasts[slot]);
        return;
      }
      slot = (slot + 1) & mask;
    }
    this.buckets[slot] = bucket;
    this.pasts[slot] = past;
    this.weights[slot] = weight;
    if (2 * ++this.count > mask) this.grow();
  }

  /** The weight stored for the value `past` (which must be in the table). */
  weightOf(past: number, bucketScale: number): number {
    const bucket = Math.round(past * bucketScale);
    let slot = this.slotOf(bucket);
    while (this.buckets[slot] !== bucket || this.weights[slot] === 0) slot = (slot + 1) & this.mask;
    return this.weights[slot];
  }

  /** The home slot of an integer-valued bucket (|bucket| < 2^53). */
  private slotOf(bucket: number): number {
    const mixed = (bucket >>> 0) ^ Math.imul((bucket / 4294967296) | 0, 0x85ebca6b);
    return Math.imul(mixed, 0x9e3779b1) >>> this.shift;
  }

  private grow(): void {
    const { buckets, pasts, weights } = this;
    const size = 2 * weights.length;
    this.buckets = new Float64Array(size);
    this.pasts = new Float64Array(size);
    this.weights = new Float64Array(size);
    this.mask = size - 1;
    this.shift -= 1;
    for (let slot = 0; slot < weights.length; slot++) {
      if (weights[slot] === 0) continue;
      let target = this.slotOf(buckets[slot]);
      while (this.weights[target] !== 0) target = (target + 1) & this.mask;
      this.buckets[target] = buckets[slot];
      this.pasts[target] = pasts[slot];
      this.weights[target] = weights[slot];
    }
  }
}


