import assert from 'node:assert/strict';
import * as fs from 'node:fs';
import * as path from 'node:path';

// The layering in DEVELOPERS.md, checked on the source text so a violation fails the tests
// even where the lint rule is switched off in a file.
const root = path.resolve(__dirname, '..', '..', '..');

function sourceFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(full);
    return entry.name.endsWith('.ts') ? [full] : [];
  });
}

function importsOf(file: string): string[] {
  const text = fs.readFileSync(file, 'utf8');
  const specifiers: string[] = [];
  for (const match of text.matchAll(/(?:^|\n)\s*(?:import|export)[^'"\n]*?from\s+['"]([^'"]+)['"]/g)) specifiers.push(match[1]);
  for (const match of text.matchAll(/\b(?:require|import)\(\s*['"]([^'"]+)['"]\s*\)/g)) specifiers.push(match[1]);
  return specifiers;
}

const NODE_BUILTINS = new Set(['fs', 'path', 'os', 'child_process', 'worker_threads', 'crypto', 'stream', 'util', 'http', 'https', 'net']);

describe('layers', () => {
  it('keeps src/core free of the editor, the DOM, Node built-ins and the outer layers', () => {
    const offenders: string[] = [];
    for (const file of sourceFiles(path.join(root, 'src', 'core'))) {
      for (const specifier of importsOf(file)) {
        const outer = /(^|\/)(extension|webview|cli)(\/|$)/.test(specifier) && specifier.startsWith('.');
        if (specifier === 'vscode' || specifier.startsWith('node:') || NODE_BUILTINS.has(specifier) || outer) {
          offenders.push(`${path.relative(root, file)} imports ${specifier}`);
        }
      }
      const text = fs.readFileSync(file, 'utf8');
      if (/\b(document|window)\.\w/.test(text.replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, ''))) offenders.push(`${path.relative(root, file)} touches the DOM`);
    }
    assert.deepEqual(offenders, []);
  });

  it('keeps src/node (the Monte Carlo pool) free of the editor and the outer layers; Node modules are allowed', () => {
    const offenders: string[] = [];
    for (const file of sourceFiles(path.join(root, 'src', 'node'))) {
      for (const specifier of importsOf(file)) {
        const outer = /(^|\/)(extension|webview|cli)(\/|$)/.test(specifier) && specifier.startsWith('.');
        if (specifier === 'vscode' || outer) offenders.push(`${path.relative(root, file)} imports ${specifier}`);
      }
    }
    assert.deepEqual(offenders, []);
  });

  it('keeps the panel away from the engine and Node: it only imports the protocol', () => {
    const offenders: string[] = [];
    for (const file of sourceFiles(path.join(root, 'src', 'webview'))) {
      for (const specifier of importsOf(file)) {
        if (!specifier.startsWith('.') || /(^|\/)(core|extension|cli)(\/|$)/.test(specifier)) offenders.push(`${path.relative(root, file)} imports ${specifier}`);
      }
    }
    assert.deepEqual(offenders, []);
  });
});
