import assert from 'node:assert/strict';
import { monteCarloIndependenceSpec } from '../../src/core/exact/monteCarloIndependenceSpec';
import { monteCarloLogFactorials } from '../../src/core/exact/monteCarloLogFactorials';
import { createMonteCarloPool } from '../../src/node/monteCarloPool';
import { POOL_MIN_CELL_REPLICATES, runBlocksHere, worthSpreading } from '../../src/node/runBlocksHere';

// Invented 4×4 table (a greenhouse's pest sightings by bench and week); identity checks only.
const TABLE = [[3, 0, 5, 2], [1, 4, 0, 6], [2, 2, 7, 1], [0, 5, 1, 3]];
const N = TABLE.flat().reduce((a, b) => a + b, 0);
const spec = (replicates: number, seed: number) => monteCarloIndependenceSpec(TABLE, 'probability', replicates, seed, monteCarloLogFactorials(N));

describe('runBlocksHere', function () {
  this.timeout(60_000);

  it('gives the pool\'s own counts for the same blocks (same seed, same streams)', async () => {
    const job = spec(9_500, 424242);
    const blocks = Array.from({ length: Math.ceil(job.replicates / 1000) }, (_, k) => k);
    const pool = createMonteCarloPool({ threads: 2 });
    try {
      const fromPool = pool.runBlocks(job, blocks, {});
      assert.equal(fromPool.ok, true);
      assert.deepEqual(runBlocksHere(job, blocks, {}), fromPool);
    } finally {
      await pool.close();
    }
  });

  it('sends only jobs of at least POOL_MIN_CELL_REPLICATES to the pool, and stops when cancelled', () => {
    const small = spec(9_500, 1);
    const large = spec(Math.ceil(POOL_MIN_CELL_REPLICATES / 16), 1);
    assert.equal(worthSpreading(small), false);
    assert.equal(worthSpreading(large), true);
    // A 2,000,000-replicate job takes seconds here; cancelled at the first poll (after ~50 ms) it stops at once.
    const long = spec(2_000_000, 1);
    const started = performance.now();
    const outcome = runBlocksHere(long, Array.from({ length: 2000 }, (_, k) => k), { isCancelled: () => true });
    assert.deepEqual(outcome, { ok: false, reason: 'cancelled' });
    assert.ok(performance.now() - started < 5_000);
  });
});
