import assert from 'node:assert/strict';
import { mergedLabel } from '../../../src/core/stats/mergedLabel';

describe('mergedLabel', () => {
  it('joins ordered values into a range and keeps an open top open', () => {
    assert.equal(mergedLabel(['3', '4'], true), '3–4');
    assert.equal(mergedLabel(['4', '5+'], true), '4+');
    assert.equal(mergedLabel(['3', '4', '≥5'], true), '3+');
    assert.equal(mergedLabel(['0-4', '5-9'], true), '0–9');
    assert.equal(mergedLabel(['low', 'middle'], true), 'low–middle');
  });

  it('lists unordered labels with plus signs and leaves a single label alone', () => {
    assert.equal(mergedLabel(['Oak', 'Ash', 'Elm'], false), 'Oak + Ash + Elm');
    assert.equal(mergedLabel(['Oak'], false), 'Oak');
  });
});
