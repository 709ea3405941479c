/**
 * The extension's figures: bundle sizes (production build, made here in memory with the same settings as
 * `npm run build:prod`), the .vsix size when one is packaged, activation time in a fresh Node process with a
 * stand-in 'vscode' module, and the time from a 10×10 table to the panel's view.
 */
import { execFileSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import * as esbuild from 'esbuild';
import { analyze } from '../src/core/analyze';
import { buildPanelView } from '../src/extension/panelView';
import { medianMs, seededRandom, type Figure } from './timing';

const root = path.resolve(__dirname, '..', '..');
const ACTIVATION_RUNS = 7;

function productionBundle(entry: string, platform: 'node' | 'browser'): Uint8Array {
  const result = esbuild.buildSync({
    entryPoints: [path.join(root, entry)],
    bundle: true,
    minify: true,
    write: false,
    platform,
    format: platform === 'node' ? 'cjs' : 'iife',
    target: platform === 'node' ? 'node20' : 'es2022',
    external: ['vscode'],
    logLevel: 'silent',
  });
  return result.outputFiles[0].contents;
}

/** Milliseconds to require the activation bundle and call activate, median of fresh processes. */
function activationMs(bundleFile: string): number {
  const fake = require.resolve('../test/extension/fakeVscode');
  const script = `
    const { installFakeVscode, fakeExtensionContext } = require(${JSON.stringify(fake)});
    installFakeVscode();
    const start = performance.now();
    require(${JSON.stringify(bundleFile)}).activate(fakeExtensionContext(${JSON.stringify(root)}));
    process.stdout.write(String(performance.now() - start));`;
  const samples = Array.from({ length: ACTIVATION_RUNS }, () => Number(execFileSync(process.execPath, ['-e', script], { encoding: 'utf8' })));
  samples.sort((a, b) => a - b);
  return samples[Math.floor(samples.length / 2)];
}

/** An invented 10×10 tally (bus depot: faults by route and hour band) with every expected count well above 5. */
function tenByTen(): string {
  const random = seededRandom(20261202);
  const header = `| Route | ${Array.from({ length: 10 }, (_, c) => `H${c + 1}`).join(' | ')} |`;
  const rule = `|---|${Array.from({ length: 10 }, () => '---').join('|')}|`;
  const rows = Array.from({ length: 10 }, (_, r) => `| R${r + 1} | ${Array.from({ length: 10 }, () => 20 + Math.floor(random() * 30)).join(' | ')} |`);
  return [header, rule, ...rows].join('\n');
}

export function benchExtension(): Figure[] {
  const directory = fs.mkdtempSync(path.join(os.tmpdir(), 'tallywise-bench-'));
  try {
    const extension = productionBundle('src/extension/extension.ts', 'node');
    const engine = productionBundle('src/extension/engine.ts', 'node');
    const webview = productionBundle('src/webview/main.ts', 'browser');
    const bundleFile = path.join(directory, 'extension.js');
    fs.writeFileSync(bundleFile, extension);
    const figures: Figure[] = [
      { name: 'dist/extension.js, minified (activation bundle)', value: extension.length / 1024, unit: 'KB', target: { value: 300, better: 'lower' } },
      { name: 'dist/engine.js, minified (loaded when a command runs)', value: engine.length / 1024, unit: 'KB' },
      { name: 'dist/webview.js, minified', value: webview.length / 1024, unit: 'KB' },
    ];
    const vsix = path.join(root, 'tallywise.vsix');
    if (fs.existsSync(vsix)) figures.push({ name: 'tallywise.vsix', value: fs.statSync(vsix).size / 1024, unit: 'KB', target: { value: 1024, better: 'lower' } });
    figures.push({ name: `activation: require + activate, fresh process (median of ${ACTIVATION_RUNS})`, value: activationMs(bundleFile), unit: 'ms', target: { value: 30, better: 'lower' } });
    const text = tenByTen();
    figures.push({
      name: '10×10 table → analysis → panel view (part of < 300 ms command to panel)',
      value: medianMs(() => {
        const result = analyze({ text, format: 'markdown' });
        if (!result.ok) throw new Error(result.issue.message);
        return buildPanelView(result.value, 'file:///bench.md#1');
      }),
      unit: 'ms',
      target: { value: 300, better: 'lower' },
    });
    return figures;
  } finally {
    fs.rmSync(directory, { recursive: true, force: true });
  }
}

if (require.main === module) {
  for (const figure of benchExtension()) {
    const target = figure.target ? `  (target ${figure.target.better === 'lower' ? '<' : '≥'} ${figure.target.value} ${figure.unit})` : '';
    console.log(`${figure.name.padEnd(76)} ${figure.value.toFixed(2).padStart(10)} ${figure.unit}${target}`);
  }
}
