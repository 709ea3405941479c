import js from '@eslint/js';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['out/**', 'dist/**', 'node_modules/**', '**/*.js', '**/*.mjs'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'no-restricted-syntax': ['error', {
        selector: "MemberExpression[object.name='Math'][property.name='random']",
        message: 'Statistics use a seeded generator; never Math.random().',
      }],
    },
  },
  {
    // The core is pure: no editor, no DOM, no file system (see DEVELOPERS.md).
    files: ['src/core/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['vscode', 'fs', 'node:*', 'path', 'os', 'child_process', 'worker_threads'], message: 'src/core must stay pure TypeScript.' },
          { group: ['**/extension/**', '**/webview/**', '**/cli/**'], message: 'src/core imports nothing from the outer layers.' },
        ],
      }],
    },
  },
  {
    // Node hosts shared by the extension's worker and the CLI: Node modules yes, the editor no.
    files: ['src/node/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['vscode'], message: 'src/node runs in the CLI too: no editor API.' },
          { group: ['**/extension/**', '**/webview/**', '**/cli/**'], message: 'src/node imports only the core and Node.' },
        ],
      }],
    },
  },
);
