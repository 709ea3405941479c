/** Veltkamp's splitting constant 2^27 + 1 (Dekker 1971). */
const SPLITTER = 134217729;

/**
 * Dekker's TwoProduct: the rounded product p = fl(a·b) and its rounding error e, with p + e = a·b exactly.
 *
 * Dekker (1971), "A floating-point technique for extending the available precision": each factor is
 * split into two 26-bit halves whose partial products are exact in doubles.
 *
 * @param a - First factor, |a| below about 1e300 (the split overflows beyond).
 * @param b - Second factor, likewise.
 * @returns [p, e]; not exact on overflow or when e underflows.
 */
export function twoProduct(a: number, b: number): [number, number] {
  const p = a * b;
  const [aHigh, aLow] = split(a);
  const [bHigh, bLow] = split(b);
  return [p, aHigh * bHigh - p + aHigh * bLow + aLow * bHigh + aLow * bLow];
}

function split(a: number): [number, number] {
  const c = SPLITTER * a;
  const high = c - (c - a);
  return [high, a - high];
}
