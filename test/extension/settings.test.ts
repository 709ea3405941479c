import assert from 'node:assert/strict';
import { resolveOptions } from '../../src/core/options';
import { markupFor, readSettings, SETTING } from '../../src/extension/settings';

const from = (values: Record<string, unknown>) => (key: string) => values[key];

describe('settings', () => {
  it('maps every setting to its engine option', () => {
    const settings = readSettings(from({
      [SETTING.significanceLevel]: 0.01,
      [SETTING.confidenceLevel]: 0.9,
      [SETTING.decimalPlaces]: 3,
      [SETTING.continuityCorrection]: 'yates',
      [SETTING.pValueMethod]: 'monte-carlo',
      [SETTING.replicates]: 9999,
      [SETTING.seed]: 42,
      [SETTING.exactTimeLimit]: 2.5,
      [SETTING.writeUpStyle]: 'oneLine',
      [SETTING.codeLensEnabled]: false,
    }));
    assert.deepEqual(settings.problems, []);
    assert.deepEqual(settings.options, {
      alpha: 0.01, confidenceLevel: 0.9, decimals: 3, continuity: 'yates', pValueMethod: 'monte-carlo',
      replicates: 9999, seed: 42, exactTimeMs: 2500, style: 'line',
    });
    assert.equal(settings.codeLensEnabled, false);
  });

  it('leaves unset settings to the engine defaults and shows the CodeLens', () => {
    const settings = readSettings(from({}));
    assert.deepEqual(settings.options, {});
    assert.equal(settings.codeLensEnabled, true);
    assert.deepEqual(settings.problems, []);
  });

  it('drops unusable values with one problem each, naming the setting', () => {
    const settings = readSettings(from({
      [SETTING.significanceLevel]: 5,
      [SETTING.decimalPlaces]: 2.5,
      [SETTING.continuityCorrection]: 'always',
      [SETTING.pValueMethod]: 'fast',
      [SETTING.replicates]: -1,
      [SETTING.seed]: 'abc',
      [SETTING.exactTimeLimit]: 0,
      [SETTING.writeUpStyle]: 'essay',
      [SETTING.codeLensEnabled]: 'yes',
    }));
    assert.deepEqual(settings.options, {});
    assert.equal(settings.problems.length, 9);
    assert.match(settings.problems[0], /tallywise\.significanceLevel is 5; it must be a number above 0 and at most 0\.5/);
    assert.equal(settings.codeLensEnabled, true);
  });

  it('accepts only values the engine also accepts', () => {
    const edges = [
      { [SETTING.significanceLevel]: 0.5, [SETTING.decimalPlaces]: 6, [SETTING.replicates]: 10_000_000, [SETTING.exactTimeLimit]: 600 },
      { [SETTING.significanceLevel]: 1e-6, [SETTING.decimalPlaces]: 0, [SETTING.replicates]: 0, [SETTING.confidenceLevel]: 0.999 },
    ];
    for (const values of edges) {
      const settings = readSettings(from(values));
      assert.deepEqual(settings.problems, []);
      assert.equal(resolveOptions(settings.options).ok, true, JSON.stringify(values));
    }
  });

  it('writes Markdown only in Markdown files', () => {
    assert.equal(markupFor('markdown'), 'markdown');
    assert.equal(markupFor('text'), 'plain');
    assert.equal(markupFor('delimited'), 'plain');
  });
});
