import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import importPlugin from 'eslint-plugin-import';
import reactHooks from 'eslint-plugin-react-hooks';

import { existsSync, readdirSync } from 'node:fs';

// One-way imports: shared -> (src | server); src and server never import each other; features stay apart.
// Every folder under <root>/features is a feature, so a new one is covered without editing this file.
const featureZones = (root) =>
  (existsSync(`./${root}/features`) ? readdirSync(`./${root}/features`, { withFileTypes: true }) : [])
    .filter((entry) => entry.isDirectory())
    .map(({ name }) => ({
      target: `./${root}/features/${name}`,
      from: `./${root}/features`,
      except: [`./${name}`],
      message: 'A feature does not reach into another feature; compose them in routes instead.',
    }));

// An import that climbs more than two folders names its layer instead: @/ (src), @server/, @shared/, @tests/.
const climbing = {
  group: ['../../../*', '../../../../*', '../../../../../*'],
  message: 'Import through the layer alias (@/, @server/, @shared/, @tests/) instead of climbing folders.',
};

export default tseslint.config(
  { ignores: ['dist', 'node_modules', '.data', '.tmp', 'coverage'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    plugins: { import: importPlugin, 'react-hooks': reactHooks },
    settings: {
      'import/resolver': { typescript: { project: './tsconfig.json' }, node: true },
      'import/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx'] },
    },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-namespace': 'off',
      'import/no-cycle': ['error', { maxDepth: 10 }],
      'import/no-restricted-paths': [
        'error',
        {
          zones: [
            {
              target: './shared',
              from: './src',
              message: 'shared/ is used by client and server; it imports neither.',
            },
            {
              target: './shared',
              from: './server',
              message: 'shared/ is used by client and server; it imports neither.',
            },
            { target: './src', from: './server', message: 'The client never imports server code.' },
            { target: './server', from: './src', message: 'The server never imports client code.' },
            ...featureZones('src'),
            ...featureZones('server'),
          ],
        },
      ],
      'no-restricted-imports': ['error', { patterns: [climbing] }],
    },
  },
  {
    // shared/ runs in the browser and in Node alike, so it leans on no framework.
    files: ['shared/**'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: ['react', 'react-dom', 'express', 'sequelize'].map((name) => ({
            name,
            message: 'Not in shared/: it is used by the client and the server alike.',
          })),
          patterns: [climbing],
        },
      ],
    },
  },
);
