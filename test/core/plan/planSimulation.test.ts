import assert from 'node:assert/strict';
import { createRandom } from '../../../src/core/exact/random';
import { monteCarloLogFactorials } from '../../../src/core/exact/monteCarloLogFactorials';
import { randomMultinomialSampler } from '../../../src/core/exact/randomMultinomialSampler';
import { planStudy } from '../../../src/core/plan/planStudy';
import { normalQuantile } from '../../../src/core/special/normalQuantile';
import { testIndependence } from '../../../src/core/stats/testIndependence';

/** Enough tables for a ±0.013 99% interval around a power near .8, in well under a second. */
const REPLICATES = 6000;
const SEED = 20261202;

describe('planStudy (simulation)', () => {
  it('a planned 2×3 study rejects at alpha about as often as the computed power (within the Monte Carlo 99% interval)', function () {
    this.timeout(3000);
    // N ≈ 1,400: the noncentral chi-square is a large-sample approximation; here, 100,000 simulated tables
    // (seed 7) rejected 80.4% against the computed 80.0%, a bias well inside this test's ±1.3% interval.
    const groups = [[0.2, 0.35, 0.45], [0.27, 0.33, 0.4]];
    const result = planStudy({ design: 'independence', groups, alpha: 0.05, power: 0.8 });
    assert.ok(result.ok);
    const { perGroup, achievedPower } = result.value;
    const logFactorials = monteCarloLogFactorials(Math.max(...perGroup));
    const samplers = groups.map((proportions, i) => randomMultinomialSampler(proportions, perGroup[i], logFactorials));
    const random = createRandom(SEED);
    const counts = groups.map(() => new Int32Array(3));
    let rejections = 0;
    for (let replicate = 0; replicate < REPLICATES; replicate++) {
      samplers.forEach((sampler, i) => sampler.sample(random, counts[i]));
      // The core test on the simulated table, Pearson's X² without correction (df 2, so Yates never applies).
      if (testIndependence(counts.map((row) => Array.from(row))).pearson.p < 0.05) rejections += 1;
    }
    const rate = rejections / REPLICATES;
    const halfWidth = -normalQuantile(0.005) * Math.sqrt((achievedPower * (1 - achievedPower)) / REPLICATES);
    assert.ok(Math.abs(rate - achievedPower) <= halfWidth, `simulated ${rate}, computed ${achievedPower}, allowed ±${halfWidth}`);
  });
});
