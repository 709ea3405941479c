import assert from 'node:assert/strict';
import { jStat } from 'jstat';
import { logFactorialTable } from '../../../../src/core/exact/network/logFactorialTable';
import { assertClose } from '../../../helpers/assertClose';

describe('logFactorialTable', () => {
  it('holds log k! for k = 0…n, as jStat.gammaln(k + 1) gives it', () => {
    const table = logFactorialTable(3000);
    assert.equal(table.length, 3001);
    assert.equal(table[0], 0);
    assert.equal(table[1], 0);
    assertClose(table[4], Math.log(24), 1e-15);
    // jStat's Lanczos gammaln is good to ~1e-13 relative; that is the tolerance of the comparison.
    for (const k of [2, 10, 50, 170, 171, 1000, 3000]) assertClose(table[k], jStat.gammaln(k + 1), 1e-12, k);
  });

  it('gives up between chunks when asked to', () => {
    let asked = 0;
    const table = logFactorialTable(1_000_000, () => ++asked > 2);
    assert.equal(table, undefined);
    assert.equal(asked, 3);
  });
});
