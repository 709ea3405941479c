/**
 * Number formatting for reports, in the common reporting style for statistics
 * (common practice): p and correlation-like values without a leading zero, "p < .001" below
 * that, test statistics to two decimals. Never prints NaN: a non-finite value becomes "—".
 */

const DASH = '—';

/** Fixed decimals with a true minus sign; "—" for non-finite input. */
export function formatFixed(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return DASH;
  const magnitude = Math.abs(value);
  const text = magnitude.toFixed(decimals);
  // A negative value that rounds to zero prints without a sign; only those need the string check.
  const roundsToZero = magnitude < 10 ** -decimals && Number(text) === 0;
  return (value < 0 && !roundsToZero ? '−' : '') + text;
}

/** Signed fixed decimals: "+3.41" / "−2.07". */
export function formatSigned(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return DASH;
  const text = formatFixed(value, decimals);
  return value > 0 && Number(Math.abs(value).toFixed(decimals)) !== 0 ? '+' + text : text;
}

/** A value bounded by 1 in magnitude (V, phi, p) with no leading zero: ".27", "−.05", "1.00". */
export function formatNoLeadingZero(value: number, decimals: number): string {
  return formatFixed(value, decimals).replace(/^(−?)0\./, '$1.');
}

/**
 * "p = .010", "p = .43", "p < .001". Three decimals below .1 and two above keep enough digits to be
 * read against .05 and .01 without false precision (common practice).
 */
export function formatPValue(p: number): string {
  if (!Number.isFinite(p)) return `p = ${DASH}`;
  if (p < 0.001) return 'p < .001';
  const decimals = p < 0.1 ? 3 : 2;
  const rounded = Number(p.toFixed(decimals));
  if (rounded >= 1) return 'p > .99';
  return `p = ${formatNoLeadingZero(p, decimals)}`;
}

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
};

/**
 * The exact size of a small p from its log10, for panels and notes: "3.2 × 10⁻⁸".
 * Works below the smallest double because it only uses log10p.
 */
export function formatScientificFromLog10(log10p: number, digits = 2): string {
  if (!Number.isFinite(log10p)) return DASH;
  let exponent = Math.floor(log10p);
  let mantissa = Math.pow(10, log10p - exponent);
  if (Number(mantissa.toFixed(digits - 1)) >= 10) {
    mantissa /= 10;
    exponent += 1;
  }
  const power = String(exponent).split('').map((ch) => SUPERSCRIPT[ch] ?? ch).join('');
  return `${mantissa.toFixed(digits - 1)} × 10${power}`;
}

/** p for detail views: plain decimals down to .0001, scientific below, from log10p when p underflows. */
export function formatExactP(p: number, log10p: number): string {
  if (Number.isFinite(p) && p >= 1e-4) return formatNoLeadingZero(p, 4);
  return formatScientificFromLog10(log10p);
}

/** Counts with a thin grouping for readability in prose ("1 204" would be ambiguous across locales; use commas). */
export function formatCount(value: number): string {
  if (!Number.isFinite(value)) return DASH;
  return Math.round(value).toLocaleString('en-US');
}

/** Percentages for shares: "38%". */
export function formatPercent(share: number, decimals = 0): string {
  if (!Number.isFinite(share)) return DASH;
  return `${(share * 100).toFixed(decimals)}%`;
}
