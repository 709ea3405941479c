/** Exact multinomial goodness of fit: milliseconds per test, on outcome spaces of 10⁶–10⁸ outcomes. */
import { exactMultinomial } from '../src/core/exact/exactMultinomial';
import { medianMs, seededRandom, type Figure } from './timing';

const SEED = 20240613;
/** The target: under a second for k = 6, N = 100 and the like. */
const TARGET_MS = 1000;

/** Number of possible outcomes, C(N + k − 1, k − 1). */
function outcomes(categories: number, total: number): number {
  let count = 1;
  for (let i = 1; i < categories; i++) count = (count * (total + i)) / i;
  return count;
}

/** Counts of `total` draws from proportions tilted by `tilt` (0 = the hypothesis itself), seeded. */
function tiltedCounts(proportions: number[], total: number, tilt: number, seed: number): number[] {
  const random = seededRandom(seed);
  const weights = proportions.map((p, j) => p * Math.exp(tilt * (j - (proportions.length - 1) / 2)));
  const sum = weights.reduce((s, w) => s + w, 0);
  const counts = new Array<number>(proportions.length).fill(0);
  for (let n = 0; n < total; n++) {
    let u = random() * sum;
    let j = 0;
    while (u > weights[j] && j < weights.length - 1) u -= weights[j++];
    counts[j] += 1;
  }
  return counts;
}

export function benchExactMultinomial(): Figure[] {
  const cases: [string, number[], number[]][] = [];
  const equal6 = [1, 1, 1, 1, 1, 1];
  const unequal6 = [1, 1.1, 1.2, 1.3, 1.4, 2];
  for (const tilt of [0.1, 0.3, 0.5]) {
    cases.push([`k = 6 equal, N = 100, tilt ${tilt}`, tiltedCounts(equal6, 100, tilt, SEED), equal6]);
    cases.push([`k = 6 unequal, N = 100, tilt ${tilt}`, tiltedCounts(unequal6, 100, tilt, SEED + 1), unequal6]);
  }
  cases.push(['k = 7 equal, N = 70, tilt 0.3', tiltedCounts([1, 1, 1, 1, 1, 1, 1], 70, 0.3, SEED + 2), [1, 1, 1, 1, 1, 1, 1]]);
  cases.push(['k = 4 unequal, N = 300, tilt 0.2', tiltedCounts([1, 2, 3, 4], 300, 0.2, SEED + 3), [1, 2, 3, 4]]);
  cases.push(['k = 3 unequal, N = 3,000, tilt 0.05', tiltedCounts([2, 3, 5], 3000, 0.05, SEED + 4), [2, 3, 5]]);
  cases.push(['k = 10 equal, N = 25, tilt 0.2', tiltedCounts(new Array<number>(10).fill(1), 25, 0.2, SEED + 5), new Array<number>(10).fill(1)]);
  return cases.map(([name, observed, proportions]) => {
    const check = exactMultinomial(observed, proportions, { timeMs: 60_000 });
    const p = check.ok ? check.value.p.toExponential(2) : check.reason;
    const total = observed.reduce((s, v) => s + v, 0);
    return {
      name: `exact multinomial ${name} (${outcomes(observed.length, total).toExponential(1)} outcomes, p ${p})`,
      value: medianMs(() => exactMultinomial(observed, proportions, { timeMs: 60_000 }), 600),
      unit: 'ms',
      target: { value: TARGET_MS, better: 'lower' },
    };
  });
}
