import assert from 'node:assert/strict';
import fc from 'fast-check';
import { jStat } from 'jstat';
import { binomialLogPmf } from '../../../src/core/stats/binomialLogPmf';
import { binomialLogUpperTail } from '../../../src/core/stats/binomialLogUpperTail';
import { fitBinomialProbability } from '../../../src/core/stats/fitBinomialProbability';
import { fitPoissonMean } from '../../../src/core/stats/fitPoissonMean';
import { logPoissonProbability } from '../../../src/core/special/logPoissonProbability';
import { poissonLogUpperTail } from '../../../src/core/stats/poissonLogUpperTail';
import { assertClose } from '../../helpers/assertClose';

const PROPERTY_SEED = 20260611;

describe('logPoissonProbability and poissonLogUpperTail', () => {
  it('match jstat 1.9.6 poisson.pdf and 1 − poisson.cdf, live', () => {
    for (const mean of [0.3, 1.5, 4, 12.5]) {
      for (const k of [0, 1, 3, 7, 15]) {
        assertClose(Math.exp(logPoissonProbability(k, mean)), jStat.poisson.pdf(k, mean), 1e-11, [k, mean]);
        const upper = k === 0 ? 1 : 1 - jStat.poisson.cdf(k - 1, mean);
        if (upper > 1e-6) assertClose(Math.exp(poissonLogUpperTail(k, mean)), upper, 1e-9, [k, mean]);
      }
    }
  });

  it('keeps a tiny tail accurate where 1 − cdf cannot: P(X ≥ 40 | μ = 2) ≈ P(X = 40)(1 + 2/41 + …)', () => {
    const log = poissonLogUpperTail(40, 2);
    const leading = logPoissonProbability(40, 2);
    assert.ok(log > leading && log - leading < Math.log(1 + 2 / 41 + 0.01));
    assert.ok(Number.isFinite(poissonLogUpperTail(400, 0.5)));
  });
});

describe('binomialLogPmf and binomialLogUpperTail', () => {
  it('match jstat 1.9.6 binomial.pdf and 1 − binomial.cdf, live', () => {
    for (const [n, p] of [[4, 0.5], [10, 0.3], [25, 0.82]]) {
      for (let k = 0; k <= n; k += 3) {
        assertClose(Math.exp(binomialLogPmf(k, n, p)), jStat.binomial.pdf(k, n, p), 1e-10, [k, n, p]);
        const upper = k === 0 ? 1 : 1 - jStat.binomial.cdf(k - 1, n, p);
        if (upper > 1e-6) assertClose(Math.exp(binomialLogUpperTail(k, n, p)), upper, 1e-9, [k, n, p]);
      }
    }
  });
});

describe('fitPoissonMean', () => {
  it('is the sample mean for exact categories', () => {
    assert.deepEqual(fitPoissonMean([10, 20, 15, 5], false), { ok: true, value: (20 + 30 + 15) / 50 });
  });

  it('solves the censored score equation and lies above the mean that counts "K+" as K (fast-check)', () => {
    fc.assert(fc.property(fc.array(fc.integer({ min: 0, max: 80 }), { minLength: 3, maxLength: 8 }), (observed) => {
      const top = observed.length - 1;
      const exactCount = observed.slice(0, top).reduce((s, v) => s + v, 0);
      const n = exactCount + observed[top];
      const naive = observed.reduce((s, c, k) => s + c * k, 0) / n;
      const fitted = fitPoissonMean(observed, true);
      if (!fitted.ok) {
        assert.ok(!(naive > 0) || exactCount === 0);
        return;
      }
      assert.ok(fitted.value >= naive);
      if (observed[top] > 0) {
        const mean = fitted.value;
        const exactSum = observed.slice(0, top).reduce((s, c, k) => s + c * k, 0);
        const score = exactSum / mean - exactCount + observed[top] * Math.exp(logPoissonProbability(top - 1, mean) - poissonLogUpperTail(top, mean));
        assertClose(score, 0, { absolute: 1e-8 * n }, observed);
      }
    }), { seed: PROPERTY_SEED, numRuns: 200 });
  });
});

describe('fitBinomialProbability', () => {
  it('is mean/n for exact categories and refuses 0 and 1', () => {
    assert.deepEqual(fitBinomialProbability([5, 10, 5], 2, false), { ok: true, value: 0.5 });
    assert.equal(fitBinomialProbability([9, 0, 0], 2, false).ok, false);
    assert.equal(fitBinomialProbability([0, 0, 9], 2, false).ok, false);
  });

  it('exceeds the naive estimate when the top category is open-ended and below the number of trials', () => {
    const fitted = fitBinomialProbability([10, 30, 25, 20], 8, true);
    assert.ok(fitted.ok && fitted.value > (30 + 50 + 60) / (85 * 8));
  });
});
