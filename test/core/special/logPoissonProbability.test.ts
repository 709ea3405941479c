import assert from 'node:assert/strict';
import { jStat } from 'jstat';
import { logPoissonProbability } from '../../../src/core/special/logPoissonProbability';
import { assertClose } from '../../helpers/assertClose';

describe('logPoissonProbability', () => {
  it('agrees with jstat poisson.pdf (run live) for moderate counts', () => {
    for (const mean of [0.3, 2, 9.5, 40]) {
      for (let k = 0; k <= 60; k += 3) {
        const expected = jStat.poisson.pdf(k, mean);
        if (expected < 1e-250) continue;
        assertClose(Math.exp(logPoissonProbability(k, mean)), expected, 1e-12, { k, mean });
      }
    }
  });

  it('sums to 1 over whole k (Poisson probabilities)', () => {
    for (const mean of [0.01, 1, 37.5, 2500, 80000]) {
      let total = 0;
      const reach = Math.ceil(mean + 40 * Math.sqrt(mean) + 40);
      for (let k = 0; k <= reach; k++) total += Math.exp(logPoissonProbability(k, mean));
      assertClose(total, 1, 1e-13, { mean });
    }
  });

  it('satisfies the recurrence log p(k+1) − log p(k) = log(mean/(k+1)) also for real k', () => {
    for (const mean of [0.7, 55, 50000]) {
      for (const k of [0.25, 3.5, 49.9, 50000.5, 61000]) {
        const step = logPoissonProbability(k + 1, mean) - logPoissonProbability(k, mean);
        // Each log probability is good to about eps·|log p|, and the difference keeps that absolute error.
        const allowed = 4 * Number.EPSILON * Math.abs(logPoissonProbability(k, mean));
        assertClose(step, Math.log(mean / (k + 1)), { absolute: allowed }, { k, mean });
      }
    }
  });

  it('handles k = 0 and mean = 0, and gives NaN for negative input', () => {
    assert.equal(logPoissonProbability(0, 4), -4);
    assert.equal(logPoissonProbability(0, 0), -0);
    assert.equal(logPoissonProbability(3, 0), -Infinity);
    assert.ok(Number.isNaN(logPoissonProbability(-1, 2)));
    assert.ok(Number.isNaN(logPoissonProbability(1, -2)));
  });
});
