import assert from 'node:assert/strict';

/** A relative tolerance, or both kinds: the check passes when within either. */
export type Tolerance = number | { relative?: number; absolute?: number };

/**
 * Asserts |actual − expected| ≤ max(relative·|expected|, absolute), printing the input, both values,
 * the difference and the tolerance on failure. A bare number is a relative tolerance.
 */
export function assertClose(actual: number, expected: number, tolerance: Tolerance, input?: unknown): void {
  const { relative = 0, absolute = 0 } = typeof tolerance === 'number' ? { relative: tolerance } : tolerance;
  if (actual === expected) return;
  const difference = Math.abs(actual - expected);
  const allowed = Math.max(relative * Math.abs(expected), absolute);
  if (Number.isFinite(difference) && difference <= allowed) return;
  assert.fail(
    [
      'values differ beyond tolerance',
      `  input:      ${JSON.stringify(input)}`,
      `  actual:     ${actual}`,
      `  expected:   ${expected}`,
      `  difference: ${difference}${expected !== 0 ? ` (relative ${difference / Math.abs(expected)})` : ''}`,
      `  tolerance:  relative ${relative}, absolute ${absolute}`,
    ].join('\n'),
  );
}
