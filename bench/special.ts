import { chiSquareCriticalValue } from '../src/core/special/chiSquareCriticalValue';
import { chiSquareUpperTail } from '../src/core/special/chiSquareUpperTail';
import { noncentralChiSquareUpperTail } from '../src/core/special/noncentralChiSquareUpperTail';
import { medianMs, type Figure } from './timing';

const NS_PER_MS = 1e6;

/** df from 1 to 100,000 and x from 1e-3·df to the far tail: the same spread the fixtures cover. */
function centralGrid(): [x: number, df: number][] {
  const grid: [number, number][] = [];
  for (const df of [1, 2, 5, 10, 30, 100, 1000, 10000, 100000]) {
    for (const share of [1e-3, 0.1, 0.5, 0.9, 1, 1.1, 1.5, 2, 5, 20]) grid.push([share * df, df]);
  }
  return grid;
}

/** ns per call of `evaluate` over `inputs`, as the median of repeated passes over the whole grid. */
function nsPerCall<T>(inputs: T[], evaluate: (input: T) => unknown): number {
  return (medianMs(() => inputs.forEach(evaluate)) / inputs.length) * NS_PER_MS;
}

/** Timings of the special functions, in ns per call; the caller prints them. */
export function benchSpecial(): { name: string; value: number; unit: string }[] {
  const grid = centralGrid();
  const smallDf = grid.filter(([, df]) => df <= 30);
  const largeDf = grid.filter(([, df]) => df >= 1000);
  const noncentral: [number, number, number][] = [];
  for (const df of [1, 4, 20, 100]) {
    for (const lambda of [0.5, 10, 200, 5000, 100000]) {
      for (const k of [-2, 0, 2, 5]) noncentral.push([Math.max(0.01, df + lambda + k * Math.sqrt(2 * (df + 2 * lambda))), df, lambda]);
    }
  }
  const critical: [number, number][] = [];
  for (const df of [1, 3, 10, 100, 10000]) for (const alpha of [0.05, 0.001, 1e-8]) critical.push([alpha, df]);

  const figures: Figure[] = [
    { name: 'chiSquareUpperTail, df 1…100,000 × x 1e-3·df…20·df (90 points)', value: nsPerCall(grid, ([x, df]) => chiSquareUpperTail(x, df)), unit: 'ns/call' },
    { name: 'chiSquareUpperTail, df ≤ 30', value: nsPerCall(smallDf, ([x, df]) => chiSquareUpperTail(x, df)), unit: 'ns/call' },
    { name: 'chiSquareUpperTail, df ≥ 1,000', value: nsPerCall(largeDf, ([x, df]) => chiSquareUpperTail(x, df)), unit: 'ns/call' },
    {
      name: 'noncentralChiSquareUpperTail, df 1…100 × λ 0.5…100,000',
      value: nsPerCall(noncentral, ([x, df, lambda]) => noncentralChiSquareUpperTail(x, df, lambda)),
      unit: 'ns/call',
    },
    { name: 'chiSquareCriticalValue, df 1…10,000 × alpha 0.05…1e-8', value: nsPerCall(critical, ([alpha, df]) => chiSquareCriticalValue(alpha, df)), unit: 'ns/call' },
  ];
  return figures;
}
