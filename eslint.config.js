import js from '@eslint/js';
import globals from 'globals';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import importX from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

// The engine's layers, lowest first: a layer imports only the layers before it (fit, paths and
// book stand side by side, above analytic and below replay).
const ENGINE_LAYERS = {
  core: [],
  analytic: ['core'],
  fit: ['core', 'analytic'],
  paths: ['core', 'analytic'],
  book: ['core', 'analytic'],
  replay: ['core', 'analytic', 'fit', 'paths', 'book'],
};
const engineZones = Object.entries(ENGINE_LAYERS).map(([layer, below]) => ({
  target: `./src/engine/${layer}`,
  from: './src/engine',
  except: [`./${layer}`, ...below.map((b) => `./${b}`)],
  message: `The engine's ${layer} layer imports only ${['itself', ...below].join(', ')}.`,
}));

// Features never import each other; pages compose them in src/routes.
const FEATURES = ['sketch', 'book', 'fit', 'paths', 'replay', 'library', 'desk', 'account'];
const featureZones = FEATURES.map((f) => ({
  target: `./src/features/${f}`,
  from: './src/features',
  except: [`./${f}`],
  message:
    'A feature does not import another feature; share through src/components or a layer below.',
}));
const SHARED = ['components', 'store', 'api', 'sync', 'workers', 'engine'];
const sharedZones = [
  {
    target: SHARED.map((d) => `./src/${d}`),
    from: ['./src/features', './src/routes'],
    message: 'Shared code does not import features or routes.',
  },
  {
    target: './src/features',
    from: './src/routes',
    message: 'Features do not import routes; the route table imports pages.',
  },
];

export default tseslint.config(
  { ignores: ['dist', 'node_modules', '.data', 'coverage'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    plugins: { 'import-x': importX },
    settings: {
      // the imported modules are parsed too (for cycles), with the TypeScript parser
      'import-x/extensions': ['.ts', '.tsx', '.js', '.mjs'],
      'import-x/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx'] },
      'import-x/resolver-next': [
        createTypeScriptImportResolver({
          project: ['tsconfig.json', 'tsconfig.node.json', 'tsconfig.test.json'],
          noWarnOnMultipleProjects: true,
        }),
      ],
    },
    rules: {
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'import-x/no-duplicates': ['error', { 'prefer-inline': true }],
      'import-x/no-restricted-paths': [
        'error',
        { zones: [...engineZones, ...featureZones, ...sharedZones] },
      ],
    },
  },
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
    // components reach workers and the service through hooks (features/<f>/hooks, api/session)
    files: ['src/features/*/components/**/*.tsx', 'src/components/**/*.tsx'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['**/workers/*', '**/api/client', '**/api/desks', '**/store/scenarios'],
              allowTypeImports: true,
              message: 'Components reach workers, the service and the store through hooks.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['tests/**/*.ts'],
    rules: { 'max-lines': 'off' },
  },
);
