/** Multiple-comparison adjustments offered for families of tests. */
export type AdjustmentMethod = 'holm' | 'bonferroni';

/**
 * Adjusted p-values for a family of m tests, so that "adjusted p ≤ α" controls the family-wise
 * error rate at α (Holm 1979, Scandinavian Journal of Statistics 6, 65–70; Wright 1992,
 * Biometrics 48, 1005–1013, for the adjusted-p form).
 *
 * Intuition: the more tests one runs, the more of them look significant by luck, so each p is
 * scaled up by the number of tests it competes with.
 *
 * ## Method
 * Bonferroni: min(1, m·pᵢ). Holm: sort ascending p₍₁₎ ≤ … ≤ p₍ₘ₎, take min(1, (m − j + 1)·p₍ⱼ₎)
 * and then the running maximum, so adjusted values keep the order of the raw ones. Ties keep
 * input order (the result is the same either way).
 *
 * @param pValues - raw p-values, each in [0, 1]
 * @param method - 'holm' (step-down, never less powerful) or 'bonferroni'
 * @returns adjusted p-values in input order
 * @example adjustPValues([0.01, 0.04, 0.03], 'holm') // [0.03, 0.06, 0.06]
 */
export function adjustPValues(pValues: readonly number[], method: AdjustmentMethod): number[] {
  for (const p of pValues) {
    if (!(p >= 0 && p <= 1)) throw new RangeError(`adjustPValues: p-values must be in [0, 1] (got ${p})`);
  }
  const m = pValues.length;
  if (method === 'bonferroni') return pValues.map((p) => Math.min(1, m * p));
  const order = pValues.map((_, index) => index).sort((left, right) => pValues[left] - pValues[right]);
  const adjusted = new Array<number>(m);
  let runningMaximum = 0;
  order.forEach((index, rank) => {
    runningMaximum = Math.max(runningMaximum, Math.min(1, (m - rank) * pValues[index]));
    adjusted[index] = runningMaximum;
  });
  return adjusted;
}
