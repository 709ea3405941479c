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

await Promise.all([
  esbuild.build({
    ...common,
    entryPoints: ['src/extension/extension.ts'],
    outfile: 'dist/extension.js',
    platform: 'node',
    format: 'cjs',
    target: 'node20',
    external: ['vscode'],
  }),
  esbuild.build({
    ...common,
    entryPoints: ['src/extension/engine.ts'],
    outfile: 'dist/engine.js',
    platform: 'node',
    format: 'cjs',
    target: 'node20',
    external: ['vscode'],
  }),
  esbuild.build({
    ...common,
    entryPoints: ['src/extension/analysisWorker.ts'],
    outfile: 'dist/analysisWorker.js',
    platform: 'node',
    format: 'cjs',
    target: 'node20',
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
    ...common,
    entryPoints: ['src/cli/main.ts'],
    outfile: 'dist/cli.js',
    platform: 'node',
    format: 'cjs',
    target: 'node20',
    banner: { js: '#!/usr/bin/env node' },
  }),
]);
