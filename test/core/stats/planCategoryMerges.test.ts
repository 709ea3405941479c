import assert from 'node:assert/strict';
import fc from 'fast-check';
import { planCategoryMerges } from '../../../src/core/stats/planCategoryMerges';

const PROPERTY_SEED = 20260611;
const smallestAtLeast = (sizes: number[], floor: number) => (groups: number[][]) =>
  groups.every((group) => group.reduce((sum, i) => sum + sizes[i], 0) >= floor);

describe('planCategoryMerges', () => {
  it('joins the sparsest ordered category to its sparser neighbour', () => {
    const sizes = [30, 2, 9, 1, 40];
    // 1 goes to its smaller neighbour 9 (not 40); then 2 goes to that group of 10 (not 30).
    assert.deepEqual(planCategoryMerges(sizes, true, smallestAtLeast(sizes, 2), 2).groups, [[0], [1], [2, 3], [4]]);
    assert.deepEqual(planCategoryMerges(sizes, true, smallestAtLeast(sizes, 5), 2).groups, [[0], [1, 2, 3], [4]]);
  });

  it('joins the sparsest unordered category to the next sparsest, wherever it is', () => {
    const sizes = [30, 2, 9, 1, 40];
    assert.deepEqual(planCategoryMerges(sizes, false, smallestAtLeast(sizes, 2), 2).groups, [[0], [1, 3], [2], [4]]);
  });

  it('stops at the minimum number of groups and reports failure', () => {
    const sizes = [1, 1, 1];
    const plan = planCategoryMerges(sizes, true, smallestAtLeast(sizes, 10), 2);
    assert.equal(plan.groups.length, 2);
    assert.equal(plan.passes, false);
    assert.equal(plan.merges, 1);
  });

  it('only ever forms runs of neighbours when ordered, and always partitions the categories (fast-check)', () => {
    fc.assert(fc.property(fc.array(fc.integer({ min: 1, max: 50 }), { minLength: 2, maxLength: 12 }), fc.integer({ min: 1, max: 120 }), (sizes, floor) => {
      for (const ordered of [true, false]) {
        const plan = planCategoryMerges(sizes, ordered, smallestAtLeast(sizes, floor), 1);
        assert.deepEqual(plan.groups.flat().sort((a, b) => a - b), sizes.map((_, i) => i));
        assert.equal(plan.groups.length, sizes.length - plan.merges);
        if (ordered) {
          assert.deepEqual(plan.groups.flat(), sizes.map((_, i) => i), 'ordered groups keep the order');
          for (const group of plan.groups) group.forEach((index, k) => k === 0 || assert.equal(index, group[k - 1] + 1));
        }
      }
    }), { seed: PROPERTY_SEED, numRuns: 200 });
  });
});
