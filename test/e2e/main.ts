import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { Host, launchBrowser, MemorySampler, type HostOptions } from './host';
import { ensureHost, type HostInstall } from './install';
import { UI_SCENARIOS, type UiScenario } from './scenarios';
import { Workbench } from './workbench';

// `npm run test:e2e`: installs the headless host once (test/e2e/install.ts), packages the extension as a
// .vsix, then runs each scenario in a fresh code-server (its own workspace, home, user data and extensions)
// driven by Debian's Chromium. Options: TALLYWISE_E2E_ONLY=name,name runs some scenarios;
// TALLYWISE_E2E_SKIP_PACKAGE=1 reuses tallywise.vsix; TALLYWISE_E2E_KEEP=1 keeps the run folder.

const root = path.resolve(__dirname, '..', '..', '..');
const artifacts = path.join(root, 'test-artifacts');
const compiledTests = path.resolve(__dirname, 'integration', 'index.js');
/** The integration suite runs ~12 tests of a few seconds each inside the host. */
const INTEGRATION_MS = 180_000;

const EXAMPLES = ['ski-school-notes.md', 'greenhouse-blooms.md', 'bus-depot-breakdowns.csv', 'bakery-orders.txt'];

const started = Date.now();
const log = (line: string) => console.log(`[e2e ${((Date.now() - started) / 1000).toFixed(1)}s] ${line}`);

interface Outcome {
  name: string;
  ok: boolean;
  durationMs: number;
  detail: string;
  screenshots: string[];
}

function examples(names: string[]): Record<string, string> {
  return Object.fromEntries(names.map((name) => [name, fs.readFileSync(path.join(root, 'examples', name), 'utf8')]));
}

function packageExtension(): string {
  const vsix = path.join(root, 'tallywise.vsix');
  if (process.env.TALLYWISE_E2E_SKIP_PACKAGE && fs.existsSync(vsix)) return vsix;
  log('packaging the extension (npm run package)…');
  const result = spawnSync('npm', ['run', 'package', '--silent'], { cwd: root, stdio: ['ignore', 'pipe', 'inherit'], encoding: 'utf8' });
  if (result.status !== 0) throw new Error(`npm run package failed:\n${result.stdout}`);
  return vsix;
}

async function withHost<T>(
  install: HostInstall, runRoot: string, name: string, host: Omit<HostOptions, 'install' | 'runDir'>,
  body: (host: Host, page: Page, screenshots: string[]) => Promise<T>,
): Promise<{ value?: T; error?: Error; screenshots: string[] }> {
  const runDir = path.join(runRoot, name);
  const server = new Host({ ...host, install, runDir });
  let context: BrowserContext | undefined;
  let page: Page | undefined;
  const screenshots: string[] = [];
  try {
    await server.start();
    ({ context, page } = await launchBrowser(install.chromium, runDir));
    page.setDefaultTimeout(30_000);
    page.on('pageerror', (error) => fs.appendFileSync(path.join(runDir, 'page-errors.log'), `${error.message}\n`));
    return { value: await body(server, page, screenshots), screenshots };
  } catch (error) {
    const failureShot = `e2e-${name}-failure.png`;
    if (page) {
      await page.screenshot({ path: path.join(artifacts, failureShot) }).then(() => screenshots.push(failureShot), () => undefined);
    }
    server.saveLogs(path.join(artifacts, `e2e-${name}-logs`));
    if (fs.existsSync(path.join(runDir, 'page-errors.log'))) fs.copyFileSync(path.join(runDir, 'page-errors.log'), path.join(artifacts, `e2e-${name}-logs`, 'page-errors.log'));
    return { error: error as Error, screenshots };
  } finally {
    if (context) await context.close().catch(() => undefined);
    await server.stop();
  }
}

async function runUi(install: HostInstall, runRoot: string, vsix: string, scenario: UiScenario): Promise<Outcome> {
  const start = Date.now();
  const result = await withHost(install, runRoot, scenario.name, { vsix, files: examples(scenario.files) }, async (host, page, screenshots) => {
    await page.goto(`${host.base}/?folder=${encodeURIComponent(host.workspace)}`);
    const workbench = new Workbench(page);
    await workbench.ready(scenario.files[0]);
    await scenario.run({
      page, workbench, workspace: host.workspace,
      screenshot: async (name) => {
        await workbench.progressGone();
        const file = `e2e-${name}.png`;
        await page.screenshot({ path: path.join(artifacts, file) });
        screenshots.push(file);
        return file;
      },
    });
  });
  return { name: scenario.name, ok: !result.error, durationMs: Date.now() - start, detail: result.error ? String(result.error.stack ?? result.error) : '', screenshots: result.screenshots };
}

interface IntegrationReport {
  failures: number;
  outcomes: { title: string; state: string; durationMs: number; error?: string }[];
}

