/**
 * Replicates per random stream. Replicate i draws from stream ⌊i / REPLICATES_PER_STREAM⌋ only, so
 * any worker can compute any block and the counts add up to the single-thread result exactly,
 * whatever the number of workers.
 */
export const REPLICATES_PER_STREAM = 1000;

const TWO_POW_26 = 67108864;
const TWO_POW_53 = 9007199254740992;
/** The golden-ratio Weyl increment of SplitMix (Steele, Lea & Flood 2014), ⌊2³²/φ⌋. */
const GOLDEN_GAMMA = 0x9e3779b9;

/**
 * The MurmurHash3 32-bit finaliser ("fmix32", Austin Appleby's MurmurHash3, 2011): a bijection on 32-bit words with full
 * avalanche, used as the output function of a 32-bit SplitMix-style seeder.
 */
function mix32(word: number): number {
  let z = word | 0;
  z ^= z >>> 16;
  z = Math.imul(z, 0x85ebca6b);
  z ^= z >>> 13;
  z = Math.imul(z, 0xc2b2ae35);
  z ^= z >>> 16;
  return z | 0;
}

/**
 * xoshiro128** 1.0 (Blackman & Vigna, "Scrambled linear pseudorandom number generators", ACM
 * Transactions on Mathematical Software 47(4), art. 36, 2021; arXiv:1805.01407, 2018): a 128-bit
 * xor/shift/rotate state with a multiply-rotate-multiply scrambler, period 2¹²⁸ − 1.
 *
 * Intuition: a fast linear recurrence supplies the bits, and the ** scrambler (multiply, rotate,
 * multiply) hides its linear structure in all 32 output bits, the low ones included.
 *
 * State words are kept as signed 32-bit integers so V8 keeps them in registers.
 */
export class Xoshiro128StarStar {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;

  /** Starts from four raw state words (not all zero); use {@link createRandom} to seed. */
  constructor(s0: number, s1: number, s2: number, s3: number) {
    if (((s0 | s1 | s2 | s3) | 0) === 0) throw new RangeError('Xoshiro128StarStar: the state must not be all zero');
    this.s0 = s0 | 0;
    this.s1 = s1 | 0;
    this.s2 = s2 | 0;
    this.s3 = s3 | 0;
  }

  /** The next output as an unsigned 32-bit integer. */
  nextUint32(): number {
    const s0 = this.s0;
    const s1 = this.s1;
    const scrambled = Math.imul(s1, 5);
    const result = Math.imul((scrambled << 7) | (scrambled >>> 25), 9);
    const t = s1 << 9;
    const s2 = this.s2 ^ s0;
    const s3 = this.s3 ^ s1;
    this.s1 = s1 ^ s2;
    this.s0 = s0 ^ s3;
    this.s2 = s2 ^ t;
    this.s3 = (s3 << 11) | (s3 >>> 21);
    return result >>> 0;
  }

  /** A uniform double in [0, 1) with 53 random bits (the top 27 and 26 bits of two outputs). */
  nextFloat(): number {
    const high = this.nextUint32() >>> 5;
    const low = this.nextUint32() >>> 6;
    return (high * TWO_POW_26 + low) / TWO_POW_53;
  }
}

/**
 * A xoshiro128** stream determined by (seed, stream) alone, so results can be reported and
 * reproduced: the same seed gives the same replicates on any machine and with any number of workers.
 *
 * ## Method
 * The four state words come from a 32-bit SplitMix-style seeder (Steele, Lea & Flood, "Fast
 * splittable pseudorandom number generators", OOPSLA 2014): Weyl steps of 0x9E3779B9 passed through
 * the MurmurHash3 finaliser. The first word is a bijection of the seed and the second, given the
 * first, a bijection of the stream index, so distinct (seed, stream) pairs start from distinct states.
 *
 * @param seed - any integer; it is reduced modulo 2³² (negative seeds wrap)
 * @param stream - the block index, a nonnegative integer below 2³²
 * @returns a generator positioned at the start of that stream
 */
export function createRandom(seed: number, stream = 0): Xoshiro128StarStar {
  if (!Number.isInteger(seed)) throw new RangeError(`createRandom: the seed must be an integer (got ${seed})`);
  if (!Number.isInteger(stream) || stream < 0 || stream > 0xffffffff) {
    throw new RangeError(`createRandom: the stream index must be an integer in [0, 2^32) (got ${stream})`);
  }
  const seedWord = seed >>> 0;
  const w0 = mix32(seedWord + GOLDEN_GAMMA);
  const w1 = mix32(((stream >>> 0) + 2 * GOLDEN_GAMMA) ^ w0);
  const w2 = mix32(w0 + w1 + 3 * GOLDEN_GAMMA);
  const w3 = mix32((w1 ^ w2) + 4 * GOLDEN_GAMMA);
  return ((w0 | w1 | w2 | w3) | 0) === 0 ? new Xoshiro128StarStar(w0, w1, w2, 1) : new Xoshiro128StarStar(w0, w1, w2, w3);
}
