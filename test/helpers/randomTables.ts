/** Seeded random inputs shared by tests and benchmarks (both must be repeatable). */

/** mulberry32, a small seeded generator for test and benchmark inputs (never for the statistics). */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A rows×columns table of `total` observations, each falling in a cell with chance ∝ its weight. */
export function tableFromWeights(random: () => number, weights: readonly number[], rows: number, columns: number, total: number): number[][] {
  const sum = weights.reduce((s, w) => s + w, 0);
  const table = Array.from({ length: rows }, () => new Array<number>(columns).fill(0));
  for (let n = 0; n < total; n++) {
    let u = random() * sum;
    let cell = 0;
    while (u > weights[cell] && cell < weights.length - 1) u -= weights[cell++];
    table[Math.floor(cell / columns)][cell % columns] += 1;
  }
  return table;
}
