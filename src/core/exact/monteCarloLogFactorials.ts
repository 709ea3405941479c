/**
 * The table log k! for k = 0..largest, as the Monte Carlo samplers and criteria look it up.
 *
 * Intuition: every table and outcome probability is a sum of log-factorials of counts no larger than
 * the grand total, so one pass builds all of them and each later use is a single array read.
 *
 * ## Method
 * Running sums of log k with Kahan's compensated summation (Kahan, "Further remarks on reducing
 * truncation errors", Comm. ACM 8(1), 40, 1965), which keeps the sum within a few units in the last
 * place of log Γ(k + 1) (checked against @stdlib's gammaln in the tests) at a quarter of its cost.
 *
 * @param largest - the largest k needed (a nonnegative integer)
 * @returns a Float64Array of length largest + 1
 */
export function monteCarloLogFactorials(largest: number): Float64Array {
  const table = new Float64Array(largest + 1);
  let sum = 0;
  let compensation = 0;
  for (let k = 2; k <= largest; k++) {
    const term = Math.log(k) - compensation;
    const next = sum + term;
    compensation = next - sum - term;
    sum = next;
    table[k] = sum;
  }
  return table;
}
