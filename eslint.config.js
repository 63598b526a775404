// npm run lint (part of npm test). The import rules between the tiers are the ones DEVELOPERS.md states:
// web → shared, server → shared, worker → server/shared, seed → server/shared, and shared imports nothing else
// (the local fakes may read the server's settings; tests, scripts and benchmarks may import anything).
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import jsxA11y from 'eslint-plugin-jsx-a11y';
import pluginQuery from '@tanstack/eslint-plugin-query';
import boundaries from 'eslint-plugin-boundaries';
import globals from 'globals';

const tiers = [
  { type: 'web', pattern: 'web/**', partialMatch: false },
  { type: 'server', pattern: 'server/**', partialMatch: false },
  { type: 'worker', pattern: 'worker/**', partialMatch: false },
  { type: 'shared', pattern: 'shared/**', partialMatch: false },
  { type: 'seed', pattern: 'seed/**', partialMatch: false },
  { type: 'fakes', pattern: 'fakes/**', partialMatch: false },
  { type: 'tooling', pattern: '{tests,scripts,bench}/**', partialMatch: false },
];
const may = (from, to) => ({ from: { element: { type: from } }, allow: { to: { element: { types: { anyOf: to } } } } });

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.data/**', '.tmp/**', 'reports/**', 'artifacts/**', '.stryker-tmp/**', 'coverage/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node }, ecmaVersion: 2023, sourceType: 'module' },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
    },
  },
  {
    files: ['web/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks, 'jsx-a11y': jsxA11y, '@tanstack/query': pluginQuery },
    rules: {
      ...reactHooks.configs.recommended.rules,
      ...jsxA11y.flatConfigs.recommended.rules,
      ...pluginQuery.configs['flat/recommended'].map((c) => c.rules).reduce((a, b) => ({ ...a, ...b }), {}),
    },
  },
  {
    // Numbers people read go through numberInWords (DEVELOPERS.md, "Numbers"): toLocaleString loads the browser's
    // number-format data on a page's first paint. The server's printed plan may use either.
    files: ['{web,shared}/**/*.{ts,tsx}'],
    ignores: ['shared/format/number-words.ts'],
    rules: {
      'no-restricted-syntax': ['error', {
        selector: "CallExpression[callee.property.name='toLocaleString']",
        message: 'Write numbers with numberInWords (shared/format/number-words.ts).',
      }],
    },
  },
  {
    files: ['{web,server,worker,shared,seed,fakes,tests,scripts,bench}/**/*.{ts,tsx}'],
    plugins: { boundaries },
    settings: {
      'boundaries/elements': tiers,
      // @shared/* (tsconfig.json paths) and relative imports both resolve to the tier they point at.
      'import/resolver': { typescript: { project: './tsconfig.json' }, node: { extensions: ['.ts', '.tsx', '.js', '.mjs'] } },
    },
    rules: {
      'boundaries/dependencies': ['error', {
        default: 'disallow',
        policies: [
          may('web', ['web', 'shared']),
          may('server', ['server', 'shared']),
          may('worker', ['worker', 'server', 'shared']),
          may('shared', ['shared']),
          may('seed', ['seed', 'server', 'shared']),
          may('fakes', ['fakes', 'server', 'shared']),
          may('tooling', ['tooling', 'web', 'server', 'worker', 'shared', 'seed', 'fakes']),
        ],
      }],
    },
  },
);
