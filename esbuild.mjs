// Bundles: the extension host (Node, CommonJS, vscode external) split in two, a small activation
// bundle and the engine chunk it requires lazily when a command runs (src/extension/loadEngine.ts);
// the analysis worker; the panel (browser IIFE); the command line (Node).
// esbuild does not type-check: `npm run typecheck` does.
import * as esbuild from 'esbuild';

const production = process.argv.includes('--production');
const common = {
  bundle: true,
  minify: production,
  sourcemap: !production,
  logLevel: 'warning',
  logOverride: { 'import-is-undefined': 'error' },
};
const nodeBundle = { ...common, platform: 'node', format: 'cjs', target: 'node20' };

await Promise.all([
  esbuild.build({
    ...nodeBundle,
    entryPoints: ['src/extension/extension.ts'],
    outfile: 'dist/extension.js',
    external: ['vscode'],
  }),
  esbuild.build({
    ...nodeBundle,
    entryPoints: ['src/extension/engine.ts'],
    outfile: 'dist/engine.js',
    external: ['vscode'],
  }),
  esbuild.build({
    ...nodeBundle,
    entryPoints: ['src/extension/analysisWorker.ts'],
    outfile: 'dist/analysisWorker.js',
  }),
  // The Monte Carlo pool's threads, started by the analysis worker and by the CLI (src/node/).
  esbuild.build({
    ...nodeBundle,
    entryPoints: ['src/node/monteCarloPoolWorker.ts'],
    outfile: 'dist/monteCarloPoolWorker.js',
  }),
  esbuild.build({
    ...common,
    entryPoints: ['src/webview/main.ts'],
    outfile: 'dist/webview.js',
    platform: 'browser',
    format: 'iife',
    target: 'es2022',
  }),
  esbuild.build({
    ...nodeBundle,
    entryPoints: ['src/cli/main.ts'],
    outfile: 'dist/cli.js',
    banner: { js: '#!/usr/bin/env node' },
  }),
]);
