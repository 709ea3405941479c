/**
 * Knuth's TwoSum: the rounded sum s = fl(a + b) and its rounding error e, with s + e = a + b exactly.
 *
 * The building block of double-double arithmetic (Knuth, TAOCP vol. 2, §4.2.2), used where a
 * result needs a few more bits than a double holds.
 *
 * @param a - First addend.
 * @param b - Second addend.
 * @returns [s, e]; not exact if the sum overflows.
 */
export function twoSum(a: number, b: number): [number, number] {
  const s = a + b;
  const bVirtual = s - a;
  return [s, a - (s - bVirtual) + (b - bVirtual)];
}
