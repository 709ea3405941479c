import assert from 'node:assert/strict';
import { jStat } from 'jstat';
import { logGamma } from '../../../src/core/special/logGamma';
import { assertClose } from '../../helpers/assertClose';

describe('logGamma', () => {
  it('gives log((n−1)!) exactly for whole n, with factorials exact in doubles up to 22!', () => {
    let factorial = 1;
    for (let n = 1; n <= 22; n++) {
      assertClose(logGamma(n + 1), Math.log((factorial *= n)), { relative: 1e-15, absolute: 1e-15 }, { n: n + 1 });
    }
  });

  it('agrees with jstat gammaln (run live) to 1e-10 relative', () => {
    for (const x of [0.1, 0.5, 1.5, 3.3, 10, 171.5, 1e4, 1e6]) {
      assertClose(logGamma(x), jStat.gammaln(x), 1e-10, { x });
    }
  });

  it('gives Γ(½) = √π', () => {
    assertClose(logGamma(0.5), 0.5 * Math.log(Math.PI), 1e-15, { x: 0.5 });
    assert.ok(Number.isNaN(logGamma(NaN)));
  });
});
