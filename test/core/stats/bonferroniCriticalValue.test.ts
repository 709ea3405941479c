import assert from 'node:assert/strict';
import { jStat } from 'jstat';
import { bonferroniCriticalValue } from '../../../src/core/stats/bonferroniCriticalValue';
import { assertClose } from '../../helpers/assertClose';

describe('bonferroniCriticalValue', () => {
  it('is the familiar 1.96 for one comparison at α = 0.05 (handbook value 1.959964)', () => {
    assertClose(bonferroniCriticalValue(0.05, 1), 1.959964, { absolute: 1e-6 });
  });

  for (const [alpha, m] of [[0.05, 6], [0.01, 20], [0.1, 48]]) {
    it(`matches jstat 1.9.6 normal.inv(1 − α/2m) for α = ${alpha}, m = ${m}`, () => {
      assertClose(bonferroniCriticalValue(alpha, m), jStat.normal.inv(1 - alpha / (2 * m), 0, 1), 1e-8, [alpha, m]);
    });
  }

  it('throws on an impossible alpha', () => {
    assert.throws(() => bonferroniCriticalValue(0, 4), RangeError);
  });
});
