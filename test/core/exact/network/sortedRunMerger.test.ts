import assert from 'node:assert/strict';
import { SortedPastPaths, termOf } from '../../../../src/core/exact/network/sortedPastPaths';
import { SortedRunMerger } from '../../../../src/core/exact/network/sortedRunMerger';
import { assertClose } from '../../../helpers/assertClose';

function listOf(values: number[], weights: number[]): SortedPastPaths {
  const list = new SortedPastPaths(values.length);
  values.forEach((value, q) => list.push(value, termOf(value, weights[q]), 0));
  list.computePrefix();
  return list;
}

describe('SortedRunMerger', () => {
  it('merges shifted sorted runs into one sorted list, summing the weights of equal values', () => {
    let state = 3;
    const random = (): number => (state = (state * 1103515245 + 12345) % 2147483648) / 2147483648;
    for (let trial = 0; trial < 50; trial++) {
      const merger = new SortedRunMerger();
      const expected = new Map<number, number>();
      const runs = 1 + Math.floor(random() * 9);
      for (let r = 0; r < runs; r++) {
        // Values on a grid of quarters so that different runs hit equal values exactly; some runs
        // are shifted across a band edge (multiples of 256) to exercise the rescaling of terms.
        const values = Array.from({ length: 1 + Math.floor(random() * 30) }, () => Math.floor(random() * 200) / 4 - 300).sort((a, b) => a - b);
        const unique = [...new Set(values)];
        const weights = unique.map(() => 1 + Math.floor(random() * 5));
        const shift = Math.floor(random() * 40) / 4 + (r % 3 === 0 ? 60 : 0);
        const list = listOf(unique, weights);
        const from = Math.floor(random() * unique.length);
        merger.addRun(list, from, unique.length, shift);
        for (let q = from; q < unique.length; q++) expected.set(unique[q] + shift, (expected.get(unique[q] + shift) ?? 0) + weights[q]);
      }
      const merged = new SortedPastPaths();
      merger.mergeInto(merged, 1e-12);
      const keys = [...expected.keys()].sort((a, b) => a - b);
      assert.equal(merged.count, keys.length);
      let logTotal = -Infinity;
      keys.forEach((value, q) => {
        assert.equal(merged.past[q], value);
        const logTerm = Math.log(expected.get(value) as number) + value;
        logTotal = Math.max(logTotal, logTerm) + Math.log1p(Math.exp(-Math.abs(logTotal - logTerm)));
        assertClose(merged.logPrefixMass(q), logTotal, 1e-12, { trial, q });
      });
    }
  });
});
