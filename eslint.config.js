import js from '@eslint/js';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['dist', 'node_modules', '.data', 'coverage'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: {
      ecmaVersion: 2023,
      globals: { ...globals.browser, ...globals.node },
    },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'error',
      'max-lines': ['error', { max: 400, skipBlankLines: true, skipComments: true }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
  {
    // The engine is pure numerics: it runs unchanged in workers, the CLI, the server and tests.
    files: ['src/engine/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['react', 'react-*', 'react/*'], message: 'The engine has no UI.' },
            {
              group: ['dexie', 'comlink', 'express', 'knex', 'pg'],
              message: 'The engine does no I/O.',
            },
            { group: ['node:*', 'fs', 'path'], message: 'The engine runs in browsers too.' },
            {
              group: [
                '**/routes/*',
                '**/components/*',
                '**/store/*',
                '**/workers/*',
                '**/api/*',
                '**/sync/*',
                '**/server/*',
              ],
              message: 'The engine imports nothing outside itself.',
            },
          ],
        },
      ],
      'no-restricted-globals': ['error', 'window', 'document', 'localStorage', 'fetch'],
    },
  },
  {
    files: ['tests/**/*.ts'],
    rules: { 'max-lines': 'off' },
  },
);
