import assert from 'node:assert/strict';
import { choosePValue } from '../../../src/core/exact/choosePValue';
import { monteCarloBlockRunner } from '../../../src/core/exact/monteCarloBlockRunner';
import { monteCarloGoodnessOfFitBlocks } from '../../../src/core/exact/monteCarloGoodnessOfFitBlocks';
import { monteCarloGoodnessOfFitSpec } from '../../../src/core/exact/monteCarloGoodnessOfFitSpec';
import { monteCarloIndependenceBlocks } from '../../../src/core/exact/monteCarloIndependenceBlocks';
import type { MonteCarloBlockHook, MonteCarloJobSpec } from '../../../src/core/exact/monteCarloJobSpec';
import { monteCarloLogFactorials } from '../../../src/core/exact/monteCarloLogFactorials';
import { testIndependence } from '../../../src/core/stats/testIndependence';
import { DEFAULT_PVALUE_OPTIONS } from '../../../src/core/exact/choosePValue';

/** Invented counts (a bakery's loaves by weekday and shift). */
const TABLE = [[6, 1, 0, 3], [2, 5, 4, 0], [0, 3, 7, 2]];

/** A hook that runs the blocks here, on a structured clone of the job, as a worker thread would receive it. */
function cloningHook(seen: { spec?: MonteCarloJobSpec; blocks?: readonly number[] }): MonteCarloBlockHook {
  return (spec, blocks) => {
    const copy = structuredClone(spec);
    seen.spec = copy;
    seen.blocks = blocks;
    const runner = monteCarloBlockRunner(copy);
    return { ok: true, extreme: blocks.map((block) => runner.countBlock(block)) };
  };
}

describe('Monte Carlo block hook', () => {
  for (const statistic of ['probability', 'pearson'] as const) {
    it(`gives the in-thread count when the blocks run from a cloned job spec, r×c and goodness of fit, ${statistic}`, () => {
      const seen: { spec?: MonteCarloJobSpec; blocks?: readonly number[] } = {};
      const options = { replicates: 7_500, seed: 31, statistic };
      const here = monteCarloIndependenceBlocks(TABLE, options);
      const hooked = monteCarloIndependenceBlocks(TABLE, { ...options, runBlocks: cloningHook(seen) });
      assert.ok(here.ok && hooked.ok);
      assert.equal(hooked.value.extreme, here.value.extreme);
      assert.equal(hooked.value.replicates, 7_500);
      assert.deepEqual(seen.blocks, [0, 1, 2, 3, 4, 5, 6, 7]);
      assert.equal(seen.spec?.kind, 'independence');

      const fitHere = monteCarloGoodnessOfFitBlocks([9, 2, 4, 0, 5], [2, 1, 1, 1, 1], options, { firstBlock: 2, blockCount: 3 });
      const fitHooked = monteCarloGoodnessOfFitBlocks([9, 2, 4, 0, 5], [2, 1, 1, 1, 1], { ...options, runBlocks: cloningHook(seen) }, { firstBlock: 2, blockCount: 3 });
      assert.ok(fitHere.ok && fitHooked.ok);
      assert.equal(fitHooked.value.extreme, fitHere.value.extreme);
      assert.equal(fitHooked.value.replicates, 3_000);
      assert.deepEqual(seen.blocks, [2, 3, 4]);
    });
  }

  it('keeps an impossible observation impossible after cloning (threshold +Infinity)', () => {
    const spec = monteCarloGoodnessOfFitSpec([3, 1, 2], [0.5, 0, 0.5], 'probability', 2_000, 3, monteCarloLogFactorials(6));
    assert.equal(spec.threshold, Number.POSITIVE_INFINITY);
    const runner = monteCarloBlockRunner(structuredClone(spec));
    assert.equal(runner.countBlock(0) + runner.countBlock(1), 0);
  });

  it('runs declined blocks in this thread, with the same count as without a hook', () => {
    let asked = 0;
    const options = { replicates: 5_000, seed: 7 };
    const declined = monteCarloIndependenceBlocks(TABLE, { ...options, runBlocks: () => { asked += 1; return { ok: false, reason: 'declined' }; } });
    const here = monteCarloIndependenceBlocks(TABLE, options);
    assert.ok(declined.ok && here.ok);
    assert.equal(asked, 1);
    assert.equal(declined.value.extreme, here.value.extreme);
    assert.equal(declined.value.replicates, 5_000);
  });

  it('passes the hook\'s cancellation and failure on as the engine\'s stop reasons', () => {
    const cancelled = monteCarloIndependenceBlocks(TABLE, { replicates: 5_000, seed: 1, runBlocks: () => ({ ok: false, reason: 'cancelled' }) });
    assert.equal(cancelled.ok ? 'ok' : cancelled.reason, 'cancelled');
    const failed = monteCarloIndependenceBlocks(TABLE, { replicates: 5_000, seed: 1, runBlocks: () => ({ ok: false, reason: 'failed', message: 'a thread stopped' }) });
    assert.ok(!failed.ok && failed.reason === 'failed' && failed.message === 'a thread stopped');
    const isCancelledSeen: boolean[] = [];
    const overTime = monteCarloIndependenceBlocks(TABLE, {
      replicates: 5_000,
      seed: 1,
      budget: { timeMs: -1 },
      runBlocks: (_spec, _blocks, control) => {
        isCancelledSeen.push(control.isCancelled?.() === true);
        return { ok: false, reason: 'cancelled' };
      },
    });
    assert.deepEqual(isCancelledSeen, [true]);
    assert.equal(overTime.ok ? 'ok' : overTime.reason, 'time');
  });

  it('makes choosePValue report a failed hook as an issue, not as a cancellation', () => {
    const result = testIndependence(TABLE);
    const options = { ...DEFAULT_PVALUE_OPTIONS, pValueMethod: 'monte-carlo' as const, replicates: 999 };
    const choice = choosePValue(result, TABLE, options, { runBlocks: () => ({ ok: false, reason: 'failed', message: 'The simulation stopped unexpectedly.' }) });
    assert.deepEqual(choice, { kind: 'failed', issue: { code: 'unreadable', message: 'The simulation stopped unexpectedly.' } });
    const plain = choosePValue(result, TABLE, options);
    const hooked = choosePValue(result, TABLE, options, { runBlocks: cloningHook({}) });
    assert.ok(plain.kind === 'computed' && hooked.kind === 'computed');
    assert.equal(hooked.value.p, plain.value.p);
    assert.equal(hooked.value.reason, plain.value.reason);
  });
});
