import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';

// `npm run test:e2e:electron`: the same in-host integration suites (test/e2e/integration) under
// @vscode/test-electron, for machines that can download VS Code. @vscode/test-electron is not a
// dependency of the project (it cannot download VS Code on our build machines); install 2.x
// (3.x needs Node 22): `npm install --no-save @vscode/test-electron@2`.
// Needs `npm run build:prod` first (the script does it): the extension runs from the clone's dist/.

const root = path.resolve(__dirname, '..', '..', '..');
const EXAMPLES = ['ski-school-notes.md', 'greenhouse-blooms.md', 'bus-depot-breakdowns.csv', 'bakery-orders.txt'];

interface TestElectron {
  runTests(options: {
    version?: string;
    extensionDevelopmentPath: string;
    extensionTestsPath: string;
    launchArgs?: string[];
    extensionTestsEnv?: Record<string, string>;
  }): Promise<number>;
}

function loadTestElectron(): TestElectron | undefined {
  try {
    // eslint-disable-next-line @typescript-eslint/no-require-imports -- optional, loaded only when present.
    return require('@vscode/test-electron') as TestElectron;
  } catch {
    return undefined;
  }
}

async function main(): Promise<number> {
  const testElectron = loadTestElectron();
  if (!testElectron) {
    console.error('@vscode/test-electron is not installed. On a machine that can download VS Code run:\n'
      + '  npm install --no-save @vscode/test-electron@2   (2.x: 3.x needs Node 22)\n'
      + 'then `npm run test:e2e:electron` again. Offline, `npm run test:e2e` runs the same suites in code-server.');
    return 2;
  }
  let failed = 0;
  for (const suite of ['trusted', 'untrusted'] as const) {
    const runDir = fs.mkdtempSync(path.join(os.tmpdir(), `tallywise-electron-${suite}-`));
    const workspace = path.join(runDir, 'workspace');
    const userData = path.join(runDir, 'user-data');
    fs.mkdirSync(workspace, { recursive: true });
    fs.mkdirSync(path.join(userData, 'User'), { recursive: true });
    for (const name of EXAMPLES) fs.copyFileSync(path.join(root, 'examples', name), path.join(workspace, name));
    fs.writeFileSync(path.join(userData, 'User', 'settings.json'), JSON.stringify({
      'security.workspace.trust.enabled': suite === 'untrusted',
      'security.workspace.trust.startupPrompt': 'never',
      'workbench.startupEditor': 'none',
      'telemetry.telemetryLevel': 'off',
      'update.mode': 'none',
    }));
    const resultFile = path.join(runDir, 'result.json');
    try {
      await testElectron.runTests({
        version: process.env.TALLYWISE_VSCODE_VERSION ?? 'stable',
        extensionDevelopmentPath: root,
        extensionTestsPath: path.join(__dirname, 'integration', 'index.js'),
        launchArgs: [workspace, '--disable-extensions', '--user-data-dir', userData, ...(suite === 'trusted' ? ['--disable-workspace-trust'] : [])],
        extensionTestsEnv: { TALLYWISE_E2E_SUITE: suite, TALLYWISE_E2E_RESULT: resultFile },
      });
      console.log(`${suite}: passed`);
    } catch (error) {
      failed++;
      console.error(`${suite}: failed (${String(error)})`);
      if (fs.existsSync(resultFile)) console.error(fs.readFileSync(resultFile, 'utf8'));
    } finally {
      fs.rmSync(runDir, { recursive: true, force: true });
    }
  }
  console.log(`tests: ${2 - failed} passed, ${failed} failed, 0 skipped`);
  return failed === 0 ? 0 : 1;
}

main().then((code) => process.exit(code), (error: unknown) => {
  console.error(error);
  process.exit(1);
});
