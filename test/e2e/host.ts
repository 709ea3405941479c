import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import * as fs from 'node:fs';
import * as http from 'node:http';
import * as net from 'node:net';
import * as path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import type { HostInstall } from './install';

/** Polling step of every wait, and the grace period between SIGTERM and SIGKILL. */
const POLL_MS = 100;
const STOP_GRACE_MS = 5_000;
export const HEALTH_TIMEOUT_MS = 60_000;

/** Waits until a condition holds; the error names what was awaited. */
export async function waitUntil(condition: () => boolean | Promise<boolean>, what: string, timeoutMs: number): Promise<void> {
  const stopAt = Date.now() + timeoutMs;
  for (;;) {
    if (await condition()) return;
    if (Date.now() > stopAt) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, POLL_MS));
  }
}

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address() as net.AddressInfo;
      server.close(() => resolve(address.port));
    });
  });
}

function httpOk(url: string): Promise<boolean> {
  return new Promise((resolve) => {
    const request = http.get(url, (response) => {
      response.resume();
      resolve(response.statusCode === 200);
    });
    request.on('error', () => resolve(false));
    request.setTimeout(2_000, () => {
      request.destroy();
      resolve(false);
    });
  });
}

/** User settings that keep the workbench quiet; `trust` turns workspace trust on (the folder then starts untrusted). */
function userSettings(trust: boolean): Record<string, unknown> {
  return {
    'workbench.startupEditor': 'none',
    'workbench.tips.enabled': false,
    'workbench.secondarySideBar.defaultVisibility': 'hidden',
    'chat.disableAIFeatures': true,
    'security.workspace.trust.enabled': trust,
    'security.workspace.trust.startupPrompt': 'never',
    'security.workspace.trust.banner': 'never',
    'telemetry.telemetryLevel': 'off',
    'update.mode': 'none',
    'extensions.autoUpdate': false,
    'extensions.autoCheckUpdates': false,
    'extensions.ignoreRecommendations': true,
    'files.autoSave': 'off',
    'window.restoreWindows': 'none',
    'workbench.editor.enablePreview': false,
    'git.enabled': false,
  };
}

export interface HostOptions {
  install: HostInstall;
  /** Folder of this scenario; everything (workspace, home, user data, extensions, logs) lives under it. */
  runDir: string;
  vsix: string;
  /** Files to place in the workspace: name → content. */
  files: Record<string, string>;
  trust?: boolean;
  /** Lets the workbench honour a URL payload (extensionDevelopmentPath / extensionTestsPath). */
  smokeTestDriver?: boolean;
  /** Extra environment for the server (and so the extension host). */
  env?: Record<string, string>;
}

/** One code-server with its own folders, started detached so its whole process group can be stopped. */
export class Host {
  readonly workspace: string;
  readonly home: string;
  readonly userData: string;
  readonly extensions: string;
  readonly logFile: string;
  port = 0;
  private server: ChildProcess | undefined;

  constructor(private readonly options: HostOptions) {
    const { runDir } = options;
    this.workspace = path.join(runDir, 'workspace');
    this.home = path.join(runDir, 'home');
    this.userData = path.join(runDir, 'user-data');
    this.extensions = path.join(runDir, 'extensions');
    this.logFile = path.join(runDir, 'code-server.log');
  }

  get base(): string {
    return `http://127.0.0.1:${this.port}`;
  }

  get pid(): number | undefined {
    return this.server?.pid;
  }

  private env(): NodeJS.ProcessEnv {
    return {
      ...process.env,
      HOME: this.home,
      TMPDIR: path.join(this.options.runDir, 'tmp'),
      XDG_CONFIG_HOME: path.join(this.home, '.config'),
      XDG_DATA_HOME: path.join(this.home, '.local', 'share'),
      XDG_CACHE_HOME: path.join(this.home, '.cache'),
      EXTENSIONS_GALLERY: '{}',
      ...this.options.env,
    };
  }

  private commonArgs(): string[] {
    return ['--config', path.join(this.options.runDir, 'config.yaml'), '--user-data-dir', this.userData, '--extensions-dir', this.extensions];
  }

  /** Folder of the installed extension (the unpacked .vsix). */
  installedExtension(): string {
    const folder = fs.readdirSync(this.extensions).find((name) => name.startsWith('tallywise.tallywise-'));
    if (!folder) throw new Error(`the .vsix was not unpacked into ${this.extensions}`);
    return path.join(this.extensions, folder);
  }

