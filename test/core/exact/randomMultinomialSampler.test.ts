import assert from 'node:assert/strict';
import { jStat } from 'jstat';
import { monteCarloLogFactorials } from '../../../src/core/exact/monteCarloLogFactorials';
import { createRandom } from '../../../src/core/exact/random';
import { randomMultinomialSampler } from '../../../src/core/exact/randomMultinomialSampler';

describe('randomMultinomialSampler', () => {
  it('draws outcomes summing to N whose category counts are binomial (jstat chi-square check)', () => {
    const proportions = [0.05, 0.3, 0, 0.4, 0.25];
    const total = 40;
    const sampler = randomMultinomialSampler(proportions, total, monteCarloLogFactorials(total));
    const counts = new Int32Array(proportions.length);
    const random = createRandom(8, 0);
    const draws = 100_000;
    const frequencies = proportions.map(() => new Array<number>(total + 1).fill(0));
    for (let i = 0; i < draws; i++) {
      sampler.sample(random, counts);
      assert.equal(counts.reduce((s, v) => s + v, 0), total);
      counts.forEach((x, j) => (frequencies[j][x] += 1));
    }
    assert.equal(frequencies[2][0], draws, 'a zero proportion never receives a count');
    for (const j of [0, 1, 3, 4]) {
      // Each category alone is Binomial(N, π_j); bins with expected < 5 are pooled.
      let statistic = 0;
      let bins = 0;
      let pooledObserved = 0;
      let pooledExpected = 0;
      for (let x = 0; x <= total; x++) {
        const e = draws * jStat.binomial.pdf(x, total, proportions[j]);
        if (e >= 5) {
          statistic += (frequencies[j][x] - e) ** 2 / e;
          bins += 1;
        } else {
          pooledObserved += frequencies[j][x];
          pooledExpected += e;
        }
      }
      if (pooledExpected > 0) {
        statistic += (pooledObserved - pooledExpected) ** 2 / pooledExpected;
        bins += 1;
      }
      const p = 1 - jStat.chisquare.cdf(statistic, bins - 1);
      assert.ok(p > 1e-4, `category ${j}: chi-square ${statistic} on ${bins - 1} df, p = ${p}`);
    }
  });

  it('puts every observation in the only category with a positive proportion', () => {
    const sampler = randomMultinomialSampler([0, 3, 0], 12, monteCarloLogFactorials(12));
    const counts = new Int32Array(3);
    sampler.sample(createRandom(1), counts);
    assert.deepEqual(Array.from(counts), [0, 12, 0]);
  });
});
