import assert from 'node:assert/strict';
import { hypergeometricLogTail } from '../../../src/core/exact/hypergeometricLogTail';
import { hypergeometricMargins } from '../../../src/core/exact/hypergeometricMargins';
import { assertClose } from '../../helpers/assertClose';
import { binomial, ratioToNumber } from './fisherExactRational';

describe('hypergeometricLogTail', () => {
  it('matches exact rational tail sums from every start on the falling sides', () => {
    for (const table of [[[3, 1], [1, 3]], [[20, 15], [7, 30]], [[120, 300], [260, 90]], [[5, 900], [40, 300]]]) {
      const margins = hypergeometricMargins(table);
      const { rowTotal: m, otherRowTotal: n, columnTotal: k, lowest, highest, mode } = margins;
      const weight = (x: number) => binomial(m, x) * binomial(n, k - x);
      const denominator = binomial(m + n, k);
      for (let start = lowest; start <= highest; start++) {
        let exact = 0n;
        if (start <= mode) {
          for (let x = lowest; x <= start; x++) exact += weight(x);
          assertClose(hypergeometricLogTail(margins, start, 'down').logTail, Math.log(ratioToNumber(exact, denominator)), { relative: 1e-12, absolute: 1e-13 }, { table, start });
        }
        exact = 0n;
        if (start >= mode) {
          for (let x = start; x <= highest; x++) exact += weight(x);
          const tail = hypergeometricLogTail(margins, start, 'up');
          assertClose(tail.logTail, Math.log(ratioToNumber(exact, denominator)), { relative: 1e-12, absolute: 1e-13 }, { table, start });
          assertClose(tail.rest, ratioToNumber(exact - weight(start), weight(start)), { relative: 1e-12, absolute: 1e-300 }, { table, start });
        }
      }
    }
  });

  it('stops after a few standard deviations even for N = 10^7', () => {
    const margins = hypergeometricMargins([[2500000, 2500000], [2500000, 2500000]]);
    const started = performance.now();
    const tail = hypergeometricLogTail(margins, margins.mode, 'up');
    assert.ok(performance.now() - started < 200);
    // Half the mass plus half the mode's probability, by symmetry.
    assertClose(Math.exp(tail.logTail), 0.5 + 0.5 * Math.exp(tail.logStart), 1e-12);
  });
});
