import assert from 'node:assert/strict';
import { jStat } from 'jstat';
import { chiSquareUpperTail } from '../../../src/core/special/chiSquareUpperTail';
import { assertClose } from '../../helpers/assertClose';
import { readMpmathFixture, relativeError } from './mpmathFixture';

const fixture = readMpmathFixture<{ x: number; df: number }, { p?: string; log10p: string }, { p: number; log10p: number }>(
  'chiSquareUpperTail',
);
/** jstat 1.9.6's chi-square cdf is good to about 1e-6 (its incomplete gamma stops early): compare only there. */
const JSTAT_ABSOLUTE_TOLERANCE = 1e-6;
const SMALLEST_NORMAL = 2.2250738585072014e-308;

describe('chiSquareUpperTail', () => {
  it('matches 50-digit mpmath p to 1e-12 relative wherever p is a normal double (df 0.1 to 100,000)', () => {
    let worst = 0;
    let checked = 0;
    for (const c of fixture.cases) {
      if (c.expected.p === undefined) continue;
      const { p } = chiSquareUpperTail(c.input.x, c.input.df);
      assertClose(p, Number(c.expected.p), c.tolerance.p, c.input);
      worst = Math.max(worst, relativeError(p, Number(c.expected.p)));
      checked++;
    }
    assert.ok(checked > 500, `only ${checked} cases with p`);
    assert.ok(worst < 1e-12, `largest relative error ${worst}`);
  });

  it('matches mpmath log10p to 1e-12 relative, also where p underflows to 0', () => {
    let underflowed = 0;
    for (const c of fixture.cases) {
      const { p, log10p } = chiSquareUpperTail(c.input.x, c.input.df);
      assertClose(log10p, Number(c.expected.log10p), c.tolerance.log10p, c.input);
      if (c.expected.p === undefined) {
        assert.ok(p < SMALLEST_NORMAL, `p = ${p} for ${c.name}, where the reference is below the smallest normal double`);
        underflowed++;
      }
    }
    assert.ok(underflowed > 50, `only ${underflowed} underflow cases`);
  });

  it('gives p = 0 and log10p ≈ −1087.68 at x = 5000, df = 1 (reference value in the fixture)', () => {
    const reference = fixture.cases.find((c) => c.input.x === 5000 && c.input.df === 1);
    assert.ok(reference, 'fixture case x=5000 df=1 missing');
    const { p, log10p } = chiSquareUpperTail(5000, 1);
    assert.equal(p, 0);
    assertClose(log10p, Number(reference.expected.log10p), 1e-12, reference.input);
  });

  it('agrees with jstat (run live) to 1e-6 absolute where jstat is accurate, p in [1e-6, 1]', () => {
    let compared = 0;
    for (const df of [1, 2, 3, 4, 5, 8, 10, 15, 20, 30, 50, 100]) {
      for (let quantileStep = 0; quantileStep <= 60; quantileStep++) {
        const x = (quantileStep / 20) * (df + 6 * Math.sqrt(2 * df));
        const ours = chiSquareUpperTail(x, df).p;
        if (ours < 1e-6) continue;
        assertClose(ours, 1 - jStat.chisquare.cdf(x, df), { absolute: JSTAT_ABSOLUTE_TOLERANCE }, { x, df });
        compared++;
      }
    }
    assert.ok(compared > 300, `compared only ${compared}`);
  });

  it('falls as x grows and rises as df grows', () => {
    for (const df of [1, 3, 30, 3000, 100000]) {
      let previous = chiSquareUpperTail(0, df).log10p;
      for (let step = 1; step <= 400; step++) {
        const current = chiSquareUpperTail((step / 100) * df, df).log10p;
        assert.ok(current <= previous, `log10p rose at df=${df}, x=${(step / 100) * df}`);
        previous = current;
      }
    }
    for (const x of [0.5, 5, 500, 50000]) {
      let previous = -Infinity;
      for (let df = 1; df <= 2 * x + 10; df = Math.ceil(df * 1.3)) {
        const current = chiSquareUpperTail(x, df).p;
        assert.ok(current >= previous, `p fell at x=${x}, df=${df}`);
        previous = current;
      }
    }
  });

  it('gives p = 1 for x ≤ 0, p = 0 at x = Infinity, and NaN for NaN or df ≤ 0', () => {
    assert.deepEqual(chiSquareUpperTail(0, 3), { p: 1, log10p: 0 });
    assert.deepEqual(chiSquareUpperTail(-2, 3), { p: 1, log10p: 0 });
    assert.deepEqual(chiSquareUpperTail(Infinity, 3), { p: 0, log10p: -Infinity });
    for (const [x, df] of [[NaN, 3], [2, NaN], [2, 0], [2, -1], [2, Infinity]]) {
      const result = chiSquareUpperTail(x, df);
      assert.ok(Number.isNaN(result.p) && Number.isNaN(result.log10p), `x=${x}, df=${df}`);
    }
  });
});
