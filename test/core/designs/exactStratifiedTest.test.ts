import assert from 'node:assert/strict';
import fc from 'fast-check';
import { jStat } from 'jstat';
import type { StratumTable } from '../../../src/core/designs/cochranMantelHaenszel';
import { exactStratifiedTest } from '../../../src/core/designs/exactStratifiedTest';
import { fisherExact2x2 } from '../../../src/core/exact/fisherExact2x2';
import { assertClose } from '../../helpers/assertClose';

const PROPERTY_SEED = 20261202;

/** The definition, by enumeration: every (a_1, …, a_K) the margins allow, with jstat's hypergeometric pmf (run live). */
function bruteForce(strata: StratumTable[]): { p: number; pLess: number; pGreater: number } {
  const used = strata.filter(([[a, b], [c, d]]) => a + b + c + d >= 2);
  const ranges = used.map(([[a, b], [c, d]]) => {
    const row = a + b, column = a + c, n = a + b + c + d;
    const values: { x: number; probability: number }[] = [];
    for (let x = Math.max(0, column - (c + d)); x <= Math.min(row, column); x++) values.push({ x, probability: jStat.hypgeom.pdf(x, n, row, column) });
    return values;
  });
  const bySum = new Map<number, number>();
  const walk = (k: number, sum: number, probability: number) => {
    if (k === ranges.length) { bySum.set(sum, (bySum.get(sum) ?? 0) + probability); return; }
    for (const { x, probability: q } of ranges[k]) walk(k + 1, sum + x, probability * q);
  };
  walk(0, 0, 1);
  const observed = used.reduce((sum, [[a]]) => sum + a, 0);
  const pObserved = bySum.get(observed)!;
  let p = 0, pLess = 0, pGreater = 0;
  for (const [sum, probability] of bySum) {
    if (probability <= pObserved * (1 + 1e-7)) p += probability;
    if (sum <= observed) pLess += probability;
    if (sum >= observed) pGreater += probability;
  }
  return { p: Math.min(1, p), pLess: Math.min(1, pLess), pGreater: Math.min(1, pGreater) };
}

const smallStratum = fc.tuple(fc.nat(6), fc.nat(6), fc.nat(6), fc.nat(6)).map(([a, b, c, d]): StratumTable => [[a, b], [c, d]]);

describe('exactStratifiedTest', () => {
  it('equals brute-force enumeration (jstat hypergeometric, live) on 300 random sets of 1–4 small strata', () => {
    fc.assert(fc.property(fc.array(smallStratum, { minLength: 1, maxLength: 4 }), (strata) => {
      fc.pre(strata.some(([[a, b], [c, d]]) => a + b + c + d >= 2));
      const exact = exactStratifiedTest(strata)!;
      const reference = bruteForce(strata);
      // jstat's pmf is accurate to about 1e-12 relative; sums of a few hundred terms stay within 1e-9.
      assertClose(exact.p, reference.p, { absolute: 1e-9 });
      assertClose(exact.pLess, reference.pLess, { absolute: 1e-9 });
      assertClose(exact.pGreater, reference.pGreater, { absolute: 1e-9 });
    }), { seed: PROPERTY_SEED, numRuns: 300 });
  });

  it('reduces to Fisher\'s exact test for one stratum, including the tea-tasting table (Fisher 1935: p = 34/70 two-sided)', () => {
    const tea: StratumTable = [[3, 1], [1, 3]];
    assertClose(exactStratifiedTest([tea])!.p, 34 / 70, 1e-12);
    fc.assert(fc.property(smallStratum, (stratum) => {
      fc.pre(stratum.flat().reduce((a, b) => a + b, 0) >= 2);
      assertClose(exactStratifiedTest([stratum])!.p, fisherExact2x2(stratum).p, { absolute: 1e-12 });
    }), { seed: PROPERTY_SEED, numRuns: 200 });
  });

  it('keeps log10p meaningful when p is below the smallest double', () => {
    const strong: StratumTable[] = Array.from({ length: 12 }, () => [[200, 0], [0, 200]] as StratumTable);
    const result = exactStratifiedTest(strong)!;
    assert.ok(result.log10p < -400 && Number.isFinite(result.log10p), String(result.log10p));
    // One stratum's P(a = 200) = 1/C(400, 200); the 12 strata multiply, and the two-sided p doubles it.
    const oneStratum = -(jStat.gammaln(401) - 2 * jStat.gammaln(201)) / Math.LN10;
    assertClose(result.log10p, 12 * oneStratum + Math.log10(2), { absolute: 1e-6 });
  });
});
