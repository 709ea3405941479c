import { SortedPastPaths } from './sortedPastPaths';

/** The smallest chunk, in entries. */
const FIRST_CHUNK_ENTRIES = 4096;
/**
 * A new chunk holds this fraction of the entries the generation has used so far (and room for a few
 * lists like the one that did not fit): the chunks grow geometrically, yet at most about this
 * fraction of the memory they hold is unused.
 */
const GROWTH_FRACTION = 0.25;
const LISTS_PER_CHUNK = 4;
/** Four Float64Arrays per entry: value, term and the two prefix arrays. */
const BYTES_PER_ENTRY = 4 * 8;

/**
 * Room for the sorted lists of one frontier of the two-row network. Each list is a set of views into a
 * few large chunks instead of four arrays of its own, so building a stage of hundreds of lists costs
 * no allocation, zero-filling or trimming copies; once the stage's lists are no longer read the arena
 * is reset and its room reused for the stage after next (two arenas per frontier take turns).
 *
 * A list is taken with room for the most entries it may get (`take`), filled, then settled to what it
 * holds (`settle`), which hands the rest back before the next list is taken.
 */
export class PastPathArena {
  private past = new Float64Array(0);
  private term = new Float64Array(0);
  private prefixScaled = new Float64Array(0);
  private prefixReference = new Float64Array(0);
  private used = 0;
  /** Start of the list taken last and not yet settled (−1 if none). */
  private open = -1;
  /** Bytes of chunks outgrown during this generation, still held by lists taken from them. */
  private retiredBytes = 0;
  /** Entries of the chunks outgrown during this generation. */
  private retiredEntries = 0;

  /** Forgets every list taken since the last reset; they must no longer be read. */
  reset(): void {
    this.used = 0;
    this.open = -1;
    this.retiredBytes = 0;
    this.retiredEntries = 0;
  }

  /** An empty list whose arrays are views with room for `capacity` entries. */
  take(capacity: number): SortedPastPaths {
    if (this.open >= 0) throw new Error('PastPathArena: settle the last list before taking another');
    if (this.used + capacity > this.past.length) this.grow(capacity);
    const start = this.used;
    const end = start + capacity;
    const list = new SortedPastPaths(0);
    list.past = this.past.subarray(start, end);
    list.term = this.term.subarray(start, end);
    list.prefixScaled = this.prefixScaled.subarray(start, end);
    list.prefixReference = this.prefixReference.subarray(start, end);
    this.open = start;
    this.used = end;
    return list;
  }

  /** Shrinks the list taken last to the entries it holds and returns the rest of its room. */
  settle(list: SortedPastPaths): SortedPastPaths {
    const start = this.open;
    if (start < 0 || list.past.buffer !== this.past.buffer || list.past.byteOffset !== start * 8 || list.past.length !== this.used - start) {
      throw new Error('PastPathArena: settle takes the list taken last, unresized');
    }
    const count = list.count;
    list.past = list.past.subarray(0, count);
    list.term = list.term.subarray(0, count);
    list.prefixScaled = list.prefixScaled.subarray(0, count);
    list.prefixReference = list.prefixReference.subarray(0, count);
    this.used = start + count;
    this.open = -1;
    return list;
  }

  /** Bytes of all chunks this arena's lists may be using. */
  bytes(): number {
    return this.past.length * BYTES_PER_ENTRY + this.retiredBytes;
  }

  private grow(capacity: number): void {
    // Lists already taken keep their views of the old chunk; a new one starts empty.
    if (this.used > 0) {
      this.retiredBytes += this.past.length * BYTES_PER_ENTRY;
      this.retiredEntries += this.used;
    }
    const entries = Math.max(FIRST_CHUNK_ENTRIES, LISTS_PER_CHUNK * capacity, Math.ceil(GROWTH_FRACTION * (this.retiredEntries + this.used)));
    this.past = new Float64Array(entries);
    this.term = new Float64Array(entries);
    this.prefixScaled = new Float64Array(entries);
    this.prefixReference = new Float64Array(entries);
    this.used = 0;
  }
}