/** Runs the mocha suite inside the real extension host (extensionTestsPath), with the installed .vsix as the extension. */
async function runIntegration(install: HostInstall, runRoot: string, vsix: string, name: string, untrusted: boolean): Promise<Outcome> {
  const start = Date.now();
  const resultFile = path.join(runRoot, `${name}-result.json`);
  const result = await withHost(install, runRoot, name, {
    vsix, files: examples(EXAMPLES), trust: untrusted, smokeTestDriver: true,
    env: { TALLYWISE_E2E_SUITE: untrusted ? 'untrusted' : 'trusted', TALLYWISE_E2E_RESULT: resultFile },
  }, async (host, page, screenshots) => {
    let finish: (code: number) => void = () => undefined;
    const exited = new Promise<number>((resolve) => { finish = resolve; });
    const hostLog: string[] = [];
    await page.exposeFunction('codeAutomationLog', (_type: string, args: unknown[]) => hostLog.push((args ?? []).map(String).join(' ')));
    await page.exposeFunction('codeAutomationExit', (code: number) => finish(code));
    const remote = (file: string) => `vscode-remote://127.0.0.1:${host.port}${file}`;
    const payload = [['extensionDevelopmentPath', remote(host.installedExtension())], ['extensionTestsPath', remote(compiledTests)]];
    await page.goto(`${host.base}/?folder=${encodeURIComponent(host.workspace)}&payload=${encodeURIComponent(JSON.stringify(payload))}`);
    let timer: NodeJS.Timeout | undefined;
    const code = await Promise.race([exited, new Promise<'timeout'>((resolve) => { timer = setTimeout(() => resolve('timeout'), INTEGRATION_MS); })]);
    clearTimeout(timer);
    fs.writeFileSync(path.join(runRoot, `${name}-host.log`), hostLog.join('\n'));
    const shot = `e2e-${name}.png`;
    await page.screenshot({ path: path.join(artifacts, shot) });
    screenshots.push(shot);
    const report: IntegrationReport | undefined = fs.existsSync(resultFile) ? JSON.parse(fs.readFileSync(resultFile, 'utf8')) as IntegrationReport : undefined;
    const lines = (report?.outcomes ?? []).map((test) => `    ${test.state === 'passed' ? '✓' : test.state === 'failed' ? '✗' : '-'} ${test.title} (${test.durationMs} ms)${test.error ? `\n      ${test.error.split('\n').slice(0, 6).join('\n      ')}` : ''}`);
    if (code === 'timeout') throw new Error(`timed out after ${INTEGRATION_MS} ms waiting for the extension tests to exit\n${lines.join('\n')}\n${hostLog.slice(-30).join('\n')}`);
    if (code !== 0 || !report || report.failures > 0 || report.outcomes.length === 0) {
      throw new Error(`extension tests exited with ${code}\n${lines.join('\n')}\n${report ? '' : hostLog.slice(-40).join('\n')}`);
    }
    return lines.join('\n');
  });
  return { name, ok: !result.error, durationMs: Date.now() - start, detail: result.error ? String(result.error.message) : String(result.value ?? ''), screenshots: result.screenshots };
}

async function main(): Promise<number> {
  fs.mkdirSync(artifacts, { recursive: true });
  const install = ensureHost(log);
  log(`host ready: ${install.codeServer}`);
  const vsix = packageExtension();
  const runRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'tallywise-e2e-'));
  const only = process.env.TALLYWISE_E2E_ONLY?.split(',').map((name) => name.trim()).filter(Boolean);
  const wanted = (name: string) => !only || only.includes(name);
  const sampler = new MemorySampler();
  sampler.start();
  const outcomes: Outcome[] = [];
  const suiteStart = Date.now();
  try {
    const runs: { name: string; run: () => Promise<Outcome> }[] = [
      { name: 'integration', run: () => runIntegration(install, runRoot, vsix, 'integration', false) },
      { name: 'integration-untrusted', run: () => runIntegration(install, runRoot, vsix, 'integration-untrusted', true) },
      ...UI_SCENARIOS.map((scenario) => ({ name: scenario.name, run: () => runUi(install, runRoot, vsix, scenario) })),
    ];
    for (const entry of runs.filter((candidate) => wanted(candidate.name))) {
      log(`scenario ${entry.name}…`);
      const outcome = await entry.run();
      outcomes.push(outcome);
      log(`${outcome.ok ? 'PASS' : 'FAIL'} ${entry.name} (${(outcome.durationMs / 1000).toFixed(1)} s)${outcome.detail ? `\n${outcome.detail}` : ''}`);
    }
  } finally {
    sampler.stop();
    if (!process.env.TALLYWISE_E2E_KEEP) fs.rmSync(runRoot, { recursive: true, force: true });
  }
  const passed = outcomes.filter((outcome) => outcome.ok).length;
  console.log('\nEnd-to-end scenarios:');
  for (const outcome of outcomes) {
    console.log(`  ${outcome.ok ? 'PASS' : 'FAIL'}  ${outcome.name.padEnd(24)} ${(outcome.durationMs / 1000).toFixed(1).padStart(6)} s  ${outcome.screenshots.join(', ')}`);
  }
  console.log(`  total ${((Date.now() - suiteStart) / 1000).toFixed(1)} s; peak memory of the processes started (sum of RSS, sampled every 0.5 s): ${(sampler.peakBytes / 2 ** 20).toFixed(0)} MiB`);
  console.log(`tests: ${passed} passed, ${outcomes.length - passed} failed, 0 skipped`);
  return passed === outcomes.length && outcomes.length > 0 ? 0 : 1;
}

main().then((code) => process.exit(code), (error: unknown) => {
  console.error('e2e run failed:', error);
  process.exit(1);
});
