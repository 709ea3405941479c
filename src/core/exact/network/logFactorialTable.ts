import { logGamma } from '../../special/logGamma';

/** A long table is filled in chunks of this many entries, asking `shouldStop` in between. */
const CHUNK = 1 << 16;

/**
 * log k! for k = 0…n, as one table the network search reads in its inner loops.
 *
 * Factorials overflow doubles beyond 170!, so exact tests work with their logarithms; each entry
 * is log Γ(k + 1) from the FreeBSD msun `lgamma` port (about one unit in the last place), not a
 * running sum of logs, so the error does not grow with k.
 *
 * @param n - The largest k needed (a non-negative integer, usually the table total N).
 * @param shouldStop - Asked between chunks of entries (tables for huge N take a while to fill).
 * @returns A Float64Array of length n + 1 with entry k equal to log k!, or undefined if stopped.
 * @example logFactorialTable(4)[4] // ≈ 3.1780538303479458 = log 24
 */
export function logFactorialTable(n: number): Float64Array;
export function logFactorialTable(n: number, shouldStop: () => boolean): Float64Array | undefined;
export function logFactorialTable(n: number, shouldStop: () => boolean = () => false): Float64Array | undefined {
  const table = new Float64Array(n + 1);
  for (let start = 2; start <= n; start += CHUNK) {
    if (start > 2 && shouldStop()) return undefined;
    const end = Math.min(n, start + CHUNK - 1);
    for (let k = start; k <= end; k++) table[k] = logGamma(k + 1);
  }
  return table;
}
