import type { Xoshiro128StarStar } from './random';

/** Draws one multinomial outcome into `counts` (length = number of proportions). */
export interface MultinomialSampler {
  readonly categories: number;
  sample(random: Xoshiro128StarStar, counts: Int32Array): void;
}

/**
 * A sampler of multinomial outcomes (total N, category probabilities π) as a chain of conditional
 * binomials, each drawn by Kemp's modal inversion (Kemp, "A modal method for generating binomial
 * variables", Communications in Statistics – Theory and Methods 15(3), 805–813, 1986).
 *
 * Intuition: the first count is Binomial(N, π₁); given it, the second is Binomial(N − x₁, π₂/(1 − π₁)),
 * and so on, so k − 1 binomial draws make an outcome; each starts where the binomial is most probable
 * and steps outward, so its cost is about one standard deviation of that count.
 *
 * ## Method
 * The conditional probabilities q_j = π_j / Σ_{i≥j} π_i and their logs are fixed, so they are
 * computed once. For Binomial(n, q): the mass at the mode ⌊(n + 1)q⌋ is
 * exp(log n! − log m! − log (n − m)! + m log q + (n − m) log(1 − q)); neighbours follow from
 * P(x + 1)/P(x) = (n − x)/(x + 1) · q/(1 − q), and the search steps to the more probable neighbour.
 * Chosen over BTPE (Kachitvichyanukul & Schmeiser 1988) because it is exact inversion with a
 * handful of lines, and for the goodness-of-fit sizes where simulation is needed (N up to a few
 * thousand) its O(√(nq)) steps cost about as much as BTPE's rejection set-up. Proportions of zero
 * give zero counts without a draw; nothing is allocated per outcome.
 *
 * @param proportions - nonnegative category weights, any scale (the sum must be positive and finite)
 * @param total - N, the number of observations
 * @param logFactorials - log k! for k = 0..N
 * @returns a sampler reusing its work arrays
 */
export function randomMultinomialSampler(proportions: readonly number[], total: number, logFactorials: Float64Array): MultinomialSampler {
  const categories = proportions.length;
  const sum = proportions.reduce((acc, value) => acc + value, 0);
  if (!(sum > 0) || !Number.isFinite(sum) || proportions.some((value) => !(value >= 0)) || logFactorials.length <= total) {
    throw new RangeError('randomMultinomialSampler: proportions must be nonnegative with a positive finite sum, and the log-factorial table must reach N');
  }
  const conditional = new Float64Array(categories);
  const logConditional = new Float64Array(categories);
  const logComplement = new Float64Array(categories);
  const odds = new Float64Array(categories);
  let lastPositive = categories - 1;
  while (proportions[lastPositive] === 0) lastPositive -= 1;
  let tail = 0;
  for (let j = categories - 1; j >= 0; j--) {
    tail += proportions[j];
    conditional[j] = j === lastPositive ? 1 : j > lastPositive ? 0 : proportions[j] / tail;
    logConditional[j] = Math.log(conditional[j]);
    logComplement[j] = Math.log1p(-conditional[j]);
    odds[j] = conditional[j] / (1 - conditional[j]);
  }
  const lf = logFactorials;

  function sample(random: Xoshiro128StarStar, counts: Int32Array): void {
    let n = total;
    for (let j = 0; j < categories; j++) {
      const q = conditional[j];
      let x = 0;
      if (q === 1) x = n;
      else if (n > 0 && q > 0) {
        const ratio = odds[j];
        const mode = Math.min(n, Math.floor((n + 1) * q));
        const modeMass = Math.exp(lf[n] - lf[mode] - lf[n - mode] + mode * logConditional[j] + (n - mode) * logComplement[j]);
        let u = random.nextFloat();
        search: for (;;) {
          let sumMass = modeMass;
          x = mode;
          if (u < sumMass) break;
          let up = mode;
          let down = mode;
          let upMass = up < n ? (modeMass * (n - up) * ratio) / (up + 1) : 0;
          let downMass = down > 0 ? (modeMass * down) / ((n - down + 1) * ratio) : 0;
          while (upMass > 0 || downMass > 0) {
            if (upMass >= downMass) {
              up += 1;
              sumMass += upMass;
              x = up;
              if (u < sumMass) break search;
              upMass = up < n ? (upMass * (n - up) * ratio) / (up + 1) : 0;
            } else {
              down -= 1;
              sumMass += downMass;
              x = down;
              if (u < sumMass) break search;
              downMass = down > 0 ? (downMass * down) / ((n - down + 1) * ratio) : 0;
            }
          }
          u = random.nextFloat() * sumMass;
        }
      }
      counts[j] = x;
      n -= x;
    }
  }

  return { categories, sample };
}
