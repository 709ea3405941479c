import assert from 'node:assert/strict';
import { readSettings, SETTING } from '../../src/extension/settings';
import { AUTOMATIC_THREAD_CAP, MAX_MONTE_CARLO_THREADS, monteCarloThreadCount } from '../../src/node/monteCarloThreadCount';

describe('monteCarloThreadCount', () => {
  it('uses the available cores, at most four, when the count is automatic', () => {
    assert.equal(monteCarloThreadCount(undefined, 2), 2);
    assert.equal(monteCarloThreadCount(0, 16), AUTOMATIC_THREAD_CAP);
    assert.equal(monteCarloThreadCount(0, 1), 1);
    assert.ok(monteCarloThreadCount(undefined) >= 1);
  });

  it('takes a requested count as it is, up to the maximum', () => {
    assert.equal(monteCarloThreadCount(3, 2), 3);
    assert.equal(monteCarloThreadCount(1, 8), 1);
    assert.equal(monteCarloThreadCount(1000, 8), MAX_MONTE_CARLO_THREADS);
  });

  it('reads tallywise.monteCarloThreads from the settings, 0 (automatic) by default', () => {
    assert.equal(readSettings(() => undefined).monteCarloThreads, 0);
    assert.equal(readSettings((key) => (key === SETTING.monteCarloThreads ? 3 : undefined)).monteCarloThreads, 3);
    const bad = readSettings((key) => (key === SETTING.monteCarloThreads ? -2 : undefined));
    assert.equal(bad.monteCarloThreads, 0);
    assert.match(bad.problems[0], /tallywise\.monteCarloThreads is -2; it must be a whole number from 0 \(automatic\) to 64/);
  });
});