  async start(): Promise<void> {
    const { runDir, install } = this.options;
    for (const folder of [this.workspace, this.home, path.join(this.userData, 'User'), this.extensions, path.join(runDir, 'tmp')]) {
      fs.mkdirSync(folder, { recursive: true });
    }
    for (const [name, content] of Object.entries(this.options.files)) fs.writeFileSync(path.join(this.workspace, name), content);
    fs.writeFileSync(path.join(this.userData, 'User', 'settings.json'), JSON.stringify(userSettings(this.options.trust === true), null, 2));

    const installed = spawnSync(install.node24, [install.codeServer, ...this.commonArgs(), '--install-extension', this.options.vsix], { env: this.env(), encoding: 'utf8' });
    if (installed.status !== 0) throw new Error(`--install-extension failed: ${installed.stdout}${installed.stderr}`);

    this.port = await freePort();
    const log = fs.openSync(this.logFile, 'w');
    this.server = spawn(install.node24, [
      install.codeServer,
      '--auth', 'none',
      '--bind-addr', `127.0.0.1:${this.port}`,
      '--disable-telemetry', '--disable-update-check', '--disable-getting-started-override',
      ...(this.options.trust ? [] : ['--disable-workspace-trust']),
      ...(this.options.smokeTestDriver ? ['--vscode-option', 'enable-smoke-test-driver'] : []),
      ...this.commonArgs(),
      this.workspace,
    ], { env: this.env(), stdio: ['ignore', log, log], detached: true });
    fs.closeSync(log);
    await waitUntil(() => httpOk(`${this.base}/healthz`), 'code-server to answer /healthz', HEALTH_TIMEOUT_MS);
  }

  /** Stops code-server and everything it started (its process group): SIGTERM, then SIGKILL after 5 s. */
  async stop(): Promise<void> {
    const pid = this.server?.pid;
    if (!pid) return;
    const alive = () => {
      try {
        process.kill(-pid, 0);
        return true;
      } catch {
        return false;
      }
    };
    try { process.kill(-pid, 'SIGTERM'); } catch { /* already gone */ }
    const stopAt = Date.now() + STOP_GRACE_MS;
    while (alive() && Date.now() < stopAt) await new Promise((resolve) => setTimeout(resolve, POLL_MS));
    if (alive()) {
      try { process.kill(-pid, 'SIGKILL'); } catch { /* already gone */ }
    }
    this.server = undefined;
  }

  /** Copies the server log and the workbench/extension-host logs into a folder (for a failed scenario). */
  saveLogs(target: string): void {
    fs.mkdirSync(target, { recursive: true });
    if (fs.existsSync(this.logFile)) fs.copyFileSync(this.logFile, path.join(target, 'code-server.log'));
    const walk = (folder: string) => {
      if (!fs.existsSync(folder)) return;
      for (const entry of fs.readdirSync(folder, { withFileTypes: true })) {
        const full = path.join(folder, entry.name);
        if (entry.isDirectory()) walk(full);
        else if (entry.name.endsWith('.log')) fs.copyFileSync(full, path.join(target, path.relative(this.userData, full).replace(/[\\/]/g, '_')));
      }
    };
    walk(path.join(this.userData, 'logs'));
  }
}

/** Debian's Chromium with a fresh profile under the run folder (never a downloaded browser). */
export async function launchBrowser(chromiumPath: string, runDir: string): Promise<{ context: BrowserContext; page: Page }> {
  const home = path.join(runDir, 'home');
  const context = await chromium.launchPersistentContext(path.join(runDir, 'chrome-profile'), {
    executablePath: chromiumPath,
    headless: true,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    viewport: { width: 1400, height: 900 },
    env: { ...process.env, HOME: home, XDG_CONFIG_HOME: path.join(home, '.config') } as Record<string, string>,
  });
  const page = context.pages()[0] ?? await context.newPage();
  return { context, page };
}

/** Samples the resident memory of every process this one started (its descendants), keeping the peak. */
export class MemorySampler {
  peakBytes = 0;
  private timer: NodeJS.Timeout | undefined;

  start(intervalMs = 500): void {
    this.timer = setInterval(() => {
      this.peakBytes = Math.max(this.peakBytes, descendantsRss(process.pid));
    }, intervalMs);
    this.timer.unref();
  }

  stop(): void {
    if (this.timer) clearInterval(this.timer);
  }
}

function descendantsRss(root: number): number {
  const children = new Map<number, number[]>();
  const rss = new Map<number, number>();
  const pageSize = 4096;
  for (const name of fs.readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const stat = fs.readFileSync(`/proc/${name}/stat`, 'utf8');
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      const pid = Number(name);
      const parent = Number(fields[1]);
      rss.set(pid, Number(fields[21]) * pageSize);
      const list = children.get(parent) ?? [];
      list.push(pid);
      children.set(parent, list);
    } catch {
      // The process ended while we read it.
    }
  }
  let total = 0;
  const stack = [...(children.get(root) ?? [])];
  while (stack.length > 0) {
    const pid = stack.pop()!;
    total += rss.get(pid) ?? 0;
    stack.push(...(children.get(pid) ?? []));
  }
  return total;
}
