import gammaln from '@stdlib/math-base-special-gammaln';
import { monteCarloLogFactorials } from '../../../src/core/exact/monteCarloLogFactorials';
import { assertClose } from '../../helpers/assertClose';

describe('monteCarloLogFactorials', () => {
  it('matches log Γ(k + 1) from @stdlib to a few units in the last place up to k = 200,000', () => {
    const table = monteCarloLogFactorials(200_000);
    for (const k of [0, 1, 2, 3, 10, 57, 170, 171, 1000, 4321, 65_536, 99_999, 200_000]) {
      assertClose(table[k], gammaln(k + 1), { relative: 4e-15, absolute: 0 }, { k });
    }
  });
});
