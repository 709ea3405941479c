import assert from 'node:assert/strict';
import { PastPathArena } from '../../../../src/core/exact/network/pastPathArena';
import { termOf } from '../../../../src/core/exact/network/sortedPastPaths';

function fill(arena: PastPathArena, values: number[]): ReturnType<PastPathArena['take']> {
  const list = arena.take(values.length + 3);
  for (const value of values) list.push(value, termOf(value, 1), 0);
  list.computePrefix();
  return arena.settle(list);
}

describe('PastPathArena', () => {
  it('hands out lists that keep their values while later lists outgrow the chunk, and reuses room after a reset', () => {
    const arena = new PastPathArena();
    const lists = Array.from({ length: 200 }, (_, k) => fill(arena, Array.from({ length: 50 + k }, (_, q) => k + q / 8)));
    lists.forEach((list, k) => {
      assert.equal(list.count, 50 + k);
      assert.equal(list.past.length, list.count);
      assert.equal(list.past[0], k);
      assert.equal(list.past[list.count - 1], k + (49 + k) / 8);
      assert.ok(Math.abs(list.logPrefixMass(0) - k) < 1e-12);
    });
    const held = arena.bytes();
    assert.ok(held >= 32 * lists.reduce((sum, list) => sum + list.count, 0));
    arena.reset();
    const again = fill(arena, [1, 2, 3]);
    assert.deepEqual([...again.past], [1, 2, 3]);
    assert.ok(arena.bytes() <= held);
  });

  it('refuses to settle a list other than the one taken last (a programmer error)', () => {
    const arena = new PastPathArena();
    const first = fill(arena, [1]);
    arena.take(2);
    assert.throws(() => arena.settle(first));
    assert.throws(() => arena.take(1));
  });
});
