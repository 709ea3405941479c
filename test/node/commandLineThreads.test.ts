import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import * as path from 'node:path';
import { analyze } from '../../src/core/analyze';

// Runs the bundled CLI (dist/cli.js, which starts dist/monteCarloPoolWorker.js), built by `npm test` before mocha.
const root = path.resolve(__dirname, '..', '..', '..');
const cli = path.join(root, 'dist', 'cli.js');

/** An invented 6×6 count table (depots × delay causes), sparse enough to be simulated when asked. */
const TABLE = [
  '| Depot | Tyres | Brakes | Doors | Heating | Signals | Other |',
  '|---|---|---|---|---|---|---|',
  '| Harbour | 4 | 0 | 2 | 7 | 1 | 3 |',
  '| Mill Lane | 1 | 5 | 0 | 2 | 6 | 2 |',
  '| Station | 3 | 2 | 8 | 0 | 1 | 4 |',
  '| Quarry | 0 | 6 | 1 | 3 | 2 | 5 |',
  '| Airfield | 5 | 1 | 3 | 1 | 0 | 2 |',
  '| Old Town | 2 | 3 | 0 | 4 | 3 | 1 |',
].join('\n');

describe('command line --threads', function () {
  this.timeout(60_000);

  it('prints the p of the engine run in this thread with 1, 2 and 3 threads', () => {
    const options = ['--p-value', 'monte-carlo', '--replicates', '99999', '--seed', '77', '--json'];
    const here = analyze({ text: TABLE, format: 'text', options: { pValueMethod: 'monte-carlo', replicates: 99_999, seed: 77 } });
    assert.ok(here.ok);
    if (!here.ok) return;
    for (const threads of ['1', '2', '3']) {
      const result = spawnSync(process.execPath, [cli, 'analyze', '-', '--format', 'text', ...options, '--threads', threads], { cwd: root, input: TABLE, encoding: 'utf8' });
      assert.equal(result.status, 0, result.stderr);
      const json = JSON.parse(result.stdout) as { exact: { p: number; replicates: number; seed: number } };
      assert.equal(json.exact.p, here.value.exact?.p, `--threads ${threads}`);
      assert.equal(json.exact.replicates, 99_999);
      assert.equal(json.exact.seed, 77);
    }
  });

  it('refuses a thread count that is not a whole number of at least 1, with exit status 2', () => {
    const result = spawnSync(process.execPath, [cli, 'analyze', '-', '--threads', 'two'], { cwd: root, input: TABLE, encoding: 'utf8' });
    assert.equal(result.status, 2);
    assert.match(result.stderr, /--threads needs a number \(got "two"\)/);
  });
});
