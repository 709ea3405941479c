import assert from 'node:assert/strict';
import { proposeFitMerge } from '../../../src/core/stats/proposeFitMerge';
import { assertClose } from '../../helpers/assertClose';

describe('proposeFitMerge', () => {
  it('pools the thin tail of an ordered scale, e.g. 4 and 5+ into 4+, and re-tests with the pooled expected counts', () => {
    const observed = [30, 40, 20, 6, 3, 1];
    const expected = [28, 40, 22, 7, 2.4, 0.6];
    const proposal = proposeFitMerge(observed, expected, 1, ['0', '1', '2', '3', '4', '5+'], { ordered: true, categoriesAlong: 'rows' });
    assert.ok(proposal);
    assert.deepEqual(proposal.labels, ['0', '1', '2', '3', '4+']);
    assert.deepEqual(proposal.observed, [[30], [40], [20], [6], [4]]);
    assert.equal(proposal.df, 3);
    const pooled = [28, 40, 22, 7, 3];
    assertClose(proposal.statistic, [30, 40, 20, 6, 4].reduce((s, o, i) => s + (o - pooled[i]) ** 2 / pooled[i], 0), 1e-14);
  });

  it('keeps at least one degree of freedom after the estimated parameters', () => {
    const proposal = proposeFitMerge([2, 1, 1, 1], [1.5, 1.2, 1.1, 1.2], 1, ['0', '1', '2', '3+'], { ordered: true, categoriesAlong: 'rows' });
    assert.ok(proposal);
    assert.equal(proposal.groups.length, 3);
    assert.equal(proposal.df, 1);
    assert.equal(proposal.passes, false);
  });

  it('pools unordered categories by smallest expected count, shaped along a row when asked', () => {
    const proposal = proposeFitMerge([40, 3, 30, 2], [38, 4, 33, 3], 0, ['tulip', 'iris', 'rose', 'lily'], { ordered: false, categoriesAlong: 'columns' });
    assert.deepEqual(proposal?.groups, [['tulip'], ['iris', 'lily'], ['rose']]);
    assert.deepEqual(proposal?.labels, ['tulip', 'iris + lily', 'rose']);
    assert.deepEqual(proposal?.observed, [[40, 5, 30]]);
    assert.equal(proposal?.dimension, 'columns');
  });
});
