import assert from 'node:assert/strict';
import { analyze } from '../../src/core/analyze';
import { monteCarloIndependenceSpec } from '../../src/core/exact/monteCarloIndependenceSpec';
import { monteCarloLogFactorials } from '../../src/core/exact/monteCarloLogFactorials';
import { searchControlWithPool } from '../../src/node/searchControlWithPool';
import { POOL_MIN_CELL_REPLICATES, worthSpreading } from '../../src/node/worthSpreading';

// Invented 4×4 table (a greenhouse's pest sightings by bench and week); identity checks only.
const TABLE = '| Bench | W1 | W2 | W3 | W4 |\n|---|---|---|---|---|\n| A | 3 | 0 | 5 | 2 |\n| B | 1 | 4 | 0 | 6 |\n| C | 2 | 2 | 7 | 1 |\n| D | 0 | 5 | 1 | 3 |\n';
const OBSERVED = [[3, 0, 5, 2], [1, 4, 0, 6], [2, 2, 7, 1], [0, 5, 1, 3]];

describe('searchControlWithPool', function () {
  this.timeout(60_000);

  it('counts only jobs of at least POOL_MIN_CELL_REPLICATES as worth the pool', () => {
    const spec = (replicates: number) => monteCarloIndependenceSpec(OBSERVED, 'probability', replicates, 1, monteCarloLogFactorials(42));
    assert.equal(worthSpreading(spec(9_500)), false);
    assert.equal(worthSpreading(spec(Math.ceil(POOL_MIN_CELL_REPLICATES / 16))), true);
  });

  it('declines a small simulation, which then runs in this thread with the same p, and never starts a thread', async () => {
    // A pool whose worker file does not exist would fail any job it took: success proves the job stayed here.
    const pooled = searchControlWithPool({}, 2, '/nonexistent/monteCarloPoolWorker.js');
    const options = { pValueMethod: 'monte-carlo' as const, replicates: 9_999, seed: 31 };
    try {
      const withPool = analyze({ text: TABLE, format: 'markdown', line: 1, options, control: pooled.control });
      const here = analyze({ text: TABLE, format: 'markdown', line: 1, options });
      assert.ok(withPool.ok && here.ok, withPool.ok ? '' : withPool.issue.message);
      assert.equal(withPool.value.exact?.p, here.value.exact?.p);
    } finally {
      await pooled.close();
    }
  });

  it('hands a large simulation to the pool (a missing worker file then becomes an Issue)', async () => {
    const pooled = searchControlWithPool({}, 2, '/nonexistent/monteCarloPoolWorker.js');
    try {
      const result = analyze({ text: TABLE, format: 'markdown', line: 1, options: { pValueMethod: 'monte-carlo', replicates: Math.ceil(POOL_MIN_CELL_REPLICATES / 16) }, control: pooled.control });
      assert.equal(result.ok, false);
      if (!result.ok) assert.notEqual(result.issue.code, 'cancelled');
    } finally {
      await pooled.close();
    }
  });
});
