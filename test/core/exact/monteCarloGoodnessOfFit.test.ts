import assert from 'node:assert/strict';
import { exactMultinomial } from '../../../src/core/exact/exactMultinomial';
import { monteCarloGoodnessOfFit } from '../../../src/core/exact/monteCarloGoodnessOfFit';
import { monteCarloGoodnessOfFitBlocks } from '../../../src/core/exact/monteCarloGoodnessOfFitBlocks';
import { monteCarloPValue } from '../../../src/core/exact/monteCarloPValue';
import { exactGoodnessOfFitP, testInputs } from './bruteForce';
import { tableFromWeights } from '../../helpers/randomTables';

/** More misses than this out of 30 cases at 99% coverage would have probability < 0.004. */
const ALLOWED_MISSES = 3;

function randomCase(next: () => number): { observed: number[]; proportions: number[] } {
  const k = 3 + Math.floor(next() * 4);
  const total = 10 + Math.floor(next() * (k <= 4 ? 30 : 16));
  const proportions = next() < 0.4 ? new Array<number>(k).fill(1) : Array.from({ length: k }, () => 1 + Math.floor(next() * 5));
  const skew = proportions.map((p) => p * (0.1 + 2 * next() ** 2));
  const observed = tableFromWeights(next, skew, 1, k, total)[0];
  return { observed, proportions };
}

describe('monteCarloGoodnessOfFit', () => {
  for (const statistic of ['probability', 'pearson'] as const) {
    it(`brackets the exact p within its 99% interval on 30 seeded cases, ${statistic} criterion`, () => {
      const next = testInputs(statistic === 'probability' ? 303 : 404);
      const misses: string[] = [];
      for (let c = 0; c < 30; c++) {
        const { observed, proportions } = randomCase(next);
        let exact: number;
        if (statistic === 'probability') {
          const result = exactMultinomial(observed, proportions);
          assert.ok(result.ok);
          exact = result.value.p;
        } else {
          exact = Math.min(1, exactGoodnessOfFitP(observed, proportions, 'pearson'));
        }
        const result = monteCarloGoodnessOfFit(observed, proportions, { replicates: 20_000, seed: 500 + c, statistic });
        assert.ok(result.ok && result.value.interval);
        const { p, interval } = result.value;
        assert.equal(result.value.method, 'monte-carlo-multinomial');
        assert.ok(Math.abs(p - exact) < 5 * Math.sqrt((exact * (1 - exact)) / 20_000) + 1e-4, `${observed} / ${proportions}: ${p} vs exact ${exact}`);
        if (exact < interval.lower || exact > interval.upper) misses.push(`${observed} / ${proportions}: exact ${exact} outside [${interval.lower}, ${interval.upper}]`);
      }
      assert.ok(misses.length <= ALLOWED_MISSES, misses.join('\n'));
    });
  }

  it('is deterministic and gives the single-run count when blocks are split and summed', () => {
    const observed = [14, 9, 3, 12, 7];
    const proportions = [0.3, 0.2, 0.1, 0.25, 0.15];
    const options = { replicates: 6_400, seed: 9 };
    const first = monteCarloGoodnessOfFit(observed, proportions, options);
    const again = monteCarloGoodnessOfFit(observed, proportions, options);
    assert.ok(first.ok && again.ok);
    assert.deepEqual({ ...first.value, elapsedMs: 0 }, { ...again.value, elapsedMs: 0 });
    let extreme = 0;
    let replicates = 0;
    for (const range of [
      { firstBlock: 5, blockCount: 2 },
      { firstBlock: 0, blockCount: 2 },
      { firstBlock: 2, blockCount: 3 },
    ]) {
      const part = monteCarloGoodnessOfFitBlocks(observed, proportions, options, range);
      assert.ok(part.ok);
      extreme += part.value.extreme;
      replicates += part.value.replicates;
    }
    assert.equal(replicates, 6_400);
    assert.equal(monteCarloPValue({ extreme, replicates, elapsedMs: 0 }, 9, 'monte-carlo-multinomial').p, first.value.p);
  });

  it('never samples a category of proportion zero and finds nothing as extreme as counts there', () => {
    const impossible = monteCarloGoodnessOfFit([3, 2, 5], [1, 0, 1], { replicates: 999, seed: 2 });
    assert.ok(impossible.ok);
    assert.equal(impossible.value.p, 1 / 1000);
    const empty = monteCarloGoodnessOfFit([3, 0, 5], [1, 0, 1], { replicates: 999, seed: 2 });
    const without = monteCarloGoodnessOfFit([3, 5], [1, 1], { replicates: 999, seed: 2 });
    assert.ok(empty.ok && without.ok);
    assert.equal(empty.value.p, without.value.p);
  });

  it('stops on the time budget, on cancellation and on the memory budget', () => {
    const observed = [400, 350, 250];
    const timed = monteCarloGoodnessOfFit(observed, [1, 1, 1], { replicates: 50_000_000, seed: 1, budget: { timeMs: 30 } });
    assert.ok(!timed.ok && timed.reason === 'time' && timed.elapsedMs < 500);
    const cancelled = monteCarloGoodnessOfFit(observed, [1, 1, 1], { replicates: 50_000_000, seed: 1, budget: { isCancelled: () => true } });
    assert.ok(!cancelled.ok && cancelled.reason === 'cancelled');
    const memory = monteCarloGoodnessOfFit(observed, [1, 1, 1], { replicates: 100, seed: 1, budget: { memoryBytes: 100 } });
    assert.ok(!memory.ok && memory.reason === 'memory');
  });

  it('treats malformed input as a programmer error', () => {
    assert.throws(() => monteCarloGoodnessOfFit([1, 2], [1], { replicates: 10, seed: 1 }), RangeError);
    assert.throws(() => monteCarloGoodnessOfFit([1, 2], [1, -1], { replicates: 10, seed: 1 }), RangeError);
    assert.throws(() => monteCarloGoodnessOfFit([1, 2], [1, 1], { replicates: 1.5, seed: 1 }), RangeError);
  });
});
