import assert from 'node:assert/strict';
import { NodePastTable } from '../../../../src/core/exact/network/nodePastTable';
import { SortedPastPaths } from '../../../../src/core/exact/network/sortedPastPaths';
import { assertClose } from '../../../helpers/assertClose';

describe('NodePastTable', () => {
  it('keeps one entry per value, summing weights, and loads them sorted', () => {
    const scale = 2 ** 36;
    const table = new NodePastTable();
    const expected = new Map<number, number>();
    for (let n = 0; n < 5000; n++) {
      const value = -(1 + ((n * 7919) % 613)) * Math.LN2 / 3;
      table.add(value, 1 + (n % 4), scale);
      expected.set(value, (expected.get(value) ?? 0) + 1 + (n % 4));
    }
    assert.equal(table.count, expected.size);
    const sorted = new SortedPastPaths();
    sorted.load(table, scale);
    const keys = [...expected.keys()].sort((a, b) => a - b);
    keys.forEach((value, q) => {
      assert.equal(sorted.past[q], value);
      assert.equal(sorted.weight[q], expected.get(value));
    });
  });

  it('merges values that differ by rounding only, shifting the weight to the stored value', () => {
    const scale = 2 ** 36;
    const table = new NodePastTable();
    const a = 0.1 + 0.2;
    const b = 0.3;
    table.add(a, 1, scale);
    table.add(b, 1, scale);
    assert.equal(table.count, 1);
    assertClose(table.weightOf(a, scale), 2, 1e-15);
  });
});
