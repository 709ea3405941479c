import assert from 'node:assert/strict';
import { gTest } from '../../../src/core/stats/gTest';
import { independenceStatistic } from '../../../src/core/stats/independenceStatistic';
import { yatesStatistic } from '../../../src/core/stats/yatesStatistic';
import { assertClose } from '../../helpers/assertClose';

describe('gTest', () => {
  it('treats O = 0 cells as contributing nothing and reports 0 rather than a rounding negative', () => {
    const g = gTest([0, 10], [5, 5], 1, 1);
    assertClose(g.statistic, 2 * 10 * Math.log(2), 1e-15);
    assert.equal(gTest([5, 5], [5, 5], 1, 1).statistic, 0);
  });
});

describe('yatesStatistic', () => {
  it('is 0 when every |O − E| is below one half', () => {
    assert.equal(yatesStatistic([[10, 10], [10, 11]]), 0);
  });

  it('equals Σ(|O − E| − ½)²/E for a 2×2 table (Yates 1934, common practice form)', () => {
    const table = [[12, 5], [7, 14]];
    const n = 38;
    const rows = [17, 21];
    const columns = [19, 19];
    let sum = 0;
    table.forEach((row, i) => row.forEach((o, j) => {
      const e = (rows[i] * columns[j]) / n;
      sum += (Math.abs(o - e) - 0.5) ** 2 / e;
    }));
    assertClose(yatesStatistic(table), sum, 1e-13);
  });
});

describe('independenceStatistic', () => {
  it('applies Yates only to 2×2 tables when asked', () => {
    const table = [[12, 5], [7, 14]];
    assert.equal(independenceStatistic(table, 'yates').statistic, yatesStatistic(table));
    assert.ok(independenceStatistic(table, 'none').statistic > yatesStatistic(table));
    assert.equal(independenceStatistic([[1, 2, 3], [4, 5, 7]], 'yates').df, 2);
  });
});
