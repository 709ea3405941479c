import assert from 'node:assert/strict';
import fc from 'fast-check';
import { jStat } from 'jstat';
import type { FitRequest } from '../../../src/core/stats/fitRequest';
import { testGoodnessOfFit } from '../../../src/core/stats/testGoodnessOfFit';
import type { GoodnessOfFitResult } from '../../../src/core/stats/types';
import { assertClose } from '../../helpers/assertClose';
import { readScipyFixture } from './scipyFixture';

interface FitExpected {
  statistic: number;
  p: number;
  df: number;
  expected: number[];
  gStatistic: number;
  gP: number;
  proportionIntervals: [number, number][];
  mean?: number;
  probability?: number;
  rescaled?: boolean;
}

const fixture = readScipyFixture<{ observed: number[]; hypothesis: FitRequest; confidenceLevel: number }, FitExpected>('goodnessOfFit.json');
const PROPERTY_SEED = 20260611;

function run(observed: number[], hypothesis: FitRequest, options = {}): GoodnessOfFitResult {
  const result = testGoodnessOfFit(observed, hypothesis, options);
  if (!result.ok) throw new Error(result.issue.message);
  return result.value;
}

describe('testGoodnessOfFit', () => {
  describe('published example', () => {
    // Mendel's dihybrid cross (round-yellow, wrinkled-yellow, round-green, wrinkled-green) against 9:3:3:1,
    // a classic textbook example: X² ≈ 0.470 on 3 df, p ≈ 0.93 (common practice; values from memory).
    const mendel = run([315, 108, 101, 32], { kind: 'ratio', ratio: [9, 3, 3, 1], text: '9:3:3:1' });

    it('gives X² ≈ 0.470 on 3 df with p ≈ 0.93', () => {
      assert.equal(mendel.df, 3);
      assertClose(mendel.statistic, 0.47, { absolute: 5e-4 });
      assertClose(mendel.p, 0.925, { absolute: 5e-3 });
    });

    it('expects 556 · 9/16 = 312.75 in the first class', () => {
      assertClose(mendel.expected[0], 312.75, 1e-14);
      assert.deepEqual(mendel.hypothesis, { kind: 'ratio', ratio: [9, 3, 3, 1], text: '9:3:3:1' });
    });

    it("divides G² by Williams' q = 1 + (k + 1)/(6N) when nothing is estimated", () => {
      assertClose(mendel.g.williamsQ, 1 + 5 / (6 * 556), 1e-14);
    });
  });

  describe('against SciPy fixtures', () => {
    for (const { name, input, expected, tolerance } of fixture.cases) {
      it(`agrees with scipy.stats.chisquare/power_divergence ${fixture.referenceVersion} on ${name}`, () => {
        const result = run(input.observed, input.hypothesis, { confidenceLevel: input.confidenceLevel });
        assert.equal(result.df, expected.df);
        assertClose(result.statistic, expected.statistic, tolerance.relative, input);
        // p at the fixture tolerance (1e-10 relative).
        assertClose(result.p, expected.p, tolerance.p, input);
        assertClose(result.g.statistic, expected.gStatistic, tolerance.relative, input);
        assertClose(result.g.p, expected.gP, tolerance.p, input);
        result.expected.forEach((value, i) => assertClose(value, expected.expected[i], tolerance.relative, [name, i]));
        result.proportions.forEach((interval, i) => {
          assertClose(interval.lower, expected.proportionIntervals[i][0], { relative: tolerance.relative, absolute: 1e-15 }, [name, i]);
          assertClose(interval.upper, expected.proportionIntervals[i][1], { relative: tolerance.relative, absolute: 1e-15 }, [name, i]);
        });
        const hypothesis = result.hypothesis;
        if (hypothesis.kind === 'poisson') assertClose(hypothesis.mean, expected.mean as number, tolerance.relative, input);
        if (hypothesis.kind === 'binomial') assertClose(hypothesis.probability, expected.probability as number, tolerance.relative, input);
        if (hypothesis.kind === 'expected-counts') assert.equal(hypothesis.rescaled, expected.rescaled);
      });
    }
  });

  describe('against jstat, live', () => {
    it('gives the upper-tail p of jstat 1.9.6 chisquare.cdf', () => {
      for (const observed of [[18, 22, 30, 30], [5, 9, 16], [40, 35, 25, 30, 20, 50]]) {
        const result = run(observed, { kind: 'equal' });
        assertClose(result.p, 1 - jStat.chisquare.cdf(result.statistic, result.df), { absolute: 1e-6 }, observed);
      }
    });

    it('expects Poisson probabilities from jstat 1.9.6 poisson.pdf/cdf for a closed top category', () => {
      const observed = [12, 20, 15, 8, 5];
      const result = run(observed, { kind: 'poisson', values: [0, 1, 2, 3, 4], openEnded: false });
      const mean = (20 + 30 + 24 + 20) / 60;
      assert.ok(result.hypothesis.kind === 'poisson');
      assertClose(result.hypothesis.mean, mean, 1e-15);
      [0, 1, 2, 3].forEach((k) => assertClose(result.expectedProportions[k], jStat.poisson.pdf(k, mean), 1e-10, k));
      assertClose(result.expectedProportions[4], 1 - jStat.poisson.cdf(3, mean), 1e-10);
    });
  });

  describe('residuals, flags and validity', () => {
    const result = run([60, 20, 20], { kind: 'equal' }, { labels: ['red', 'green', 'blue'] });

    it('standardizes residuals by √(E(1 − π))', () => {
      const e = 100 / 3;
      assertClose(result.standardizedResiduals[0], (60 - e) / Math.sqrt(e * (2 / 3)), 1e-14);
      assertClose(result.pearsonResiduals[0], (60 - e) / Math.sqrt(e), 1e-14);
    });

    it('flags categories beyond the Bonferroni value over k categories, largest first', () => {
      assertClose(result.residualCriticalValue, jStat.normal.inv(1 - 0.05 / 6, 0, 1), 1e-8);
      assert.deepEqual(result.flaggedCells.map((cell) => cell.index), [0, 1, 2]);
      assert.ok(result.flaggedCells[0].residual > 0);
    });

    it('puts categories down a column by default and along a row on request', () => {
      const sparse = run([3, 1, 30], { kind: 'equal' });
      assert.equal(sparse.validity.ok, true);
      const tiny = run([3, 1, 2], { kind: 'equal' }, { categoriesAlong: 'columns' });
      assert.equal(tiny.validity.ok, false);
      assert.deepEqual(tiny.validity.sparseCells.map((cell) => [cell.row, cell.column]), [[0, 0], [0, 1], [0, 2]]);
      const down = run([3, 1, 2], { kind: 'equal' });
      assert.deepEqual(down.validity.sparseCells.map((cell) => [cell.row, cell.column]), [[0, 0], [1, 0], [2, 0]]);
    });
  });

  describe('hypotheses', () => {
    it('rescales expected counts that do not total N and says so', () => {
      const result = run([30, 50, 20], { kind: 'expected-counts', counts: [25, 25, 50] });
      assert.deepEqual(result.expected, [25, 25, 50]);
      assert.deepEqual(result.hypothesis, { kind: 'expected-counts', counts: [25, 25, 50], rescaled: false });
      const rescaled = run([30, 50, 20], { kind: 'expected-counts', counts: [10, 10, 20] });
      assert.deepEqual(rescaled.expected, [25, 25, 50]);
      assert.ok(rescaled.hypothesis.kind === 'expected-counts' && rescaled.hypothesis.rescaled);
    });

    it('estimates an open-ended Poisson mean above the one that counts "4+" as 4', () => {
      const observed = [20, 30, 25, 15, 10];
      const result = run(observed, { kind: 'poisson', values: [0, 1, 2, 3, 4], openEnded: true });
      assert.ok(result.hypothesis.kind === 'poisson');
      assert.ok(result.hypothesis.mean > (30 + 50 + 45 + 40) / 100);
      assert.equal(result.estimatedParameters, 1);
      assert.equal(result.df, 3);
    });

    it('uses the largest label as the number of binomial trials', () => {
      const result = run([10, 40, 35, 15], { kind: 'binomial', values: [0, 1, 2, 3], trials: 3, openEnded: false });
      assert.ok(result.hypothesis.kind === 'binomial');
      assertClose(result.hypothesis.probability, (40 + 70 + 45) / 300, 1e-15);
      assert.equal(result.df, 2);
    });
  });

  describe('refusals', () => {
    const issueOf = (observed: number[], hypothesis: FitRequest) => {
      const result = testGoodnessOfFit(observed, hypothesis);
      assert.equal(result.ok, false);
      return result.ok ? undefined : result.issue;
    };

    it('refuses a Poisson fit that leaves no degree of freedom', () => {
      const issue = issueOf([30, 12], { kind: 'poisson', values: [0, 1], openEnded: true });
      assert.equal(issue?.code, 'too-few-categories');
      assert.match(issue?.message ?? '', /leaves 0 degrees of freedom .* at least 3 categories/);
    });

    it('refuses a ratio with the wrong number of parts, one category, and an all-zero vector', () => {
      assert.equal(issueOf([3, 4, 5], { kind: 'ratio', ratio: [1, 1], text: '1:1' })?.code, 'bad-expected');
      assert.equal(issueOf([7], { kind: 'equal' })?.code, 'too-few-categories');
      assert.equal(issueOf([0, 0, 0], { kind: 'equal' })?.code, 'all-zero-table');
      assert.equal(issueOf([3, 4], { kind: 'expected-counts', counts: [5, 0] })?.code, 'bad-expected');
    });

    it('refuses Poisson data that are all 0 or all in the open top category', () => {
      assert.match(issueOf([20, 0, 0], { kind: 'poisson', values: [0, 1, 2], openEnded: false })?.message ?? '', /mean is 0/);
      assert.match(issueOf([0, 0, 9], { kind: 'poisson', values: [0, 1, 2], openEnded: true })?.message ?? '', /open-ended category 2\+/);
    });
  });

  describe('merge proposal', () => {
    it('pools a thin Poisson tail such as 4 and 5+ into 4+ when labels are given', () => {
      const result = run([30, 40, 20, 6, 3, 1], { kind: 'poisson', values: [0, 1, 2, 3, 4, 5], openEnded: true }, { labels: ['0', '1', '2', '3', '4', '5+'] });
      assert.equal(result.validity.ok, false);
      assert.deepEqual(result.mergeProposal?.labels, ['0', '1', '2', '3', '4+']);
      assert.equal(result.mergeProposal?.passes, true);
      assert.equal(result.mergeProposal?.df, 3);
    });

    it('makes no proposal without labels or when the rule holds', () => {
      assert.equal(run([30, 40, 20, 6, 3, 1], { kind: 'poisson', values: [0, 1, 2, 3, 4, 5], openEnded: true }).mergeProposal, undefined);
      assert.equal(run([30, 40, 20], { kind: 'equal' }, { labels: ['a', 'b', 'c'] }).mergeProposal, undefined);
    });
  });

  describe('identities (fast-check)', () => {
    const countsArbitrary = fc.array(fc.integer({ min: 0, max: 200 }), { minLength: 2, maxLength: 9 }).filter((counts) => counts.some((c) => c > 0));

    it('has expected counts totalling N, contributions summing to X², p in [0, 1] and w = √(X²/N)', () => {
      fc.assert(fc.property(countsArbitrary, fc.array(fc.integer({ min: 1, max: 20 }), { minLength: 9, maxLength: 9 }), (observed, parts) => {
        const ratio = parts.slice(0, observed.length);
        const result = run(observed, { kind: 'ratio', ratio, text: ratio.join(':') });
        assertClose(result.expected.reduce((s, v) => s + v, 0), result.n, 1e-12, observed);
        assertClose(result.expectedProportions.reduce((s, v) => s + v, 0), 1, 1e-12, observed);
        assertClose(result.contributions.reduce((s, v) => s + v, 0), result.statistic, 1e-12, observed);
        assert.ok(result.p >= 0 && result.p <= 1 && result.g.p >= 0 && result.g.p <= 1);
        assertClose(result.cohensW, Math.sqrt(result.statistic / result.n), 1e-15, observed);
        for (const interval of result.proportions) assert.ok(interval.lower <= interval.estimate && interval.estimate <= interval.upper);
      }), { seed: PROPERTY_SEED, numRuns: 200 });
    });

    it('is unchanged when categories and their ratio parts are permuted together', () => {
      fc.assert(fc.property(countsArbitrary.chain((observed) => fc.tuple(
        fc.constant(observed),
        fc.array(fc.integer({ min: 1, max: 9 }), { minLength: observed.length, maxLength: observed.length }),
        fc.shuffledSubarray(observed.map((_, i) => i), { minLength: observed.length, maxLength: observed.length }),
      )), ([observed, ratio, order]) => {
        const a = run(observed, { kind: 'ratio', ratio, text: '' });
        const b = run(order.map((i) => observed[i]), { kind: 'ratio', ratio: order.map((i) => ratio[i]), text: '' });
        assertClose(b.statistic, a.statistic, { relative: 1e-12, absolute: 1e-12 }, observed);
        assertClose(b.g.statistic, a.g.statistic, { relative: 1e-12, absolute: 1e-12 }, observed);
        assertClose(b.p, a.p, { relative: 1e-9, absolute: 1e-15 }, observed);
      }), { seed: PROPERTY_SEED, numRuns: 150 });
    });

    it('never throws or gives NaN for Poisson fits to random counts', () => {
      fc.assert(fc.property(fc.array(fc.integer({ min: 0, max: 60 }), { minLength: 3, maxLength: 8 }), fc.boolean(), (observed, openEnded) => {
        const result = testGoodnessOfFit(observed, { kind: 'poisson', values: observed.map((_, i) => i), openEnded }, { labels: observed.map((_, i) => (i === observed.length - 1 && openEnded ? `${i}+` : String(i))) });
        if (!result.ok) return;
        const numbers = [result.value.statistic, result.value.p, result.value.g.statistic, ...result.value.expected, ...result.value.standardizedResiduals];
        assert.ok(numbers.every(Number.isFinite), JSON.stringify(observed));
      }), { seed: PROPERTY_SEED, numRuns: 200 });
    });
  });
});
