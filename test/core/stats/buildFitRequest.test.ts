import assert from 'node:assert/strict';
import { buildFitRequest } from '../../../src/core/stats/buildFitRequest';

describe('buildFitRequest', () => {
  it('reads Poisson category values from labels, with an open-ended last one', () => {
    assert.deepEqual(buildFitRequest({ kind: 'poisson' }, ['0', '1', '2', '3', '4', '5+']), { ok: true, value: { kind: 'poisson', values: [0, 1, 2, 3, 4, 5], openEnded: true } });
    assert.deepEqual(buildFitRequest({ kind: 'poisson' }, ['0', '1', '≥2']), { ok: true, value: { kind: 'poisson', values: [0, 1, 2], openEnded: true } });
    assert.deepEqual(buildFitRequest({ kind: 'poisson' }, [' 0', '1 ', '2']), { ok: true, value: { kind: 'poisson', values: [0, 1, 2], openEnded: false } });
  });

  it('takes binomial trials from the largest label unless given', () => {
    assert.deepEqual(buildFitRequest({ kind: 'binomial' }, ['0', '1', '2', '3']), { ok: true, value: { kind: 'binomial', values: [0, 1, 2, 3], trials: 3, openEnded: false } });
    assert.deepEqual(buildFitRequest({ kind: 'binomial', trials: 10 }, ['0', '1', '2', '3+']), { ok: true, value: { kind: 'binomial', values: [0, 1, 2, 3], trials: 10, openEnded: true } });
  });

  it('fails clearly on labels that are not whole numbers, gaps, or too few trials', () => {
    const cases: [string[], RegExp, number?][] = [
      [['none', 'one', 'two'], /"none" is not one/],
      [['0', '1.5', '2'], /"1\.5" is not one/],
      [['0', '2+', '3'], /only the last category can be open-ended/],
      [['1', '2', '3'], /start at 0; the first label is "1"/],
      [['0', '1', '3'], /after "1" comes "3"/],
      [['0', '1', '2', '3'], /cannot produce 3/, 2],
    ];
    for (const [labels, pattern, trials] of cases) {
      const result = buildFitRequest(trials ? { kind: 'binomial', trials } : { kind: 'poisson' }, labels);
      assert.equal(result.ok, false, labels.join(','));
      if (!result.ok) {
        assert.equal(result.issue.code, 'bad-expected');
        assert.match(result.issue.message, pattern);
      }
    }
  });

  it('passes ratios through after checking the number of parts', () => {
    const spec = { kind: 'ratio' as const, ratio: [1, 2], text: '1:2' };
    assert.deepEqual(buildFitRequest(spec, ['a', 'b']), { ok: true, value: spec });
    assert.equal(buildFitRequest(spec, ['a', 'b', 'c']).ok, false);
  });
});
