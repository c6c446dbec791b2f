import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import importPlugin from 'eslint-plugin-import';
import reactHooks from 'eslint-plugin-react-hooks';
import i18next from 'eslint-plugin-i18next';

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

const dataAccess =
  'Only a feature repository (*.repository.ts) or server/db touches models, the ORM or SQL; call one of those.';

// An import that climbs more than two folders names its layer instead: @/ (src), @server/, @shared/, @tests/.
const climbing = {
  group: ['../../../*', '../../../../*', '../../../../../*'],
  message: 'Import through the layer alias (@/, @server/, @shared/, @tests/) instead of climbing folders.',
};

// Every word a person reads on a screen comes from a message catalogue (shared/i18n/locales), so a second language
// is complete by construction. The rule flags text and attribute strings in JSX; the attributes below carry code,
// not words. Numbers, punctuation and all-capital codes (a tag's short code) pass by the plugin's defaults.
export const codeAttributes = [
  'className',
  'style',
  'type',
  'key',
  'id',
  'width',
  'height',
  'to',
  'href',
  'path',
  'role',
  'data-.*',
  'name',
  'autoComplete',
  'inputMode',
  'variant',
  'tone',
  'size',
  'kind',
  'htmlFor',
  'lang',
  'src',
  'rel',
  'target',
  'method',
  'action',
  'accept',
  'capture',
  'pattern',
  'enterKeyHint',
  'viewBox',
  'd',
  'fill',
  'stroke',
  'xmlns',
  'strokeWidth',
  'strokeLinecap',
  'strokeLinejoin',
  'aria-hidden',
  'aria-live',
  'aria-current',
  'aria-haspopup',
  'form',
  'mode',
  'state',
  'layout',
  'theme',
  'icon',
  'align',
  'as',
  'testId',
  'scope',
  'dateTime',
  'autoCapitalize',
  'spellCheck',
  'loading',
  'decoding',
  'crossOrigin',
  'min',
  'max',
  'step',
  'ns',
  'i18nKey',
];

export const literalStringRule = [
  'error',
  { mode: 'jsx-only', 'jsx-attributes': { exclude: codeAttributes } },
];

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
            {
              target: './server/features',
              from: './server/app.ts',
              message: 'Features never import the app; app.ts composes them.',
            },
            {
              target: './server/db',
              from: './server/features',
              message: 'server/db is below the features; it never imports one.',
            },
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
  {
    // Data access has one home: a feature's repository or server/db. Services, routes, middleware and entries call
    // those; they never import a model, the ORM's runtime or the connector, nor the raw-SQL module. Type imports
    // of the ORM stay allowed so a handle or a transaction can be passed through. The allow-list is empty on purpose.
    files: ['server/**/*.ts'],
    ignores: ['server/db/**', 'server/**/*.repository.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          paths: [
            { name: 'sequelize', allowTypeImports: true, message: dataAccess },
            { name: 'mariadb', allowTypeImports: true, message: dataAccess },
          ],
          patterns: [
            {
              group: ['@server/db/models', '**/db/models', '@server/db/sql', '**/db/sql'],
              message: dataAccess,
            },
          ],
        },
      ],
    },
  },
  {
    // A function that needs more than a screen is doing more than one thing. Migrations are history and stay as written.
    files: ['server/**/*.ts', 'shared/**/*.ts'],
    ignores: ['server/db/migrations/**'],
    rules: {
      'max-lines-per-function': ['error', { max: 80, skipBlankLines: false, skipComments: false }],
    },
  },
  {
    // Express 5 and React Router 7 hand back promises in many places: each is awaited, returned or marked `void` on
    // purpose, never dropped by accident. These two rules need the type checker, hence the project service.
    files: ['**/*.{ts,tsx}'],
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname } },
    rules: {
      '@typescript-eslint/no-floating-promises': 'error',
      '@typescript-eslint/no-misused-promises': 'error',
    },
  },
  {
    files: ['src/**/*.tsx'],
    ignores: ['src/**/*.test.tsx'],
    plugins: { i18next },
    rules: { 'i18next/no-literal-string': literalStringRule },
  },
);
