import * as fs from 'node:fs';
import * as path from 'node:path';
import Mocha from 'mocha';

// The extensionTestsPath entry (the @vscode/test-electron contract): VS Code loads this module in the real
// extension host and calls run(); a rejection makes the host report failure. Works the same under
// code-server (test/e2e/main.ts) and @vscode/test-electron (test/e2e/electron.ts).

/** Per-test timeout inside the host: an analysis runs in a worker and can take a second or two. */
const TEST_TIMEOUT_MS = 30_000;

interface TestOutcome {
  title: string;
  state: 'passed' | 'failed' | 'pending';
  durationMs: number;
  error?: string;
}

export async function run(): Promise<void> {
  // TALLYWISE_E2E_SUITE picks the suite file: "trusted" (default) or "untrusted".
  const suite = process.env.TALLYWISE_E2E_SUITE === 'untrusted' ? 'untrusted.suite.js' : 'extension.suite.js';
  const mocha = new Mocha({ ui: 'bdd', timeout: TEST_TIMEOUT_MS, color: false, reporter: 'spec' });
  mocha.addFile(path.join(__dirname, suite));
  await mocha.loadFilesAsync();
  const outcomes: TestOutcome[] = [];
  const failures = await new Promise<number>((resolve) => {
    const runner = mocha.run(resolve);
    runner.on('pass', (test) => outcomes.push({ title: test.fullTitle(), state: 'passed', durationMs: test.duration ?? 0 }));
    runner.on('pending', (test) => outcomes.push({ title: test.fullTitle(), state: 'pending', durationMs: 0 }));
    runner.on('fail', (test, error: Error) => outcomes.push({ title: test.fullTitle(), state: 'failed', durationMs: test.duration ?? 0, error: error.stack ?? String(error) }));
  });
  const resultFile = process.env.TALLYWISE_E2E_RESULT;
  if (resultFile) fs.writeFileSync(resultFile, JSON.stringify({ failures, outcomes }, null, 2));
  if (failures > 0) throw new Error(`${failures} integration test(s) failed`);
}
